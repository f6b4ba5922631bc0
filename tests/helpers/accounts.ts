import type { Insertable } from 'kysely';
import type { GithubOAuthFake } from '../../fakes/github-oauth';
import type { SmtpFake } from '../../fakes/smtp';
import type { BuildRole, BuildsTable, UsersTable } from '../../server/db/database';
import type { Db } from '../../server/db/kysely';
import { createBuild, createUser } from './factories';
import { signInByEmail, TestClient, type TestResponse } from './http-client';
import type { TestApp } from './test-app';

/** The GitHub fake's URLs as the app's config names them. */
export function githubFakeEnv(fake: GithubOAuthFake): Record<string, string> {
  return {
    GITHUB_AUTHORIZATION_URL: `${fake.url}/login/oauth/authorize`,
    GITHUB_TOKEN_URL: `${fake.url}/login/oauth/access_token`,
    GITHUB_USER_PROFILE_URL: `${fake.url}/user`,
    GITHUB_USER_EMAIL_URL: `${fake.url}/user/emails`,
  };
}

export interface GithubDance {
  /** GET /auth/github: the redirect to the provider. */
  start: TestResponse;
  /** The session cookie the client held before the callback (the one carrying the OAuth state). */
  cookieBefore: string | undefined;
  /** Where the provider sent the browser back to (the callback with code and state). */
  callbackUrl: URL;
  /** GET of the callback: the redirect after sign-in (or to the error page). */
  callback: TestResponse;
}

/**
 * Runs the OAuth dance against the fake as a browser would, using the fake's `login=` shortcut
 * for a demo account. `tamper` may change the callback URL before it is followed.
 */
export async function githubSignIn(
  client: TestClient,
  fake: GithubOAuthFake,
  login: string,
  opts: { returnTo?: string; tamper?: (callback: URL) => void } = {},
): Promise<GithubDance> {
  const start = await client.get(`/auth/github?returnTo=${encodeURIComponent(opts.returnTo ?? '/')}`);
  const location = start.headers.get('location');
  if (start.status !== 302 || !location) throw new Error(`GET /auth/github answered ${start.status}`);
  const cookieBefore = client.cookie;
  const authorize = await fetch(`${location}&login=${encodeURIComponent(login)}`, { redirect: 'manual' });
  const back = authorize.headers.get('location');
  if (authorize.status !== 302 || !back) throw new Error(`the fake's authorize answered ${authorize.status}: ${await authorize.text()}`);
  const callbackUrl = new URL(back);
  opts.tamper?.(callbackUrl);
  const callback = await client.get(`${callbackUrl.pathname}${callbackUrl.search}`);
  client.forgetCsrf();
  return { start, cookieBefore, callbackUrl, callback };
}

/** The newest captured e-mail to an address and the token of its `<path>#token=…` link. */
export function linkFromMail(smtp: SmtpFake, to: string, linkPath: string): { url: string; token: string; subject: string } {
  const message = smtp.messages().find((m) => m.to.includes(to.toLowerCase()));
  if (!message) throw new Error(`no e-mail to ${to}`);
  const escaped = linkPath.replace(/[.*+?^${}()|[\]\\/]/g, '\\$&');
  const match = new RegExp(`(https?://\\S+${escaped})#token=([A-Za-z0-9_-]+)`).exec(message.text);
  if (!match) throw new Error(`no ${linkPath} link in the e-mail to ${to}: ${message.text}`);
  return { url: match[1]!, token: match[2]!, subject: message.subject };
}

/** Adds a build_members row (factories.createBuild does not). */
export async function addBuildMember(db: Db, buildId: number, userId: number, role: BuildRole): Promise<void> {
  await db.insertInto('build_members').values({ build_id: buildId, user_id: userId, role }).execute();
}

/** A build with its owner user and the owner's build_members row. */
export async function createOwnedBuild(
  db: Db,
  opts: { owner?: Partial<Insertable<UsersTable>>; build?: Partial<Insertable<BuildsTable>> } = {},
) {
  const owner = await createUser(db, opts.owner);
  const build = await createBuild(db, { ...opts.build, owner_id: owner.id });
  await addBuildMember(db, build.id, owner.id, 'owner');
  return { owner, build };
}

/** A client signed in (through a real sign-in link redemption) as the account with this address. */
export async function signedInClient(app: TestApp, email: string): Promise<TestClient> {
  const client = new TestClient(app.baseUrl);
  await signInByEmail(client, app.deps.db, email);
  return client;
}

/** Empties the PostgreSQL rate-limit counters, so one test's sign-ins do not count against the next. */
export async function resetRateLimits(db: Db): Promise<void> {
  await db.deleteFrom('rate_limits').execute();
}

/** Rows in the sessions table. */
export async function sessionCount(db: Db): Promise<number> {
  const r = await db
    .selectFrom('sessions')
    .select((eb) => eb.fn.countAll<number>().as('n'))
    .executeTakeFirstOrThrow();
  return Number(r.n);
}
