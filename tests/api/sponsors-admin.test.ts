// Sponsor organisations (admins): create and edit, logo through the media pipeline, linked
// suppliers (one organisation per supplier), members invited with the sponsor-member invitation.
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { linkFromMail, signedInClient } from '../helpers/accounts';
import { createUser } from '../helpers/factories';
import type { TestClient } from '../helpers/http-client';
import { startTestApp, type TestApp } from '../helpers/test-app';

let app: TestApp;
let admin: TestClient;
let follower: TestClient;

beforeAll(async () => {
  app = await startTestApp({ env: { RATE_LIMIT_MULTIPLIER: '1000' } });
  await createUser(app.deps.db, { email: 'sp-admin@example.test', is_admin: true });
  await createUser(app.deps.db, { email: 'sp-follower@example.test' });
  admin = await signedInClient(app, 'sp-admin@example.test');
  follower = await signedInClient(app, 'sp-follower@example.test');
});
afterAll(async () => {
  await app?.stop();
});

async function uploadLogo(client: TestClient, sponsorId: number, bytes: Buffer, name: string) {
  const form = new FormData();
  form.set('altText', 'Round badge');
  form.set('file', new Blob([new Uint8Array(bytes)]), name);
  const res = await fetch(`${app.baseUrl}/api/admin/sponsors/${sponsorId}/logo`, {
    method: 'POST',
    body: form,
    headers: { accept: 'application/json', cookie: client.cookie!, 'x-csrf-token': await client.csrfToken() },
  });
  return { status: res.status, body: (await res.json()) as { logoUrl?: string | null; error?: { code: string } } };
}

describe('organisations', () => {
  it('creates, lists and edits an organisation; a taken slug is 409 naming the field; bad input 400 and nothing changes', async () => {
    const created = await admin.post('/api/admin/sponsors', {
      name: 'Brakeline Works',
      slug: 'brakeline-works',
      website: 'https://brakeline.example',
    });
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ slug: 'brakeline-works', name: 'Brakeline Works', logoUrl: null });
    const again = await admin.post('/api/admin/sponsors', { name: 'Other', slug: 'brakeline-works', website: null });
    expect(again.status).toBe(409);
    expect(again.body.error.fields.slug).toBeDefined();
    const bad = await admin.post('/api/admin/sponsors', { name: '', slug: 'Not A Slug', website: 'nope' });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['name', 'slug', 'website']);

    const id = created.body.id as number;
    const edited = await admin.put(`/api/admin/sponsors/${id}`, { name: 'Brakeline Works Ltd', slug: 'brakeline', website: null });
    expect(edited.status).toBe(200);
    expect(edited.body).toMatchObject({ name: 'Brakeline Works Ltd', slug: 'brakeline', website: null });
    const list = await admin.get('/api/admin/sponsors');
    expect(list.body.items.map((s: { slug: string }) => s.slug)).toContain('brakeline');
    expect((await admin.get('/api/admin/sponsors/999999')).status).toBe(404);
    expect((await follower.get('/api/admin/sponsors')).status).toBe(403);
  });

  it('stores a logo under the organisation prefix and serves it to anyone with a long cache', async () => {
    const s = await admin.post('/api/admin/sponsors', { name: 'Gauge & Dial', slug: 'gauge-and-dial', website: null });
    const png = await sharp({ create: { width: 400, height: 200, channels: 3, background: '#3e6a4e' } })
      .png()
      .toBuffer();
    const up = await uploadLogo(admin, s.body.id, png, 'badge.png');
    expect(up.status, JSON.stringify(up.body)).toBe(201);
    const media = await app.deps.db.selectFrom('media').selectAll().where('sponsor_id', '=', s.body.id).executeTakeFirstOrThrow();
    expect(media.kind).toBe('logo');
    expect(media.object_key.startsWith(`sponsors/${s.body.id}/logo/`)).toBe(true);
    await app.runJobs();
    const detail = await admin.get(`/api/admin/sponsors/${s.body.id}`);
    const url = detail.body.sponsor.logoUrl as string;
    // A WebP size of the logo (the presenter picks which), never the raw upload.
    expect(url).toMatch(/\/w\d+\.webp$/);
    const served = await fetch(`${app.baseUrl}${url}`);
    expect(served.status).toBe(200);
    expect(served.headers.get('content-type')).toBe('image/webp');
    expect(served.headers.get('cache-control')).toContain('immutable');
    // Not an image: refused, the old logo stays.
    const html = await uploadLogo(admin, s.body.id, Buffer.from('<html></html>'), 'x.png');
    expect(html.status).toBe(415);
    expect((await admin.get(`/api/admin/sponsors/${s.body.id}`)).body.sponsor.logoUrl).toBe(url);
    // Removing it deletes the row and the file.
    expect((await admin.delete(`/api/admin/sponsors/${s.body.id}/logo`)).status).toBe(204);
    expect((await admin.get(`/api/admin/sponsors/${s.body.id}`)).body.sponsor.logoUrl).toBeNull();
    expect((await fetch(`${app.baseUrl}${url}`)).status).toBe(404);
  });
});

