import net from 'node:net';

/** A loopback TCP proxy that can be switched off and on, to play a server going down and coming back. */
export class SwitchableProxy {
  private server?: net.Server;
  private readonly sockets = new Set<net.Socket>();

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
      client.pipe(upstream).pipe(client);
    });
    await new Promise<void>((resolve) => this.server!.listen(this.port, '127.0.0.1', resolve));
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
