// A loopback OAuth 2 provider shaped like GitHub's, enough for passport-github2 to sign people in.
// Test-only behaviour: GET /login/oauth/authorize?...&login=<demo login> skips the picker page and
// redirects straight back with a code for that demo account. GitHub itself has no such shortcut.
import { createHash, randomBytes } from 'node:crypto';
import { readFileSync } from 'node:fs';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import express from 'express';
import type { Request, Response } from 'express';
import { z } from 'zod';

export type GithubOAuthFakeOptions = { port?: number; host?: string; accountsFile?: string };
export type GithubOAuthFake = { url: string; port: number; stop(): Promise<void> };
type Account = { id: number; login: string; name: string; email: string; role?: string; bio?: string };
type Grant = { account: Account; clientId: string; redirectUri: string; scope: string; challenge?: string; method?: string };

const AccountsFile = z.object({
  accounts: z.array(
    z.object({
      githubId: z.number().int(),
      login: z.string(),
      name: z.string(),
      email: z.string(),
      role: z.string().optional(),
      bio: z.string().optional(),
    }),
  ),
});
const NewAccount = z.object({
  new_login: z.string().regex(/^[a-z0-9](?:[a-z0-9]|-(?=[a-z0-9])){0,38}$/i, 'login: letters, digits, single hyphens'),
  new_name: z.string().trim().min(1).max(100),
  new_email: z.email(),
});
const DEFAULT_ACCOUNTS = fileURLToPath(new URL('../server/seed/demo-accounts.json', import.meta.url));
const CODE_TTL_MS = 10 * 60 * 1000; // GitHub's codes also expire after ten minutes
const FLOW_FIELDS = ['client_id', 'redirect_uri', 'state', 'scope', 'code_challenge', 'code_challenge_method'] as const;