describe('linked suppliers', () => {
  it('links a supplier to one organisation only: a second one gets 409 naming the first', async () => {
    const a = await admin.post('/api/admin/sponsors', { name: 'Coolant Cellar', slug: 'coolant-cellar', website: null });
    const b = await admin.post('/api/admin/sponsors', { name: 'Hose Hall', slug: 'hose-hall', website: null });
    const supplier = await app.deps.db
      .insertInto('suppliers')
      .values({ name: 'Radiator Row', website: null, created_by: null })
      .returning('id')
      .executeTakeFirstOrThrow();
    expect((await admin.put(`/api/admin/sponsors/${a.body.id}/suppliers/${supplier.id}`, {})).status).toBe(204);
    // Again for the same organisation: nothing changes, no error.
    expect((await admin.put(`/api/admin/sponsors/${a.body.id}/suppliers/${supplier.id}`, {})).status).toBe(204);
    const clash = await admin.put(`/api/admin/sponsors/${b.body.id}/suppliers/${supplier.id}`, {});
    expect(clash.status).toBe(409);
    expect(clash.body.error.code).toBe('supplier_backed');
    expect(clash.body.error.message).toContain('Coolant Cellar');
    const links = await app.deps.db.selectFrom('sponsor_suppliers').selectAll().where('supplier_id', '=', supplier.id).execute();
    expect(links.map((l) => l.sponsor_id)).toEqual([a.body.id]);
    expect((await admin.get(`/api/admin/sponsors/${a.body.id}`)).body.suppliers).toEqual([
      { id: supplier.id, name: 'Radiator Row', website: null },
    ]);
    // Unlinked, the other may take it.
    expect((await admin.delete(`/api/admin/sponsors/${a.body.id}/suppliers/${supplier.id}`)).status).toBe(204);
    expect((await admin.put(`/api/admin/sponsors/${b.body.id}/suppliers/${supplier.id}`, {})).status).toBe(204);
    expect((await admin.put(`/api/admin/sponsors/${b.body.id}/suppliers/999999`, {})).status).toBe(404);
  });
});

describe('members', () => {
  it('invites by e-mail; accepting adds the member, who then sees the organisation on the account; an admin removes them', async () => {
    const s = await admin.post('/api/admin/sponsors', { name: 'Spanner Guild', slug: 'spanner-guild', website: null });
    const person = await createUser(app.deps.db, { email: 'new-member@example.test' });
    const inv = await admin.post(`/api/admin/sponsors/${s.body.id}/invitations`, { email: 'New-Member@example.test' });
    expect(inv.status).toBe(201);
    expect(inv.body).toMatchObject({ kind: 'sponsor-member', email: 'new-member@example.test', status: 'pending' });
    await app.runJobs();
    const { token, subject } = linkFromMail(app.smtp, 'new-member@example.test', '/invitations/accept');
    expect(subject).toContain('Spanner Guild');

    const member = await signedInClient(app, 'new-member@example.test');
    const lookup = await member.post('/api/invitations/lookup', { token });
    expect(lookup.body).toMatchObject({ kind: 'sponsor-member', target: { id: s.body.id, title: 'Spanner Guild' } });
    const accepted = await member.post('/api/invitations/accept', { token });
    expect(accepted.status).toBe(200);
    expect(accepted.body).toEqual({ kind: 'sponsor-member', targetId: s.body.id });
    const session = await member.get('/api/session');
    expect(session.body.account.sponsors).toEqual([{ sponsorId: s.body.id, sponsorName: 'Spanner Guild', sponsorSlug: 'spanner-guild' }]);
    const detail = await admin.get(`/api/admin/sponsors/${s.body.id}`);
    expect(detail.body.members.map((m: { userId: number }) => m.userId)).toEqual([person.id]);
    expect(detail.body.invitations[0].status).toBe('accepted');

    // Inviting a member again is refused; the link works once.
    expect((await admin.post(`/api/admin/sponsors/${s.body.id}/invitations`, { email: 'new-member@example.test' })).status).toBe(409);
    expect((await member.post('/api/invitations/accept', { token })).status).toBe(409);

    expect((await admin.delete(`/api/admin/sponsors/${s.body.id}/members/${person.id}`)).status).toBe(204);
    expect((await member.get('/api/session')).body.account.sponsors).toEqual([]);
    expect((await admin.delete(`/api/admin/sponsors/${s.body.id}/members/${person.id}`)).status).toBe(404);
  });

  it('resends with a fresh link and revokes a pending invitation', async () => {
    const s = await admin.post('/api/admin/sponsors', { name: 'Torque Tent', slug: 'torque-tent', website: null });
    const inv = await admin.post(`/api/admin/sponsors/${s.body.id}/invitations`, { email: 'maybe@example.test' });
    await app.runJobs();
    const first = linkFromMail(app.smtp, 'maybe@example.test', '/invitations/accept').token;
    expect((await admin.post(`/api/admin/sponsors/${s.body.id}/invitations/${inv.body.id}/resend`, {})).status).toBe(200);
    await app.runJobs();
    const second = linkFromMail(app.smtp, 'maybe@example.test', '/invitations/accept').token;
    expect(second).not.toBe(first);
    expect((await admin.delete(`/api/admin/sponsors/${s.body.id}/invitations/${inv.body.id}`)).status).toBe(204);
    expect((await admin.delete(`/api/admin/sponsors/${s.body.id}/invitations/${inv.body.id}`)).status).toBe(409);
    // Another organisation's id in the path: not found.
    const other = await admin.post('/api/admin/sponsors', { name: 'Other Tent', slug: 'other-tent', website: null });
    expect((await admin.delete(`/api/admin/sponsors/${other.body.id}/invitations/${inv.body.id}`)).status).toBe(404);
  });
});
