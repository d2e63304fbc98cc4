import cluster from 'node:cluster';
import { once } from 'node:events';
import { createApp } from './app';
import { ConfigError, loadConfig, type Config } from './config';
import { closeDeps, createDeps } from './deps';
import { JobRunner } from './jobs/job-runner';

function readConfig(): Config {
  try {
    return loadConfig();
  } catch (err) {
    if (err instanceof ConfigError) {
      console.error(err.message);
      process.exit(1);
    }
    throw err;
  }
}

/** One server process: HTTP, the mail worker and the scheduled jobs. */
async function serve(config: Config): Promise<void> {
  const deps = createDeps(config);
  const app = createApp(deps);
  const jobs = new JobRunner(config.databaseUrl, config.clubTimeZone, deps.log);
  const server = app.listen(config.port, config.host);
  server.on('error', (err: NodeJS.ErrnoException) => {
    console.error(
      err.code === 'EADDRINUSE'
        ? `Padside: port ${config.port} on ${config.host} is taken; set PORT to another port.`
        : `Padside: ${err.message}`,
    );
    process.exit(1);
  });
  await once(server, 'listening');
  deps.mail.start(config.mailPollMs);
  await jobs.start(app.jobs).catch((err) => deps.log.error({ err }, 'scheduled jobs did not start'));
  deps.log.info(`Padside listening on http://${config.host}:${config.port}`);

  const shutdown = async () => {
    server.close();
    await jobs.stop().catch(() => undefined);
    await app.close();
    await closeDeps(deps);
    process.exit(0);
  };
  process.once('SIGTERM', shutdown);
  process.once('SIGINT', shutdown);
}

const config = readConfig();
if (config.workers > 1 && cluster.isPrimary) {
  // node:cluster shares one listening port between the worker processes.
  for (let i = 0; i < config.workers; i++) cluster.fork();
  cluster.on('exit', (worker, code) => {
    if (code !== 0) console.error(`Padside: worker ${worker.process.pid} exited with ${code}`);
  });
  const stop = () => {
    for (const w of Object.values(cluster.workers ?? {})) w?.kill('SIGTERM');
  };
  process.once('SIGTERM', stop);
  process.once('SIGINT', stop);
} else {
  void serve(config);
}
