import net from 'node:net';

/** One message the fake server took: the envelope recipients and the raw message. */
export interface TakenMessage {
  to: string[];
  raw: string;
  subject: string;
  headers: Record<string, string>;
}

/**
 * A small SMTP server on loopback (RFC 5321: EHLO, MAIL, RCPT, DATA, RSET, NOOP, QUIT) that keeps what it takes and
 * can refuse recipients with a chosen reply, or stop taking new connections (the sessions open finish their work).
 * For tests on a private database whose outbox no other test file shares.
 */
export class FakeSmtp {
  readonly taken: TakenMessage[] = [];
  private server?: net.Server;

  /** The reply for a recipient it refuses (e.g. `550 5.1.1 No such user`), or null to accept. */
  constructor(
    readonly port: number,
    private readonly refusal: (rcpt: string) => string | null = () => null,
  ) {}

  async up(): Promise<void> {
    this.server = net.createServer((socket) => this.session(socket));
    await new Promise<void>((resolve) => this.server!.listen(this.port, '127.0.0.1', resolve));
  }

  /** Refuses new connections from now on; resolves once the sessions already open have ended. */
  stopAccepting(): Promise<void> {
    const server = this.server;
    this.server = undefined;
    return new Promise((resolve) => (server ? server.close(() => resolve()) : resolve()));
  }

  /** Messages taken for one recipient. */
  to(address: string): TakenMessage[] {
    return this.taken.filter((m) => m.to.includes(address.toLowerCase()));
  }

  private session(socket: net.Socket): void {
    let buffer = '';
    let inData = false;
    let data: string[] = [];
    let rcpts: string[] = [];
    const reply = (line: string) => socket.write(`${line}\r\n`);
    socket.on('error', () => socket.destroy());
    reply('220 fake.smtp.test ready');
    socket.on('data', (chunk) => {
      buffer += chunk.toString('utf8');
      let at: number;
      while ((at = buffer.indexOf('\r\n')) >= 0) {
        const line = buffer.slice(0, at);
        buffer = buffer.slice(at + 2);
        if (inData) {
          if (line === '.') {
            inData = false;
            this.keep(rcpts, data.join('\r\n'));
            rcpts = [];
            data = [];
            reply('250 2.0.0 Taken');
          } else data.push(line.startsWith('..') ? line.slice(1) : line);
          continue;
        }
        const verb = line.slice(0, 4).toUpperCase();
        if (verb === 'EHLO' || verb === 'HELO') reply('250-fake.smtp.test\r\n250 8BITMIME');
        else if (verb === 'MAIL') reply('250 2.1.0 OK');
        else if (verb === 'RCPT') {
          const rcpt = (/<([^>]*)>/.exec(line)?.[1] ?? '').toLowerCase();
          const refused = this.refusal(rcpt);
          if (refused) reply(refused);
          else {
            rcpts.push(rcpt);
            reply('250 2.1.5 OK');
          }
        } else if (verb === 'DATA') {
          if (rcpts.length === 0) reply('554 5.5.1 No valid recipients');
          else {
            inData = true;
            reply('354 Go ahead');
          }
        } else if (verb === 'RSET') {
          rcpts = [];
          reply('250 2.0.0 OK');
        } else if (verb === 'QUIT') {
          reply('221 2.0.0 Bye');
          socket.end();
        } else reply('250 OK');
      }
    });
  }

  private keep(to: string[], raw: string): void {
    const head = raw.split('\r\n\r\n')[0].replace(/\r\n[ \t]+/g, ' ');
    const headers: Record<string, string> = {};
    for (const line of head.split('\r\n')) {
      const i = line.indexOf(':');
      if (i > 0) headers[line.slice(0, i).trim().toLowerCase()] = line.slice(i + 1).trim();
    }
    this.taken.push({ to, raw, subject: headers.subject ?? '', headers });
  }
}
