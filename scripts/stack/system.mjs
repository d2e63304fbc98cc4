// Finding and installing what Padside needs from the operating system.
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, readdirSync } from 'node:fs';
import net from 'node:net';

export const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;

export function which(cmd) {
  const r = spawnSync('sh', ['-c', `command -v ${cmd}`], { encoding: 'utf8' });
  return r.status === 0 ? r.stdout.trim() : null;
}

/** Installs Debian packages with apt-get, or explains the command and exits 1 when that is not possible. */
export function aptInstall(packages, why) {
  const command = `apt-get update && apt-get install -y ${packages.join(' ')}`;
  if (!isRoot || !which('apt-get')) {
    console.error(`padside: ${why} is missing. Install it with:\n  sudo ${command}`);
    process.exit(1);
  }
  console.log(`padside: installing ${packages.join(', ')} from Debian's packages (${why})`);
  const r = spawnSync('sh', ['-c', command], {
    stdio: 'inherit',
    env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
  });
  if (r.status !== 0) {
    console.error(`padside: apt-get failed. Run this yourself, then try again:\n  sudo ${command}`);
    process.exit(1);
  }
}

/** The directory holding initdb and pg_ctl, newest major version first. */
export function postgresBinDir() {
  const root = '/usr/lib/postgresql';
  if (existsSync(root)) {
    const versions = readdirSync(root)
      .filter((v) => existsSync(`${root}/${v}/bin/pg_ctl`))
      .sort((a, b) => Number(b) - Number(a));
    if (versions.length) return `${root}/${versions[0]}/bin`;
  }
  const initdb = which('initdb');
  return initdb && which('pg_ctl') ? execFileSync('dirname', [initdb], { encoding: 'utf8' }).trim() : null;
}

export function ensurePostgres() {
  if (!postgresBinDir()) aptInstall(['postgresql'], 'PostgreSQL server');
  return postgresBinDir();
}

export function ensureChromium() {
  const found = ['/usr/bin/chromium', '/usr/bin/chromium-browser'].find((p) => existsSync(p));
  if (found) return found;
  aptInstall(['chromium'], 'Chromium (for the browser tests)');
  return '/usr/bin/chromium';
}

/** Resolves when nothing listens on host:port; rejects with a clear message otherwise. */
export function assertPortFree(port, host, name) {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.once('error', () =>
      reject(
        new Error(
          `padside: port ${port} on ${host} (${name}) is already in use. Stop what uses it or set the port variable named in the README.`,
        ),
      ),
    );
    server.listen(port, host, () => server.close(resolve));
  });
}

/** A port the kernel says is free now. */
export function freePort() {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address();
      server.close(() => resolve(port));
    });
  });
}

export async function waitForPort(port, host = '127.0.0.1', timeoutMs = 30000) {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    const ok = await new Promise((resolve) => {
      const s = net.connect(port, host, () => (s.end(), resolve(true)));
      s.once('error', () => resolve(false));
    });
    if (ok) return;
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`padside: nothing answered on ${host}:${port} within ${timeoutMs / 1000}s`);
}
