import type { AppDeps } from '../app-deps';
import { registerMaintenance } from './maintenance';

/** Every feature registers its jobs here, once, before the queue starts. */
export function registerJobs(deps: AppDeps): void {
  deps.outbox.register();
  registerMaintenance(deps);
}
