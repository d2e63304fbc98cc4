import net from 'node:net';

/**
 * A loopback TCP proxy that can be switched off and on, to play a server going down and coming back, or that can
 * swallow replies, to play a server that did the work while its answer was lost on the way back.
 */
export class SwitchableProxy {
  private server?: net.Server;
  private readonly sockets = new Set<net.Socket>();
  private repliesToHold = 0;
  /** How many connections had their reply swallowed so far. */
  heldReplies = 0;

  constructor(
    readonly port: number,
    private readonly targetPort: number,
  ) {}

  async up(): Promise<void> {
    this.server = net.createServer((client) => {
      const upstream = net.connect(this.targetPort, '127.0.0.1');
      for (const s of [client, upstream]) {
        this.sockets.add(s);
        s.on('close', () => this.sockets.delete(s));
        s.on('error', () => s.destroy());
      }
      client.pipe(upstream);
      if (this.repliesToHold > 0) {
        this.repliesToHold--;
        this.heldReplies++;
        // The request reaches the server in full; what it sends back is read and dropped until the client gives up.
        upstream.resume();
        client.on('close', () => upstream.destroy());
      } else {
        upstream.pipe(client);
      }
    });
    await new Promise<void>((resolve) => this.server!.listen(this.port, '127.0.0.1', resolve));
  }

  /**
   * The next `count` connections reach the server, but its reply never comes back. Count connections, not requests:
   * the client must open one connection per request (an http.Agent without keep-alive).
   */
  holdReplies(count: number): void {
    this.repliesToHold = count;
  }

  async down(): Promise<void> {
    for (const s of this.sockets) s.destroy();
    await new Promise<void>((resolve) => (this.server ? this.server.close(() => resolve()) : resolve()));
    this.server = undefined;
  }
}

export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const { port } = s.address() as net.AddressInfo;
      s.close(() => resolve(port));
    });
  });
}
