// Before the fault suites: a PostgreSQL cluster of their own (they stop and start it), with
// durable settings (fsync on: what was acknowledged must survive), and a migrated template.
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { TestProject } from 'vitest/node';
import { migrateDatabase } from '../../scripts/migrate';
import { recreateDatabase, startCluster } from '../../scripts/lib/postgres';

declare module 'vitest' {
  export interface ProvidedContext {
    pgFaultsDataDir: string;
  }
}

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

export default async function setup(project: TestProject) {
  const cluster = await startCluster(root, 'faults', Number(process.env.RR_FAULTS_PG_PORT ?? 54340), { durable: true });
  const adminUrl = cluster.url('postgres');
  const template = 'rr_template_faults';
  const templateUrl = new URL(adminUrl);
  templateUrl.pathname = `/${template}`;
  await recreateDatabase(adminUrl, template);
  await migrateDatabase(templateUrl.toString());
  project.provide('pgAdminUrl', adminUrl);
  project.provide('pgTemplate', template);
  project.provide('pgFaultsDataDir', cluster.dataDir);
  return () => cluster.stop();
}
