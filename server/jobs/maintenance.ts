import { sql } from 'kysely';
import type { AppDeps } from '../app-deps';

export const MAINTENANCE_JOB = 'maintenance.prune';

/** Hourly clean-up of what expires: sessions, rate-limit counters, used or stale sign-in links. */
export function registerMaintenance(deps: AppDeps): void {
  deps.queue.define({
    name: MAINTENANCE_JOB,
    cron: '17 * * * *',
    retryLimit: 1,
    handler: async () => {
      await deps.db
        .deleteFrom('sessions')
        .where('expire', '<', sql<Date>`now()`)
        .execute();
      await deps.db.deleteFrom('rate_limits').where('expire', '<', Date.now()).execute();
      await deps.db
        .deleteFrom('sign_in_tokens')
        .where('expires_at', '<', sql<Date>`now() - interval '1 day'`)
        .execute();
    },
  });
}
