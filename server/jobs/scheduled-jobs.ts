import type { AppDeps } from '../deps';
import type { ScheduledJob } from './job-runner';

/** Every scheduled job Padside runs; each feature adds its own here. */
export function scheduledJobs(deps: AppDeps): ScheduledJob[] {
  return [
    { name: 'mail-sweep', cron: '*/5 * * * *', run: () => deps.mail.deliverDue() },
  ];
}
