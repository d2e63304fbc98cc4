import PgBoss from 'pg-boss';
import type { Logger } from 'pino';

/** A scheduled job: a name, a cron line in the club's time zone, and the work. */
export interface ScheduledJob {
  name: string;
  cron: string;
  run(): Promise<unknown>;
}

/** Runs scheduled work through pg-boss, so each run happens once across every process sharing the database. */
export class JobRunner {
  private readonly boss: PgBoss;

  constructor(
    databaseUrl: string,
    private readonly timeZone: string,
    private readonly log: Logger,
  ) {
    this.boss = new PgBoss({ connectionString: databaseUrl, schema: 'pgboss', max: 3 });
    this.boss.on('error', (err) => this.log.warn({ err }, 'job queue error'));
  }

  /** Starts the queue and schedules each job on its cron line in the club's time zone, logging each result. */
  async start(jobs: ScheduledJob[]): Promise<void> {
    await this.boss.start();
    for (const job of jobs) {
      await this.boss.createQueue(job.name);
      await this.boss.schedule(job.name, job.cron, {}, { tz: this.timeZone });
      await this.boss.work(job.name, async () => {
        const result = await job.run();
        this.log.info({ job: job.name, result }, 'job finished');
      });
    }
  }

  /** Stops the queue, giving running jobs up to five seconds to finish. */
  async stop(): Promise<void> {
    await this.boss.stop({ graceful: true, timeout: 5000 });
  }
}
