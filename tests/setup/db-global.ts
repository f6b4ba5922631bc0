// Before the API and browser suites: a PostgreSQL cluster (the one `npm test` started, or one of
// our own when Vitest is run directly) and a freshly migrated template database per project.
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { TestProject } from 'vitest/node';
import { migrateDatabase } from '../../scripts/migrate';
import { recreateDatabase, startCluster, type Cluster } from '../../scripts/lib/postgres';

declare module 'vitest' {
  export interface ProvidedContext {
    pgAdminUrl: string;
    pgTemplate: string;
  }
}

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

export default async function setup(project: TestProject) {
  let cluster: Cluster | undefined;
  let adminUrl = process.env.TEST_PG_ADMIN_URL;
  if (!adminUrl) {
    cluster = await startCluster(root, 'test', Number(process.env.RR_TEST_PG_PORT ?? 54330), { durable: false });
    adminUrl = cluster.url('postgres');
  }
  const template = `rr_template_${project.name}`;
  const templateUrl = new URL(adminUrl);
  templateUrl.pathname = `/${template}`;
  await recreateDatabase(adminUrl, template);
  await migrateDatabase(templateUrl.toString());
  project.provide('pgAdminUrl', adminUrl);
  project.provide('pgTemplate', template);
  return () => cluster?.stop();
}