/** Starts the fake GitHub OAuth provider (authorize, access_token, /user, /user/emails, avatars). */
export async function startGithubOAuthFake(opts: GithubOAuthFakeOptions = {}): Promise<GithubOAuthFake> {
  const host = opts.host ?? '127.0.0.1';
  const demo = AccountsFile.parse(JSON.parse(readFileSync(opts.accountsFile ?? DEFAULT_ACCOUNTS, 'utf8'))).accounts.map(
    ({ githubId, ...rest }): Account => ({ id: githubId, ...rest }),
  );
  const madeUp = new Map<string, Account>();
  const codes = new Map<string, Grant & { expiresAt: number }>();
  const tokens = new Map<string, Grant>();
  let baseUrl = '';
  const findAccount = (login: string) => demo.find((a) => a.login === login) ?? madeUp.get(login.toLowerCase());

  const app = express();
  app.disable('x-powered-by');
  app.use(express.urlencoded({ extended: false }), express.json());

  // Validates the flow parameters, then hands out a single-use code by redirecting back.
  const redirectWithCode = (res: Response, flow: Record<string, string | undefined>, account: Account) => {
    const target = new URL(flow.redirect_uri ?? '');
    const code = randomBytes(10).toString('hex');
    const now = Date.now();
    for (const [key, grant] of codes) if (grant.expiresAt < now) codes.delete(key);
    codes.set(code, {
      account,
      clientId: flow.client_id ?? '',
      redirectUri: target.href,
      scope: normaliseScope(flow.scope),
      challenge: flow.code_challenge,
      method: flow.code_challenge_method,
      expiresAt: now + CODE_TTL_MS,
    });
    target.searchParams.set('code', code);
    if (flow.state !== undefined) target.searchParams.set('state', flow.state);
    res.redirect(302, target.href);
  };

  app.get('/login/oauth/authorize', (req, res) => {
    const flow = pickFlow(req.query);
    const problem = flowProblem(flow);
    if (problem) return void res.status(400).type('text').send(problem);
    const shortcut = typeof req.query.login === 'string' ? req.query.login : undefined;
    if (shortcut === undefined) return void res.type('html').send(renderPicker(demo, flow, baseUrl));
    const account = demo.find((a) => a.login === shortcut);
    if (!account) return void res.status(400).type('text').send(`Unknown demo login "${shortcut}"`);
    redirectWithCode(res, flow, account);
  });

  app.post('/login/oauth/authorize', (req, res) => {
    const body = (req.body ?? {}) as Record<string, unknown>;
    const flow = pickFlow(body);
    const problem = flowProblem(flow);
    if (problem) return void res.status(400).type('text').send(problem);
    if (typeof body.login === 'string') {
      const account = demo.find((a) => a.login === body.login);
      if (!account) return void res.status(400).type('text').send('Unknown demo login');
      return redirectWithCode(res, flow, account);
    }
    const parsed = NewAccount.safeParse(body);
    if (!parsed.success)
      return void res
        .status(400)
        .type('text')
        .send(parsed.error.issues.map((i) => i.message).join('\n'));
    const { new_login: login, new_name: name, new_email: email } = parsed.data;
    if (demo.some((a) => a.login.toLowerCase() === login.toLowerCase())) {
      return void res.status(400).type('text').send(`"${login}" is a demo account: pick it from the list instead.`);
    }
    const account: Account = { id: stableId(login), login, name, email };
    madeUp.set(login.toLowerCase(), account);
    redirectWithCode(res, flow, account);
  });

  app.post('/login/oauth/access_token', (req, res) => {
    const p = { ...req.query, ...((req.body ?? {}) as Record<string, unknown>) } as Record<string, unknown>;
    const field = (name: string) => (typeof p[name] === 'string' ? (p[name] as string) : undefined);
    const code = field('code') ?? '';
    const grant = codes.get(code);
    codes.delete(code); // single use, even when the exchange fails below
    let error: string | null = null;
    if (!grant || grant.expiresAt < Date.now()) error = 'bad_verification_code';
    else if (field('client_id') !== grant.clientId || !field('client_secret')) error = 'incorrect_client_credentials';
    else if (field('redirect_uri') !== undefined && !sameUri(field('redirect_uri') ?? '', grant.redirectUri))
      error = 'redirect_uri_mismatch';
    else if (grant.challenge && !pkceMatches(grant.challenge, grant.method, field('code_verifier'))) error = 'bad_verification_code';
    // GitHub answers 200 even for errors, in JSON only when asked for it.
    const answer: Record<string, string> =
      error || !grant ? { error: error ?? 'bad_verification_code', error_description: errorText(error) } : issueToken(grant);
    if ((req.get('accept') ?? '').includes('application/json')) return void res.json(answer);
    res.type('application/x-www-form-urlencoded').send(new URLSearchParams(answer).toString());
  });

  const issueToken = (grant: Grant): Record<string, string> => {
    const token = `gho_${randomBytes(18).toString('hex')}`;
    tokens.set(token, grant);
    return { access_token: token, token_type: 'bearer', scope: grant.scope };
  };
  const authorised = (req: Request, res: Response): Grant | null => {
    const match = /^(?:token|bearer)\s+(\S+)$/i.exec(req.get('authorization') ?? '');
    const grant = match?.[1] ? tokens.get(match[1]) : undefined;
    if (grant) return grant;
    res.status(401).json({ message: match ? 'Bad credentials' : 'Requires authentication', status: '401' });
    return null;
  };

  app.get('/user', (req, res) => {
    const grant = authorised(req, res);
    if (!grant) return;
    const a = findAccount(grant.account.login) ?? grant.account;
    res.json({
      id: a.id,
      node_id: Buffer.from(`User${a.id}`).toString('base64'),
      login: a.login,
      name: a.name,
      email: a.email,
      bio: a.bio ?? null,
      type: 'User',
      avatar_url: `${baseUrl}/avatars/${encodeURIComponent(a.login)}.svg`,
      html_url: `${baseUrl}/people/${encodeURIComponent(a.login)}`,
    });
  });
  app.get('/user/emails', (req, res) => {
    const grant = authorised(req, res);
    if (!grant) return;
    // Like GitHub: without the user or user:email scope the list is hidden behind a 404.
    const scopes = grant.scope.split(',');
    if (!scopes.includes('user') && !scopes.includes('user:email')) return void res.status(404).json({ message: 'Not Found' });
    res.json([{ email: grant.account.email, primary: true, verified: true, visibility: 'private' }]);
  });
  // Browsers ask every origin for a favicon; answer without a 404 in the console.
  app.get('/favicon.ico', (_req, res) => {
    res.status(204).end();
  });
  app.get('/avatars/:file', (req, res) => {
    const login = req.params.file.replace(/\.svg$/, '');
    const name = findAccount(login)?.name ?? login;
    res.type('image/svg+xml').set('Cache-Control', 'public, max-age=3600').send(avatarSvg(login, name));
  });
  app.get('/people/:login', (req, res) => {
    const a = findAccount(req.params.login);
    if (!a) return void res.status(404).type('text').send('Not Found');
    res
      .type('html')
      .send(
        `<!doctype html><meta charset="utf-8"><title>${esc(a.login)}</title><img src="/avatars/${esc(encodeURIComponent(a.login))}.svg" width="64" alt=""><h1>${esc(a.name)}</h1><p>@${esc(a.login)}</p><p>${esc(a.bio ?? '')}</p>`,
      );
  });

  const server = await new Promise<Server>((resolve, reject) => {
    const s = app.listen(opts.port ?? 0, host, (err?: Error) => (err ? reject(err) : resolve(s)));
  });
  const port = (server.address() as AddressInfo).port;
  baseUrl = `http://${host.includes(':') ? `[${host}]` : host}:${port}`;
  let stopped = false;
  return {
    url: baseUrl,
    port,
    async stop() {
      if (stopped) return;
      stopped = true;
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
    },
  };
}

