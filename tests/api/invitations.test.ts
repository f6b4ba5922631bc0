import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import {
  buildMemberList,
  invitation,
  invitationAcceptResponse,
  invitationList,
  invitationLookup,
  sessionResponse,
} from '../../src/shared/schemas/accounts';
import { createOwnedBuild, linkFromMail, resetRateLimits, signedInClient } from '../helpers/accounts';
import { createUser } from '../helpers/factories';
import { TestClient } from '../helpers/http-client';
import { startTestApp, type TestApp } from '../helpers/test-app';

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(async () => {
  await app?.stop();
});
beforeEach(async () => {
  await resetRateLimits(app.deps.db);
  app.smtp.clear();
});

/** Invites the address as the owner, delivers the outbox and returns the invitation and its token. */
async function invite(owner: TestClient, buildId: number, email: string) {
  const res = await owner.post(`/api/builds/${buildId}/invitations`, { email });
  expect(res.status).toBe(201);
  await app.runJobs();
  return { invitation: invitation.parse(res.body), ...linkFromMail(app.smtp, email, '/invitations/accept') };
}

describe('editor invitations', () => {
  it('invite → e-mail → lookup → accept makes an editor; team management by the owner', async () => {
    const { owner, build } = await createOwnedBuild(app.deps.db, {
      owner: { email: 'owner@example.test', display_name: 'Marta Owner' },
      build: { title: 'The hatchback' },
    });
    const editorUser = await createUser(app.deps.db, { email: 'helper@example.test', display_name: 'Jun Helper' });
    const ownerClient = await signedInClient(app, 'owner@example.test');

    const sent = await invite(ownerClient, build.id, 'Helper@Example.test');
    expect(sent.invitation).toMatchObject({ kind: 'build-editor', email: 'helper@example.test', status: 'pending' });
    expect(sent.url).toBe(`${app.baseUrl}/invitations/accept`);
    expect(sent.subject).toContain('The hatchback');
    const stored = await app.deps.db
      .selectFrom('invitations')
      .select(['token_hash', 'invited_by'])
      .where('id', '=', sent.invitation.id)
      .executeTakeFirstOrThrow();
    expect(stored.token_hash).not.toBe(sent.token);
    expect(stored.invited_by).toBe(owner.id);

    const editor = await signedInClient(app, 'helper@example.test');
    const lookup = await editor.post('/api/invitations/lookup', { token: sent.token });
    expect(lookup.status).toBe(200);
    expect(invitationLookup.parse(lookup.body)).toEqual({
      kind: 'build-editor',
      email: 'helper@example.test',
      status: 'pending',
      target: { id: build.id, title: 'The hatchback' },
      invitedBy: 'Marta Owner',
    });

    const accepted = await editor.post('/api/invitations/accept', { token: sent.token });
    expect(accepted.status).toBe(200);
    expect(invitationAcceptResponse.parse(accepted.body)).toEqual({ kind: 'build-editor', targetId: build.id });
    const member = await app.deps.db
      .selectFrom('build_members')
      .select('role')
      .where('build_id', '=', build.id)
      .where('user_id', '=', editorUser.id)
      .executeTakeFirst();
    expect(member?.role).toBe('editor');
    const { account } = sessionResponse.parse((await editor.get('/api/session')).body);
    expect(account?.builds).toEqual([{ buildId: build.id, buildTitle: 'The hatchback', buildSlug: build.slug, role: 'editor' }]);
    expect((await editor.post('/api/invitations/lookup', { token: sent.token })).body.status).toBe('accepted');

    const again = await editor.post('/api/invitations/accept', { token: sent.token });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('invitation_closed');

    // The team: the owner and the editor can see it; only the owner sees the invitations.
    const members = await ownerClient.get(`/api/builds/${build.id}/members`);
    expect(members.status).toBe(200);
    expect(buildMemberList.parse(members.body).items.map((m) => [m.userId, m.role])).toEqual([
      [owner.id, 'owner'],
      [editorUser.id, 'editor'],
    ]);
    expect((await editor.get(`/api/builds/${build.id}/members`)).status).toBe(200);
    const editorList = await editor.get(`/api/builds/${build.id}/invitations`);
    expect(editorList.status).toBe(403);
    expect(editorList.body.error.code).toBe('forbidden');
    const editorInvite = await editor.post(`/api/builds/${build.id}/invitations`, { email: 'sneaky@example.test' });
    expect(editorInvite.status).toBe(403);
    expect(editorInvite.body.error.code).toBe('forbidden');

    const list = await ownerClient.get(`/api/builds/${build.id}/invitations`);
    expect(list.status).toBe(200);
    expect(invitationList.parse(list.body).items.map((i) => [i.id, i.status])).toEqual([[sent.invitation.id, 'accepted']]);

    // Inviting someone already on the team is refused.
    const dup = await ownerClient.post(`/api/builds/${build.id}/invitations`, { email: 'helper@example.test' });
    expect(dup.status).toBe(409);
    expect(dup.body.error.code).toBe('already_member');

    // The owner cannot be removed; an editor can, and loses access.
    const removeOwner = await ownerClient.delete(`/api/builds/${build.id}/members/${owner.id}`);
    expect(removeOwner.status).toBe(409);
    expect(removeOwner.body.error.code).toBe('owner_cannot_leave');
    const byEditor = await editor.delete(`/api/builds/${build.id}/members/${owner.id}`);
    expect(byEditor.status).toBe(403);
    expect(byEditor.body.error.code).toBe('forbidden');
    const removed = await ownerClient.delete(`/api/builds/${build.id}/members/${editorUser.id}`);
    expect(removed.status).toBe(204);
    expect(
      await app.deps.db
        .selectFrom('build_members')
        .select('id')
        .where('build_id', '=', build.id)
        .where('user_id', '=', editorUser.id)
        .execute(),
    ).toEqual([]);
    expect(sessionResponse.parse((await editor.get('/api/session')).body).account?.builds).toEqual([]);
    const gone = await editor.get(`/api/builds/${build.id}/members`);
    expect(gone.status).toBe(403);
    expect(gone.body.error.code).toBe('forbidden');
    const missing = await ownerClient.delete(`/api/builds/${build.id}/members/${editorUser.id}`);
    expect(missing.status).toBe(404);
    expect(missing.body.error.code).toBe('not_found');
  });

  it('resend sends a fresh link and the old one stops working; revoke closes the invitation', async () => {
    const { build } = await createOwnedBuild(app.deps.db, { owner: { email: 'owner2@example.test' } });
    await createUser(app.deps.db, { email: 'late@example.test' });
    const ownerClient = await signedInClient(app, 'owner2@example.test');
    const invitee = await signedInClient(app, 'late@example.test');

    const first = await invite(ownerClient, build.id, 'late@example.test');
    app.smtp.clear();
    const resent = await ownerClient.post(`/api/invitations/${first.invitation.id}/resend`, {});
    expect(resent.status).toBe(200);
    expect(invitation.parse(resent.body)).toMatchObject({ id: first.invitation.id, status: 'pending' });
    await app.runJobs();
    const second = linkFromMail(app.smtp, 'late@example.test', '/invitations/accept');
    expect(second.token).not.toBe(first.token);

    const old = await invitee.post('/api/invitations/lookup', { token: first.token });
    expect(old.status).toBe(404);
    expect(old.body.error.code).toBe('not_found');
    const oldAccept = await invitee.post('/api/invitations/accept', { token: first.token });
    expect(oldAccept.status).toBe(404);
    expect(oldAccept.body.error.code).toBe('not_found');
    expect((await invitee.post('/api/invitations/lookup', { token: second.token })).body.status).toBe('pending');

    const revoked = await ownerClient.delete(`/api/invitations/${first.invitation.id}`);
    expect(revoked.status).toBe(204);
    const lookup = await invitee.post('/api/invitations/lookup', { token: second.token });
    expect(lookup.status).toBe(200);
    expect(lookup.body.status).toBe('revoked');
    const accept = await invitee.post('/api/invitations/accept', { token: second.token });
    expect(accept.status).toBe(409);
    expect(accept.body.error.code).toBe('invitation_closed');
    const resendRevoked = await ownerClient.post(`/api/invitations/${first.invitation.id}/resend`, {});
    expect(resendRevoked.status).toBe(409);
    expect(resendRevoked.body.error.code).toBe('invitation_closed');
    const revokeAgain = await ownerClient.delete(`/api/invitations/${first.invitation.id}`);
    expect(revokeAgain.status).toBe(409);
    expect(revokeAgain.body.error.code).toBe('invitation_closed');

    const list = invitationList.parse((await ownerClient.get(`/api/builds/${build.id}/invitations`)).body);
    expect(list.items.map((i) => i.status)).toEqual(['revoked']);
    expect(
      await app.deps.db
        .selectFrom('build_members')
        .select('user_id')
        .where('build_id', '=', build.id)
        .where('role', '=', 'editor')
        .execute(),
    ).toEqual([]);
  });

  it('refuses an expired invitation with 409 invitation_closed', async () => {
    const { build } = await createOwnedBuild(app.deps.db, { owner: { email: 'owner3@example.test' } });
    await createUser(app.deps.db, { email: 'slow@example.test' });
    const ownerClient = await signedInClient(app, 'owner3@example.test');
    const sent = await invite(ownerClient, build.id, 'slow@example.test');
    await app.deps.db
      .updateTable('invitations')
      .set({ expires_at: new Date(Date.now() - 1000) })
      .where('id', '=', sent.invitation.id)
      .execute();
    const invitee = await signedInClient(app, 'slow@example.test');
    expect((await invitee.post('/api/invitations/lookup', { token: sent.token })).body.status).toBe('expired');
    const res = await invitee.post('/api/invitations/accept', { token: sent.token });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('invitation_closed');
  });

  it('asks a visitor to sign in before accepting (401 unauthenticated); the link stays usable', async () => {
    const { build } = await createOwnedBuild(app.deps.db, { owner: { email: 'owner4@example.test' } });
    const ownerClient = await signedInClient(app, 'owner4@example.test');
    const sent = await invite(ownerClient, build.id, 'visitor@example.test');
    const visitor = new TestClient(app.baseUrl);
    const res = await visitor.post('/api/invitations/accept', { token: sent.token });
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthenticated');
    expect((await visitor.post('/api/invitations/lookup', { token: sent.token })).body.status).toBe('pending');
  });
});
