import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { freePort } from './tcp-proxy';

const root = path.resolve(__dirname, '..', '..');

/** A real Padside server process (server/main.ts through tsx) on a free loopback port. */
export interface ServerProcess {
  url: string;
  child: ChildProcess;
  kill(signal?: NodeJS.Signals): Promise<void>;
}

export async function startServerProcess(env: Record<string, string> = {}): Promise<ServerProcess> {
  const port = await freePort();
  // tsx as a loader inside one node process: signals reach the server itself, not a wrapper.
  const child = spawn(process.execPath, ['--import', 'tsx', path.join(root, 'server/main.ts')], {
    cwd: root,
    env: { ...process.env, PORT: String(port), LOG_LEVEL: 'silent', MAIL_POLL_MS: '60000', ...env },
    stdio: ['ignore', 'ignore', 'pipe'],
  });
  let stderr = '';
  child.stderr?.on('data', (d) => (stderr += String(d)));
  const url = `http://127.0.0.1:${port}`;
  const until = Date.now() + 60_000;
  for (;;) {
    if (child.exitCode !== null) throw new Error(`server exited with ${child.exitCode}: ${stderr}`);
    const ok = await fetch(`${url}/api/health`).then(
      (r) => r.ok,
      () => false,
    );
    if (ok) break;
    if (Date.now() > until) throw new Error(`server did not start: ${stderr}`);
    await new Promise((r) => setTimeout(r, 250));
  }
  return {
    url,
    child,
    kill: (signal = 'SIGTERM') =>
      new Promise<void>((resolve) => {
        if (child.exitCode !== null || child.signalCode) return resolve();
        child.once('exit', () => resolve());
        child.kill(signal);
      }),
  };
}
