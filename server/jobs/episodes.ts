import { sql } from 'kysely';
import type { AppDeps } from '../app-deps';
import { TRASH_DAYS } from '../services/builds';
import { announceEpisode } from '../services/notices';
import { runPublishChecks } from '../services/publish-checks';
import { mailOwnerPublishFailed } from '../services/publish-failed-mail';

export const PUBLISH_DUE_JOB = 'episodes.publish-due';
export const PURGE_TRASH_JOB = 'trash.purge';

/**
 * Publishes scheduled episodes whose time has come, re-running the publish checks at that moment;
 * one that fails them goes back to draft with the reason. Row locks (skip locked) let several
 * server processes run it at once; the queue keeps the job across restarts.
 */
export async function publishDueEpisodes(deps: AppDeps, onlyId?: number): Promise<number[]> {
  const due = await deps.db
    .selectFrom('episodes')
    .select('id')
    .where('status', '=', 'scheduled')
    .where('publish_at', '<=', sql<Date>`now()`)
    .where('deleted_at', 'is', null)
    .$if(onlyId !== undefined, (q) => q.where('id', '=', onlyId!))
    .execute();
  const published: number[] = [];
  for (const { id } of due) {
    const problems = await runPublishChecks(deps.db, id);
    const done = await deps.db.transaction().execute(async (trx) => {
      const row = await trx
        .selectFrom('episodes')
        .select(['status', 'publish_at', 'version'])
        .where('id', '=', id)
        .forUpdate()
        .skipLocked()
        .executeTakeFirst();
      if (!row || row.status !== 'scheduled') return false;
      await trx
        .updateTable('episodes')
        .set(
          problems.length
            ? {
                status: 'draft',
                publish_at: null,
                publish_error: problems.map((p) => p.message).join('; '),
                version: row.version + 1,
                updated_at: sql<Date>`now()`,
              }
            : {
                status: 'published',
                published_at: row.publish_at,
                publish_at: null,
                publish_error: null,
                version: row.version + 1,
                updated_at: sql<Date>`now()`,
              },
        )
        .where('id', '=', id)
        .execute();
      if (!problems.length) await announceEpisode(trx, deps, id);
      // Back to draft: the owner hears why, in the same transaction.
      else await mailOwnerPublishFailed(trx, deps, id, problems);
      return problems.length === 0;
    });
    if (done) published.push(id);
    else if (problems.length) deps.logger.warn({ episodeId: id, problems }, 'scheduled episode failed its publish checks; back to draft');
  }
  return published;
}

export function registerEpisodeJobs(deps: AppDeps): void {
  deps.queue.define<{ episodeId?: number }>({
    name: PUBLISH_DUE_JOB,
    // A sweep every minute as well as one job per schedule, so nothing waits on a lost job.
    cron: '* * * * *',
    retryLimit: 3,
    handler: async (data) => void (await publishDueEpisodes(deps, data.episodeId)),
  });
  deps.queue.define({
    name: PURGE_TRASH_JOB,
    cron: '41 3 * * *',
    retryLimit: 2,
    handler: async () => {
      await deps.db
        .deleteFrom('episodes')
        .where('deleted_at', '<', sql<Date>`now() - make_interval(days => ${TRASH_DAYS})`)
        .execute();
      await deps.db
        .deleteFrom('builds')
        .where('deleted_at', '<', sql<Date>`now() - make_interval(days => ${TRASH_DAYS})`)
        .execute();
    },
  });
}
