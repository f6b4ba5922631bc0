// The hosted-service fakes must behave like the real services as far as the app relies on them.
import { randomBytes } from 'node:crypto';
import { mkdtemp, readFile, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { GetObjectCommand, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import nodemailer from 'nodemailer';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startGithubOAuthFake } from '../../fakes/github-oauth';
import type { GithubOAuthFake } from '../../fakes/github-oauth';
import { startS3Fake } from '../../fakes/s3';
import type { S3Fake } from '../../fakes/s3';
import { startSmtpFake } from '../../fakes/smtp';
import type { CapturedMessage, SmtpFake } from '../../fakes/smtp';

let tmp = '';
beforeAll(async () => {
  tmp = await mkdtemp(path.join(os.tmpdir(), 'rivet-reel-fakes-'));
});
afterAll(async () => {
  await rm(tmp, { recursive: true, force: true });
});

describe('S3 fake', () => {
  let s3: S3Fake;
  let client: S3Client;
  beforeAll(async () => {
    process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED = 'true';
    s3 = await startS3Fake({ port: 0, directory: path.join(tmp, 's3'), buckets: ['test-media'] });
    client = new S3Client({
      endpoint: s3.url,
      forcePathStyle: true,
      region: 'us-east-1',
      credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' },
      // Without these the SDK sends aws-chunked bodies, which s3rver stores verbatim.
      requestChecksumCalculation: 'WHEN_REQUIRED',
      responseChecksumValidation: 'WHEN_REQUIRED',
    });
  });
  afterAll(async () => {
    client?.destroy();
    await s3?.stop();
  });

  it('listens on an ephemeral loopback port', () => {
    expect(s3.port).toBeGreaterThan(0);
    expect(s3.url).toBe(`http://127.0.0.1:${s3.port}`);
  });

  it('returns a stored binary object byte for byte', async () => {
    const bytes = randomBytes(200 * 1024);
    await client.send(
      new PutObjectCommand({ Bucket: 'test-media', Key: 'builds/1/frame.bin', Body: bytes, ContentType: 'application/octet-stream' }),
    );
    const got = await client.send(new GetObjectCommand({ Bucket: 'test-media', Key: 'builds/1/frame.bin' }));
    const body = Buffer.from(await got.Body!.transformToByteArray());
    expect(body.length).toBe(bytes.length);
    expect(body.equals(bytes)).toBe(true);
  });
});

describe('SMTP fake', () => {
  let smtp: SmtpFake;
  const dir = () => path.join(tmp, 'smtp');
  const send = (to: string, subject: string, messageId: string) =>
    nodemailer
      .createTransport({ host: '127.0.0.1', port: smtp.smtpPort, secure: false, ignoreTLS: true })
      .sendMail({ from: 'Rivet & Reel <noreply@rivet-reel.test>', to, subject, text: `Body of ${subject}`, messageId });
  const list = async (query = ''): Promise<CapturedMessage[]> => {
    const res = await fetch(`${smtp.httpUrl}/api/messages${query}`);
    expect(res.status).toBe(200);
    return (await res.json()) as CapturedMessage[];
  };
  beforeAll(async () => {
    smtp = await startSmtpFake({ smtpPort: 0, httpPort: 0, directory: dir() });
  });
  afterAll(async () => {
    await smtp?.stop();
  });

  it('captures a message sent with nodemailer', async () => {
    await send('Pria@Demo.Rivet-Reel.test', 'New episode: sills', '<ep-12@rivet-reel.test>');
    const [message] = await list('?to=pria@demo.rivet-reel.test');
    expect(message).toMatchObject({
      subject: 'New episode: sills',
      to: ['pria@demo.rivet-reel.test'],
      messageId: '<ep-12@rivet-reel.test>',
      from: 'noreply@rivet-reel.test',
      text: 'Body of New episode: sills\n',
    });
    expect(message?.size).toBeGreaterThan(0);
    expect(message?.headers['message-id']).toBe('<ep-12@rivet-reel.test>');

    const one = await fetch(`${smtp.httpUrl}/api/messages/${message?.id}`);
    expect(await one.json()).toEqual(message);
    const missing = await fetch(`${smtp.httpUrl}/api/messages/999999`);
    expect(missing.status).toBe(404);
    expect(await missing.json()).toMatchObject({ error: { code: 'not_found' } });
  });

  it('filters by recipient, lists newest first and escapes the inbox page', async () => {
    await send('jun@demo.rivet-reel.test', '<script>alert(1)</script> wiring', '<ep-13@rivet-reel.test>');
    expect((await list('?to=jun@demo.rivet-reel.test')).map((m) => m.messageId)).toEqual(['<ep-13@rivet-reel.test>']);
    expect((await list()).map((m) => m.messageId)).toEqual(['<ep-13@rivet-reel.test>', '<ep-12@rivet-reel.test>']);
    const page = await (await fetch(`${smtp.httpUrl}/`)).text();
    expect(page).toContain('&#60;script&#62;alert(1)&#60;/script&#62; wiring');
    expect(page).not.toContain('<script>');
  });

  it('keeps messages across a restart and clears them on DELETE', async () => {
    await smtp.stop();
    expect((await readFile(path.join(dir(), 'messages.jsonl'), 'utf8')).trim().split('\n')).toHaveLength(2);
    smtp = await startSmtpFake({ smtpPort: 0, httpPort: 0, directory: dir() });
    expect(smtp.messages().map((m) => m.id)).toEqual([2, 1]);
    await send('ossie@demo.rivet-reel.test', 'After restart', '<ep-14@rivet-reel.test>');
    expect((await list())[0]).toMatchObject({ id: 3, subject: 'After restart' });

    expect((await fetch(`${smtp.httpUrl}/api/messages`, { method: 'DELETE' })).status).toBe(204);
    expect(await list()).toEqual([]);
    await smtp.stop();
    smtp = await startSmtpFake({ smtpPort: 0, httpPort: 0, directory: dir() });
    expect(smtp.messages()).toEqual([]);
  });
});

describe('GitHub OAuth fake', () => {
  let gh: GithubOAuthFake;
  const redirectUri = 'http://127.0.0.1:5999/auth/github/callback';
  const authorizeUrl = (extra: Record<string, string>) =>
    `${gh.url}/login/oauth/authorize?${new URLSearchParams({ client_id: 'rivet-dev', redirect_uri: redirectUri, scope: 'user:email', ...extra })}`;
  const exchange = (code: string, accept = 'application/json') =>
    fetch(`${gh.url}/login/oauth/access_token`, {
      method: 'POST',
      headers: { accept, 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ client_id: 'rivet-dev', client_secret: 'dev-secret', code, redirect_uri: redirectUri }),
    });
  const authorize = async (login: string, state: string): Promise<URL> => {
    const res = await fetch(authorizeUrl({ state, login }), { redirect: 'manual' });
    expect(res.status).toBe(302);
    return new URL(res.headers.get('location') ?? '');
  };
  beforeAll(async () => {
    gh = await startGithubOAuthFake({ port: 0 });
  });
  afterAll(async () => {
    await gh?.stop();
  });

  it('runs authorize → token → /user → /user/emails for a demo account', async () => {
    const state = 'st/ate+with=odd&chars';
    const back = await authorize('marta-kettleby', state);
    expect(`${back.origin}${back.pathname}`).toBe(redirectUri);
    expect(back.searchParams.get('state')).toBe(state);
    const code = back.searchParams.get('code') ?? '';

    const bad = await exchange('not-a-code');
    expect(await bad.json()).toMatchObject({ error: 'bad_verification_code' });

    const res = await exchange(code);
    const token = (await res.json()) as { access_token: string; token_type: string; scope: string };
    expect(token).toMatchObject({ token_type: 'bearer', scope: 'user:email' });
    expect(token.access_token).toMatch(/^gho_/);
    expect(await (await exchange(code)).json()).toMatchObject({ error: 'bad_verification_code' });

    const user = await fetch(`${gh.url}/user`, { headers: { authorization: `token ${token.access_token}` } });
    expect(user.status).toBe(200);
    const profile = (await user.json()) as Record<string, unknown>;
    expect(profile).toMatchObject({
      id: 910001,
      login: 'marta-kettleby',
      name: 'Marta Kettleby',
      email: 'marta@demo.rivet-reel.test',
      avatar_url: `${gh.url}/avatars/marta-kettleby.svg`,
      html_url: `${gh.url}/people/marta-kettleby`,
    });
    const avatar = await fetch(String(profile.avatar_url));
    expect(avatar.headers.get('content-type')).toMatch(/^image\/svg\+xml/);
    expect(await avatar.text()).toContain('>MK</text>');

    const emails = await fetch(`${gh.url}/user/emails`, { headers: { authorization: `Bearer ${token.access_token}` } });
    expect(await emails.json()).toEqual([{ email: 'marta@demo.rivet-reel.test', primary: true, verified: true, visibility: 'private' }]);
    const anonymous = await fetch(`${gh.url}/user`);
    expect(anonymous.status).toBe(401);
    expect(((await anonymous.json()) as { message: string }).message).toBeTruthy();
    expect((await fetch(`${gh.url}/user`, { headers: { authorization: 'token nope' } })).status).toBe(401);
  });

  it('answers form-encoded without Accept: application/json, like GitHub', async () => {
    const code = (await authorize('ossie-brandt', 's1')).searchParams.get('code') ?? '';
    const res = await exchange(code, '*/*');
    expect(res.headers.get('content-type')).toMatch(/^application\/x-www-form-urlencoded/);
    const body = new URLSearchParams(await res.text());
    expect(body.get('access_token')).toMatch(/^gho_/);
    expect(body.get('token_type')).toBe('bearer');
  });

  it('shows a picker with the demo accounts and signs in a made-up account', async () => {
    const demo = JSON.parse(await readFile(new URL('../../server/seed/demo-accounts.json', import.meta.url), 'utf8')) as {
      accounts: { login: string; name: string }[];
    };
    const page = await (await fetch(authorizeUrl({ state: 'picker' }))).text();
    for (const account of demo.accounts) {
      expect(page).toContain(`value="${account.login}"`);
      expect(page).toContain(account.name);
    }
    expect(page).toContain('name="new_login"');

    const form = new URLSearchParams({
      client_id: 'rivet-dev',
      redirect_uri: redirectUri,
      state: 'picker',
      scope: 'user:email',
      new_login: 'tess-varnham',
      new_name: 'Tess Varnham',
      new_email: 'tess@example.test',
    });
    const res = await fetch(`${gh.url}/login/oauth/authorize`, { method: 'POST', body: form, redirect: 'manual' });
    expect(res.status).toBe(302);
    const back = new URL(res.headers.get('location') ?? '');
    expect(back.searchParams.get('state')).toBe('picker');
    const token = (await (await exchange(back.searchParams.get('code') ?? '')).json()) as { access_token: string };
    const user = await fetch(`${gh.url}/user`, { headers: { authorization: `token ${token.access_token}` } });
    expect(await user.json()).toMatchObject({ login: 'tess-varnham', name: 'Tess Varnham', email: 'tess@example.test' });
  });

  it('refuses redirects away from loopback and unknown shortcut logins', async () => {
    const away = await fetch(authorizeUrl({ redirect_uri: 'http://elsewhere.test/cb', login: 'marta-kettleby' }), { redirect: 'manual' });
    expect(away.status).toBe(400);
    const unknown = await fetch(authorizeUrl({ login: 'nobody-here' }), { redirect: 'manual' });
    expect(unknown.status).toBe(400);
  });
});
