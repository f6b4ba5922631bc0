import type { AppDeps } from '../app-deps';
import { registerEpisodeJobs } from './episodes';
import { registerMaintenance } from './maintenance';
import { registerMediaJobs } from '../services/media/store';
import { registerNoticeJobs } from './notices';

/** Every feature registers its jobs here, once, before the queue starts. */
export function registerJobs(deps: AppDeps): void {
  deps.outbox.register();
  registerMaintenance(deps);
  registerEpisodeJobs(deps);
  registerMediaJobs(deps);
  registerNoticeJobs(deps);
}
