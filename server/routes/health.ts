import { sql } from 'kysely';
import { defineRoute } from '../http/registry';

type ServiceState = 'up' | 'down';

async function probe(fn: () => Promise<unknown>, timeoutMs = 3_000): Promise<ServiceState> {
  let timer: NodeJS.Timeout | undefined;
  try {
    await Promise.race([
      fn(),
      new Promise((_, reject) => {
        timer = setTimeout(() => reject(new Error('timeout')), timeoutMs);
      }),
    ]);
    return 'up';
  } catch {
    return 'down';
  } finally {
    clearTimeout(timer);
  }
}

export const healthRoutes = [
  defineRoute({
    method: 'get',
    path: '/health',
    summary: 'Reachability of the database, object storage and mail server',
    action: 'site.read',
    handler: async ({ deps, res }) => {
      const [database, storage, mail] = await Promise.all([
        probe(() => sql`select 1`.execute(deps.db)),
        probe(() => deps.storage.ping()),
        probe(() => deps.mailer.verify()),
      ]);
      const ok = database === 'up' && storage === 'up' && mail === 'up';
      res.status(ok ? 200 : 503);
      return { status: ok ? 'ok' : 'degraded', services: { database, storage, mail } };
    },
  }),
];
