import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { sql } from 'kysely';
import { z } from 'zod';
import type { SeedSection } from '../section';

const accountsFile = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../demo-accounts.json');

const demoAccount = z.object({
  githubId: z.number().int(),
  login: z.string(),
  name: z.string(),
  email: z.email(),
  role: z.enum(['creator', 'editor', 'follower', 'sponsor-member', 'admin']),
  bio: z.string(),
});
export type DemoAccount = z.infer<typeof demoAccount>;

/** The invented demo people, shared with the GitHub OAuth fake. */
export function loadDemoAccounts(): DemoAccount[] {
  return z.object({ accounts: z.array(demoAccount) }).parse(JSON.parse(readFileSync(accountsFile, 'utf8'))).accounts;
}

export const demoAccountsSection: SeedSection = {
  key: 'demo-accounts',
  version: 1,
  async run(trx) {
    for (const a of loadDemoAccounts()) {
      await trx
        .insertInto('users')
        .values({ handle: a.login, display_name: a.name, email: a.email, avatar_url: null, is_admin: a.role === 'admin' })
        .onConflict((oc) =>
          oc.expression(sql`lower(handle)`).doUpdateSet({
            display_name: (eb) => eb.ref('excluded.display_name'),
            email: (eb) => eb.ref('excluded.email'),
            is_admin: (eb) => eb.ref('excluded.is_admin'),
            updated_at: sql`now()`,
          }),
        )
        .execute();
    }
  },
};