/** Options for running the fake from the environment (shared with fakes/all.ts). */
export function githubOAuthFakeOptionsFromEnv(env: NodeJS.ProcessEnv = process.env): GithubOAuthFakeOptions {
  const raw = env.GITHUB_FAKE_PORT;
  const port = raw === undefined || raw === '' ? 8090 : Number(raw);
  if (!Number.isInteger(port) || port < 0 || port > 65535) throw new Error(`GITHUB_FAKE_PORT must be a port number, got "${raw}"`);
  return { port };
}

function pickFlow(source: Record<string, unknown>): Record<string, string | undefined> {
  return Object.fromEntries(FLOW_FIELDS.map((k) => [k, typeof source[k] === 'string' ? source[k] : undefined]));
}

// Redirects only ever go back to loopback, so the fake cannot bounce a browser anywhere else.
function flowProblem(flow: Record<string, string | undefined>): string | null {
  if (!flow.client_id) return 'client_id is required';
  let target: URL;
  try {
    target = new URL(flow.redirect_uri ?? '');
  } catch {
    return 'redirect_uri must be an absolute URL';
  }
  if (!['http:', 'https:'].includes(target.protocol)) return 'redirect_uri must be http(s)';
  if (!['127.0.0.1', 'localhost', '[::1]'].includes(target.hostname)) return 'redirect_uri must point at loopback';
  return null;
}

// GitHub accepts space- or comma-separated scopes and reports them comma-separated.
function normaliseScope(scope: string | undefined): string {
  return (scope ?? '')
    .split(/[\s,]+/)
    .filter(Boolean)
    .join(',');
}

function sameUri(a: string, b: string): boolean {
  try {
    return new URL(a).href === new URL(b).href;
  } catch {
    return false;
  }
}

function pkceMatches(challenge: string, method: string | undefined, verifier: string | undefined): boolean {
  if (!verifier) return false;
  if (method === 'S256') return createHash('sha256').update(verifier).digest('base64url') === challenge;
  return verifier === challenge;
}

function errorText(error: string | null): string {
  if (error === 'incorrect_client_credentials') return 'The client_id and/or client_secret passed are incorrect.';
  if (error === 'redirect_uri_mismatch') return 'The redirect_uri does not match the one used to authorize.';
  return 'The code passed is incorrect or expired.';
}

