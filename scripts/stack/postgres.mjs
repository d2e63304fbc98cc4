// A private PostgreSQL cluster in a folder of ours, listening on loopback only.
import { spawnSync } from 'node:child_process';
import { chmodSync, chownSync, existsSync, mkdirSync, statSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { ensurePostgres, isRoot } from './system.mjs';

/** initdb refuses to run as root, so as root every server command runs as the `postgres` user. */
function run(bin, args, opts = {}) {
  const [cmd, argv] = isRoot ? ['runuser', ['-u', 'postgres', '--', bin, ...args]] : [bin, args];
  const r = spawnSync(cmd, argv, { encoding: 'utf8', ...opts });
  if (r.status !== 0 && !opts.allowFail) {
    throw new Error(`padside: ${path.basename(bin)} failed:\n${r.stderr || r.stdout}`);
  }
  return r;
}

function ownedByPostgres(dir) {
  if (!isRoot) return;
  const id = spawnSync('id', ['-u', 'postgres'], { encoding: 'utf8' });
  const gid = spawnSync('id', ['-g', 'postgres'], { encoding: 'utf8' });
  chownSync(dir, Number(id.stdout), Number(gid.stdout));
}

/**
 * As root, the `postgres` user must be able to reach the data folder. A checkout inside a private folder (mode
 * 0700, as `mktemp -d` makes) blocks it, so such folders get the traverse bit for others (not read or write).
 */
function letPostgresReach(dir) {
  if (!isRoot) return;
  const parts = path.resolve(dir).split(path.sep).filter(Boolean);
  for (let i = 1; i <= parts.length; i++) {
    const d = path.sep + parts.slice(0, i).join(path.sep);
    if (!existsSync(d)) break;
    if (spawnSync('runuser', ['-u', 'postgres', '--', 'test', '-x', d]).status !== 0) {
      chmodSync(d, statSync(d).mode | 0o001);
      console.log(`padside: let the postgres user pass through ${d} (o+x) so it can reach the cluster`);
    }
  }
}

/** Creates (once) and starts a cluster in `dataDir`; returns a stop function. */
export function startCluster({ dataDir, port, user = 'padside', log }) {
  const bin = ensurePostgres();
  mkdirSync(path.dirname(dataDir), { recursive: true });
  letPostgresReach(path.dirname(dataDir));
  const socketDir = path.join(path.dirname(dataDir), 'pg-socket');
  mkdirSync(socketDir, { recursive: true });
  ownedByPostgres(socketDir);
  if (!existsSync(path.join(dataDir, 'PG_VERSION'))) {
    mkdirSync(dataDir, { recursive: true });
    chmodSync(dataDir, 0o700);
    ownedByPostgres(dataDir);
    // Trust on loopback only: the cluster is private to this checkout and listens on 127.0.0.1.
    run(path.join(bin, 'initdb'), ['-D', dataDir, '-U', user, '--auth=trust', '-E', 'UTF8', '--locale=C.UTF-8']);
    writeFileSync(
      path.join(dataDir, 'postgresql.auto.conf'),
      `listen_addresses = '127.0.0.1'\nport = ${port}\nunix_socket_directories = '${socketDir}'\nmax_connections = 200\nfsync = on\n`,
    );
    ownedByPostgres(path.join(dataDir, 'postgresql.auto.conf'));
  }
  const logFile = log ?? path.join(path.dirname(dataDir), 'postgres.log');
  if (!existsSync(logFile)) writeFileSync(logFile, '');
  ownedByPostgres(logFile);
  run(path.join(bin, 'pg_ctl'), [
    '-D',
    dataDir,
    '-l',
    logFile,
    '-o',
    `-p ${port} -k ${socketDir}`,
    '-w',
    '-t',
    '60',
    'start',
  ]);
  return {
    bin,
    stop: () => run(path.join(bin, 'pg_ctl'), ['-D', dataDir, '-m', 'fast', '-w', 'stop'], { allowFail: true }),
    running: () => run(path.join(bin, 'pg_ctl'), ['-D', dataDir, 'status'], { allowFail: true }).status === 0,
  };
}

/** Creates the database if it is missing. */
export function ensureDatabase({ bin, port, user = 'padside', database }) {
  const psql = (sql) =>
    spawnSync(
      path.join(bin, 'psql'),
      ['-h', '127.0.0.1', '-p', String(port), '-U', user, '-d', 'postgres', '-tAc', sql],
      { encoding: 'utf8' },
    );
  const exists = psql(`SELECT 1 FROM pg_database WHERE datname = '${database}'`);
  if (exists.status !== 0) throw new Error(`padside: cannot reach PostgreSQL on port ${port}: ${exists.stderr}`);
  if (exists.stdout.trim() !== '1') {
    const r = psql(`CREATE DATABASE "${database}"`);
    if (r.status !== 0) throw new Error(`padside: CREATE DATABASE failed: ${r.stderr}`);
  }
}
