import { execFileSync, spawnSync } from 'node:child_process';
import { chownSync, mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { freePort } from './tcp-proxy';

/**
 * A PostgreSQL cluster of one test file's own, so stopping or restarting it does not disturb the other test files
 * running at the same time (the same binaries scripts/stack/postgres.mjs uses; as root the tools run as `postgres`).
 */
export class PrivateCluster {
  private readonly bin = process.env.PG_BIN ?? '/usr/lib/postgresql/15/bin';
  private readonly asRoot = process.getuid?.() === 0;
  private readonly dir: string;
  private readonly data: string;
  port = 0;

  constructor(name: string) {
    this.dir = path.join(process.env.TEST_TMP ?? '/tmp', `pg-${name}-${process.pid}`);
    this.data = path.join(this.dir, 'data');
  }

  /** initdb and start on a free loopback port. */
  async create(): Promise<void> {
    this.port = await freePort();
    mkdirSync(this.dir, { recursive: true });
    if (this.asRoot) {
      const uid = Number(execFileSync('id', ['-u', 'postgres']).toString());
      const gid = Number(execFileSync('id', ['-g', 'postgres']).toString());
      chownSync(this.dir, uid, gid);
      writeFileSync(path.join(this.dir, 'log'), '');
      chownSync(path.join(this.dir, 'log'), uid, gid);
    }
    this.pg('initdb', ['-D', this.data, '-U', 'padside', '--auth=trust']);
    this.start();
  }

  /** postgres://... for the cluster's default database. */
  get url(): string {
    return `postgres://padside@127.0.0.1:${this.port}/postgres`;
  }

  start(): void {
    this.pg('pg_ctl', [
      '-D',
      this.data,
      '-l',
      path.join(this.dir, 'log'),
      '-o',
      `-p ${this.port} -k ${this.dir} -c listen_addresses=127.0.0.1`,
      '-w',
      'start',
    ]);
  }

  /** Fast shutdown: open connections are ended with admin_shutdown (57P01), new ones are refused. */
  stop(): void {
    this.pg('pg_ctl', ['-D', this.data, '-m', 'fast', '-w', 'stop']);
  }

  /** Stops if running; for afterAll. */
  stopQuietly(): void {
    try {
      this.stop();
    } catch {
      // already stopped by the test
    }
  }

  private pg(tool: string, args: string[]): void {
    const [cmd, argv] = this.asRoot
      ? ['runuser', ['-u', 'postgres', '--', path.join(this.bin, tool), ...args]]
      : [path.join(this.bin, tool), args];
    const r = spawnSync(cmd, argv, { encoding: 'utf8' });
    if (r.status !== 0) throw new Error(`${tool} failed: ${r.stderr}`);
  }
}
