// Child processes that stop with us.
import { spawn } from 'node:child_process';

const children = [];

/** Starts a long-running child; its output goes to our console with a prefix unless `quiet`. */
export function startChild(name, cmd, args, { env, quiet = false } = {}) {
  const child = spawn(cmd, args, { env: { ...process.env, ...env }, stdio: ['ignore', 'pipe', 'pipe'] });
  const forward = (stream, out) =>
    stream.on('data', (chunk) => {
      if (!quiet) for (const line of String(chunk).split('\n').filter(Boolean)) out.write(`[${name}] ${line}\n`);
    });
  forward(child.stdout, process.stdout);
  forward(child.stderr, process.stderr);
  children.push({ name, child });
  return child;
}

export async function stopChildren() {
  await Promise.all(
    children.splice(0).map(
      ({ child }) =>
        new Promise((resolve) => {
          if (child.exitCode !== null || child.signalCode) return resolve();
          child.once('exit', resolve);
          child.kill('SIGTERM');
          setTimeout(() => child.kill('SIGKILL'), 8000).unref();
        }),
    ),
  );
}