// Made-up accounts get the same id for the same login, even after the fake restarts.
function stableId(login: string): number {
  return 800_000_000 + (parseInt(createHash('sha256').update(login.toLowerCase()).digest('hex').slice(0, 8), 16) % 100_000_000);
}

function avatarSvg(login: string, name: string): string {
  const initials =
    name
      .split(/[\s-]+/)
      .filter(Boolean)
      .slice(0, 2)
      .map((w) => w[0]?.toUpperCase() ?? '')
      .join('') || '?';
  const hue = parseInt(createHash('sha256').update(login).digest('hex').slice(0, 4), 16) % 360;
  return (
    `<svg xmlns="http://www.w3.org/2000/svg" width="120" height="120" viewBox="0 0 120 120"><rect width="120" height="120" fill="hsl(${hue} 45% 38%)"/>` +
    `<text x="60" y="60" dy=".35em" text-anchor="middle" font-family="sans-serif" font-size="48" fill="#fff">${esc(initials)}</text></svg>`
  );
}

function renderPicker(accounts: Account[], flow: Record<string, string | undefined>, baseUrl: string): string {
  const hidden = FLOW_FIELDS.filter((k) => flow[k] !== undefined)
    .map((k) => `<input type="hidden" name="${k}" value="${esc(flow[k] ?? '')}">`)
    .join('');
  const choices = accounts
    .map(
      (a) =>
        `<li><button name="login" value="${esc(a.login)}"><img src="${baseUrl}/avatars/${esc(encodeURIComponent(a.login))}.svg" width="40" height="40" alt="">` +
        `<span><strong>${esc(a.name)}</strong> @${esc(a.login)}${a.role ? ` · ${esc(a.role)}` : ''}<br><small>${esc(a.bio ?? '')}</small></span></button></li>`,
    )
    .join('');
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1"><title>Sign in (fake GitHub)</title>
<style>body{font:15px/1.5 system-ui,sans-serif;background:#f4f1ea;color:#1d1d1b;margin:0}main{max-width:36rem;margin:2rem auto;padding:0 1rem}
ul{list-style:none;padding:0}li{margin:.4rem 0}button{display:flex;gap:.75rem;align-items:center;width:100%;text-align:left;padding:.6rem;border:1px solid #cfc6b4;background:#fff;border-radius:6px;cursor:pointer;font:inherit}
button:hover,button:focus{border-color:#7a2e0e}img{border-radius:50%}label{display:block;margin:.5rem 0}input{font:inherit;padding:.3rem;width:100%;box-sizing:border-box}</style></head>
<body><main><h1>Sign in with the fake GitHub</h1><p>Local stand-in: no real account is used. Signing in to <code>${esc(flow.client_id ?? '')}</code>.</p>
<h2>Demo accounts</h2><form method="post" action="/login/oauth/authorize">${hidden}<ul>${choices}</ul></form>
<h2>Or make one up</h2><form method="post" action="/login/oauth/authorize">${hidden}
<label>Login <input name="new_login" required pattern="[A-Za-z0-9](?:[A-Za-z0-9]|-(?=[A-Za-z0-9])){0,38}"></label><label>Name <input name="new_name" required></label>
<label>E-mail <input name="new_email" type="email" required></label><p><button type="submit">Continue as this account</button></p></form></main></body></html>`;
}

function esc(value: string): string {
  return value.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}

const isMain = process.argv[1] !== undefined && import.meta.url === pathToFileURL(path.resolve(process.argv[1])).href;
if (isMain) {
  const fake = await startGithubOAuthFake(githubOAuthFakeOptionsFromEnv());
  console.log(`github oauth fake: ${fake.url} (authorize at ${fake.url}/login/oauth/authorize)`);
  const shutdown = () => void fake.stop().then(() => process.exit(0));
  process.once('SIGINT', shutdown);
  process.once('SIGTERM', shutdown);
}
