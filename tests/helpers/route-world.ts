// The world of actors every route is called by: the authorisation matrix (every route × every
// kind of actor, with the status each must get) and the fresh cast of people, builds and records
// those requests name. Shared by the authorisation matrix and the fuzz suite: a new route needs one
// row in `routeMatrix`, and both suites read it. The expected statuses are written by hand from
// DESIGN.md's role table ("People and roles"), not recorded from what the code answers. Mutations
// are sent with a body the schema refuses, so an allowed actor gets 400 (it passed the policy) and
// nothing changes; routes without a body act for real, which is why the matrix gives each route a
// fresh world.
import { sql } from 'kysely';
import { hashToken } from '../../server/services/tokens';
import { createBuild, createUser } from './factories';
import { signInByEmail, TestClient } from './http-client';
import type { TestApp } from './test-app';

export const ACTORS = ['visitor', 'follower', 'editor', 'owner', 'otherOwner', 'sponsorMember', 'admin'] as const;
export type ActorName = (typeof ACTORS)[number];
export type Row = Record<ActorName, number>;

export interface World {
  ids: {
    buildA: number;
    editor: number;
    follower: number;
    invitation: number;
    draft: number;
    openItem: number;
    partLine: number;
    figure: number;
    photo: number;
    receipt: number;
    /** A question by the follower on a published episode of build A. */
    post: number;
    /** A sponsorship of build A by the world's sponsor. */
    sponsorship: number;
  };
  slugs: { owner: string; buildA: string; draft: string };
  clients: Record<ActorName, TestClient>;
}

/** Expected status per actor; `all(s)` for routes anyone may call. */
const all = (s: number): Row => ({ visitor: s, follower: s, editor: s, owner: s, otherOwner: s, sponsorMember: s, admin: s });
const signedIn = (s: number): Row => ({ ...all(s), visitor: 401 });
const ownerOnly = (s: number): Row => ({
  visitor: 401,
  follower: 403,
  editor: 403,
  owner: s,
  otherOwner: 403,
  sponsorMember: 403,
  admin: 403,
});
const teamOnly = (s: number): Row => ({ ...ownerOnly(s), editor: s });
const adminOnly = (s: number): Row => ({
  visitor: 401,
  follower: 403,
  editor: 403,
  owner: 403,
  otherOwner: 403,
  sponsorMember: 403,
  admin: s,
});
/** A draft episode exists only for its build team: everyone else gets 404, visitors included. */
const draftTeam = (s: number, editor = s, owner = s): Row => ({
  visitor: 404,
  follower: 404,
  editor,
  owner,
  otherOwner: 404,
  sponsorMember: 404,
  admin: 404,
});

/** Route → request to send (with the world's ids) → expected statuses. Later issues add rows. */
export interface MatrixRow {
  /** The request to send, with the world's ids; a body the schema refuses for mutations. */
  request: (w: World) => { path: string; body?: unknown };
  /** Expected status per actor. */
  expect: Row;
  /** The request acts for real (a delete): each actor gets a fresh world. */
  freshWorldPerActor?: boolean;
}

/** Route (`METHOD /path` as in the registry) → request to send → expected statuses. Every route needs a row. */
export const routeMatrix: Record<string, MatrixRow> = {
  'GET /health': { request: () => ({ path: '/api/health' }), expect: all(200) },
  'GET /episodes': { request: () => ({ path: '/api/episodes' }), expect: all(200) },
  'GET /session': { request: () => ({ path: '/api/session' }), expect: all(200) },
  'GET /csrf-token': { request: () => ({ path: '/api/csrf-token' }), expect: all(200) },
  'POST /session/sign-out': { request: () => ({ path: '/api/session/sign-out', body: { junk: 1 } }), expect: signedIn(400) },
  'POST /sign-in-links': { request: () => ({ path: '/api/sign-in-links', body: { email: 'not an address' } }), expect: all(400) },
  'POST /sign-in-links/redeem': { request: () => ({ path: '/api/sign-in-links/redeem', body: { token: 'short' } }), expect: all(400) },
  'PATCH /account': { request: () => ({ path: '/api/account', body: {} }), expect: signedIn(400) },
  'GET /account/export': { request: () => ({ path: '/api/account/export' }), expect: signedIn(200) },
  // Owners must transfer or delete their builds first (409); everyone else's account goes (204).
  'DELETE /account': { request: () => ({ path: '/api/account' }), expect: { ...signedIn(204), owner: 409, otherOwner: 409 } },
  'GET /builds/:buildId/members': { request: (w) => ({ path: `/api/builds/${w.ids.buildA}/members` }), expect: teamOnly(200) },
  'DELETE /builds/:buildId/members/:userId': {
    request: (w) => ({ path: `/api/builds/${w.ids.buildA}/members/${w.ids.editor}` }),
    expect: ownerOnly(204),
  },
  'GET /builds/:buildId/invitations': { request: (w) => ({ path: `/api/builds/${w.ids.buildA}/invitations` }), expect: ownerOnly(200) },
  'POST /builds/:buildId/invitations': {
    request: (w) => ({ path: `/api/builds/${w.ids.buildA}/invitations`, body: { email: 'nope' } }),
    expect: ownerOnly(400),
  },
  'POST /invitations/:invitationId/resend': {
    request: (w) => ({ path: `/api/invitations/${w.ids.invitation}/resend`, body: { junk: 1 } }),
    expect: ownerOnly(400),
  },
  'DELETE /invitations/:invitationId': { request: (w) => ({ path: `/api/invitations/${w.ids.invitation}` }), expect: ownerOnly(204) },
  'POST /invitations/lookup': { request: () => ({ path: '/api/invitations/lookup', body: { token: 'short' } }), expect: all(400) },
  'POST /invitations/accept': { request: () => ({ path: '/api/invitations/accept', body: { token: 'short' } }), expect: signedIn(400) },
  'GET /admin/accounts': { request: () => ({ path: '/api/admin/accounts' }), expect: adminOnly(200) },
  'POST /admin/accounts/:userId/actions': {
    request: (w) => ({ path: `/api/admin/accounts/${w.ids.follower}/actions`, body: { action: 'bogus' } }),
    expect: adminOnly(400),
  },
  // Builds: anyone signed in may start one; the owner manages it; a public build is readable by all.
  'POST /builds': { request: () => ({ path: '/api/builds', body: { title: '' } }), expect: signedIn(400) },
  'GET /builds/:buildId': { request: (w) => ({ path: `/api/builds/${w.ids.buildA}` }), expect: all(200) },
  'PATCH /builds/:buildId': { request: (w) => ({ path: `/api/builds/${w.ids.buildA}`, body: {} }), expect: ownerOnly(400) },
  'DELETE /builds/:buildId': {
    request: (w) => ({ path: `/api/builds/${w.ids.buildA}` }),
    expect: ownerOnly(204),
    freshWorldPerActor: true,
  },
  'POST /builds/:buildId/restore': {
    request: (w) => ({ path: `/api/builds/${w.ids.buildA}/restore`, body: { junk: 1 } }),
    expect: ownerOnly(400),
  },
  'POST /builds/:buildId/transfer': {
    request: (w) => ({ path: `/api/builds/${w.ids.buildA}/transfer`, body: {} }),
    expect: ownerOnly(400),
  },
  'DELETE /builds/:buildId/transfer': {
    request: (w) => ({ path: `/api/builds/${w.ids.buildA}/transfer` }),
    expect: ownerOnly(204),
    freshWorldPerActor: true,
  },
  // The world offers build A to its editor: only that editor may accept.
  'POST /builds/:buildId/transfer/accept': {
    request: (w) => ({ path: `/api/builds/${w.ids.buildA}/transfer/accept`, body: { junk: 1 } }),
    expect: { visitor: 401, follower: 403, editor: 400, owner: 403, otherOwner: 403, sponsorMember: 403, admin: 403 },
  },
  'GET /builds/:buildId/episodes': { request: (w) => ({ path: `/api/builds/${w.ids.buildA}/episodes` }), expect: all(200) },
  'POST /builds/:buildId/episodes': {
    request: (w) => ({ path: `/api/builds/${w.ids.buildA}/episodes`, body: { title: '' } }),
    expect: teamOnly(400),
  },
  // Episodes: the build team writes; a draft is hidden from everyone else; only the owner deletes.
  'GET /episodes/:episodeId': { request: (w) => ({ path: `/api/episodes/${w.ids.draft}` }), expect: draftTeam(200) },
  'PATCH /episodes/:episodeId': { request: (w) => ({ path: `/api/episodes/${w.ids.draft}`, body: {} }), expect: draftTeam(400) },
  'POST /episodes/:episodeId/publish': {
    request: (w) => ({ path: `/api/episodes/${w.ids.draft}/publish`, body: {} }),
    expect: draftTeam(400),
  },
  'POST /episodes/:episodeId/schedule': {
    request: (w) => ({ path: `/api/episodes/${w.ids.draft}/schedule`, body: {} }),
    expect: draftTeam(400),
  },
  'POST /episodes/:episodeId/unpublish': {
    request: (w) => ({ path: `/api/episodes/${w.ids.draft}/unpublish`, body: {} }),
    expect: draftTeam(400),
  },
  'DELETE /episodes/:episodeId': {
    request: (w) => ({ path: `/api/episodes/${w.ids.draft}` }),
    expect: draftTeam(204, 403, 204),
    freshWorldPerActor: true,
  },
  'POST /episodes/:episodeId/restore': {
    request: (w) => ({ path: `/api/episodes/${w.ids.draft}/restore`, body: { junk: 1 } }),
    expect: draftTeam(400, 403, 400),
  },
  'GET /builds/:buildId/open-items': { request: (w) => ({ path: `/api/builds/${w.ids.buildA}/open-items` }), expect: teamOnly(200) },
  'POST /builds/:buildId/open-items': {
    request: (w) => ({ path: `/api/builds/${w.ids.buildA}/open-items`, body: { title: '' } }),
    expect: teamOnly(400),
  },
  'PATCH /open-items/:openItemId': { request: (w) => ({ path: `/api/open-items/${w.ids.openItem}`, body: {} }), expect: draftTeam(400) },
  'DELETE /open-items/:openItemId': {
    request: (w) => ({ path: `/api/open-items/${w.ids.openItem}` }),
    expect: draftTeam(204),
    freshWorldPerActor: true,
  },
  // Figures: readable wherever their episode is (a draft's only by its team); the build team writes them.
  'GET /episodes/:episodeId/figures': { request: (w) => ({ path: `/api/episodes/${w.ids.draft}/figures` }), expect: draftTeam(200) },
  'POST /episodes/:episodeId/figures': {
    request: (w) => ({ path: `/api/episodes/${w.ids.draft}/figures`, body: { thread: 'M9' } }),
    expect: draftTeam(400),
  },
  'PUT /figures/:figureId': { request: (w) => ({ path: `/api/figures/${w.ids.figure}`, body: {} }), expect: draftTeam(400) },
  'DELETE /figures/:figureId': {
    request: (w) => ({ path: `/api/figures/${w.ids.figure}` }),
    expect: draftTeam(204),
    freshWorldPerActor: true,
  },
  'GET /workbench': { request: () => ({ path: '/api/workbench' }), expect: signedIn(200) },
  'GET /creators/:handle/builds/:buildSlug': {
    request: (w) => ({ path: `/api/creators/${w.slugs.owner}/builds/${w.slugs.buildA}` }),
    expect: all(200),
  },
  'GET /builds/:buildId/episodes-by-slug/:episodeSlug': {
    request: (w) => ({ path: `/api/builds/${w.ids.buildA}/episodes-by-slug/${w.slugs.draft}` }),
    expect: draftTeam(200),
  },
  // The episode page in one response follows the episode it names: a draft's only for its build team.
  'GET /builds/:buildId/episode-page/:episodeSlug': {
    request: (w) => ({ path: `/api/builds/${w.ids.buildA}/episode-page/${w.slugs.draft}` }),
    expect: draftTeam(200),
  },
  // Reading: the public side is open to all; a draft's page exists only for its build team.
  'GET /builds': { request: () => ({ path: '/api/builds' }), expect: all(200) },
  'GET /builds/:buildId/overview': { request: (w) => ({ path: `/api/builds/${w.ids.buildA}/overview` }), expect: all(200) },
  'GET /episodes/:episodeId/reading': { request: (w) => ({ path: `/api/episodes/${w.ids.draft}/reading` }), expect: draftTeam(200) },
  'GET /creators/:handle': { request: (w) => ({ path: `/api/creators/${w.slugs.owner}` }), expect: all(200) },
  'GET /search': { request: () => ({ path: '/api/search?q=coolant' }), expect: all(200) },
  // Parts: lines follow their episode (a draft's only for its team); the ledger is the build team's;
  // totals are public (published lines only unless the team asks); anyone signed in may name a supplier.
  'GET /episodes/:episodeId/part-lines': { request: (w) => ({ path: `/api/episodes/${w.ids.draft}/part-lines` }), expect: draftTeam(200) },
  'POST /episodes/:episodeId/part-lines': {
    request: (w) => ({ path: `/api/episodes/${w.ids.draft}/part-lines`, body: {} }),
    expect: draftTeam(400),
  },
  'PATCH /part-lines/:partLineId': { request: (w) => ({ path: `/api/part-lines/${w.ids.partLine}`, body: {} }), expect: draftTeam(400) },
  'DELETE /part-lines/:partLineId': {
    request: (w) => ({ path: `/api/part-lines/${w.ids.partLine}` }),
    expect: draftTeam(204),
    freshWorldPerActor: true,
  },
  'GET /builds/:buildId/totals': { request: (w) => ({ path: `/api/builds/${w.ids.buildA}/totals?scope=all` }), expect: all(200) },
  'GET /builds/:buildId/ledger': { request: (w) => ({ path: `/api/builds/${w.ids.buildA}/ledger` }), expect: teamOnly(200) },
  'GET /builds/:buildId/ledger.csv': { request: (w) => ({ path: `/api/builds/${w.ids.buildA}/ledger.csv` }), expect: teamOnly(200) },
  'POST /builds/:buildId/ledger/import': {
    request: (w) => ({ path: `/api/builds/${w.ids.buildA}/ledger/import`, body: { csv: '' } }),
    expect: teamOnly(400),
  },
  'GET /suppliers': { request: () => ({ path: '/api/suppliers?q=a' }), expect: signedIn(200) },
  'POST /suppliers': { request: () => ({ path: '/api/suppliers', body: { name: '' } }), expect: signedIn(400) },
  // Media: the build team uploads and manages; a photo of a public build is public; a receipt is the
  // build team's alone (404 for everyone else, admins included).
  'POST /builds/:buildId/media': { request: (w) => ({ path: `/api/builds/${w.ids.buildA}/media`, body: {} }), expect: teamOnly(400) },
  'GET /media/:mediaId': { request: (w) => ({ path: `/api/media/${w.ids.photo}` }), expect: all(200) },
  'PATCH /media/:mediaId': { request: (w) => ({ path: `/api/media/${w.ids.photo}`, body: {} }), expect: teamOnly(400) },
  'DELETE /media/:mediaId': { request: (w) => ({ path: `/api/media/${w.ids.photo}` }), expect: teamOnly(204), freshWorldPerActor: true },
  'GET /media/:mediaId/download': { request: (w) => ({ path: `/api/media/${w.ids.receipt}/download` }), expect: draftTeam(200) },
  'GET /builds/:buildId/photos': { request: (w) => ({ path: `/api/builds/${w.ids.buildA}/photos` }), expect: teamOnly(200) },
  'GET /builds/:buildId/cover': { request: (w) => ({ path: `/api/builds/${w.ids.buildA}/cover` }), expect: teamOnly(200) },
  'PUT /builds/:buildId/cover': { request: (w) => ({ path: `/api/builds/${w.ids.buildA}/cover`, body: {} }), expect: ownerOnly(400) },
  'GET /episodes/:episodeId/pictures': { request: (w) => ({ path: `/api/episodes/${w.ids.draft}/pictures` }), expect: draftTeam(200) },
  'PUT /episodes/:episodeId/pictures': {
    request: (w) => ({ path: `/api/episodes/${w.ids.draft}/pictures`, body: {} }),
    expect: draftTeam(400),
  },
  'POST /admin/suppliers/:supplierId/merge': {
    request: () => ({ path: '/api/admin/suppliers/1/merge', body: {} }),
    expect: adminOnly(400),
  },
  // Followers: anyone signed in follows, posts, replies and reports; authors edit and delete their
  // own; the build team answers and sets states; the build team and admins hide and restore; admins
  // keep the moderation queue; the one-click unsubscribe needs no session at all.
  'GET /episodes/:episodeId/posts': { request: (w) => ({ path: `/api/episodes/${w.ids.draft}/posts` }), expect: draftTeam(200) },
  'POST /episodes/:episodeId/posts': {
    request: (w) => ({ path: `/api/episodes/${w.ids.draft}/posts`, body: { kind: 'bogus' } }),
    expect: draftTeam(400),
  },
  'POST /posts/:postId/replies': {
    request: (w) => ({ path: `/api/posts/${w.ids.post}/replies`, body: { body: '' } }),
    expect: signedIn(400),
  },
  'PATCH /posts/:postId': {
    request: (w) => ({ path: `/api/posts/${w.ids.post}`, body: { body: '' } }),
    expect: { visitor: 401, follower: 400, editor: 403, owner: 403, otherOwner: 403, sponsorMember: 403, admin: 403 },
  },
  'DELETE /posts/:postId': {
    request: (w) => ({ path: `/api/posts/${w.ids.post}` }),
    expect: { visitor: 401, follower: 204, editor: 403, owner: 403, otherOwner: 403, sponsorMember: 403, admin: 403 },
    freshWorldPerActor: true,
  },
  'PUT /posts/:postId/state': {
    request: (w) => ({ path: `/api/posts/${w.ids.post}/state`, body: { state: 'bogus' } }),
    expect: teamOnly(400),
  },
  'POST /posts/:postId/reports': {
    request: (w) => ({ path: `/api/posts/${w.ids.post}/reports`, body: { reason: '' } }),
    expect: signedIn(400),
  },
  'PUT /posts/:postId/visibility': {
    request: (w) => ({ path: `/api/posts/${w.ids.post}/visibility`, body: {} }),
    expect: { visitor: 401, follower: 403, editor: 400, owner: 400, otherOwner: 403, sponsorMember: 403, admin: 400 },
  },
  'GET /inbox': { request: () => ({ path: '/api/inbox' }), expect: signedIn(200) },
  'GET /moderation/queue': { request: () => ({ path: '/api/moderation/queue' }), expect: adminOnly(200) },
  'PUT /builds/:buildId/follow': {
    request: (w) => ({ path: `/api/builds/${w.ids.buildA}/follow`, body: { junk: 1 } }),
    expect: signedIn(400),
  },
  'DELETE /builds/:buildId/follow': { request: (w) => ({ path: `/api/builds/${w.ids.buildA}/follow` }), expect: signedIn(204) },
  'PUT /creators/:handle/follow': {
    request: (w) => ({ path: `/api/creators/${w.slugs.owner}/follow`, body: { junk: 1 } }),
    expect: signedIn(400),
  },
  'DELETE /creators/:handle/follow': { request: (w) => ({ path: `/api/creators/${w.slugs.owner}/follow` }), expect: signedIn(204) },
  'GET /following': { request: () => ({ path: '/api/following' }), expect: signedIn(200) },
  'GET /notifications': { request: () => ({ path: '/api/notifications' }), expect: signedIn(200) },
  'POST /notifications/read': { request: () => ({ path: '/api/notifications/read', body: {} }), expect: signedIn(400) },
  'GET /account/notices': { request: () => ({ path: '/api/account/notices' }), expect: signedIn(200) },
  'PUT /account/notices': { request: () => ({ path: '/api/account/notices', body: {} }), expect: signedIn(400) },
  'POST /unsubscribe': { request: () => ({ path: '/api/unsubscribe', body: {} }), expect: all(400) },
  // Sponsors, the creator's half: organisation names for pickers are public (they are credited on
  // pages); a build's sponsorships are the owner's (DESIGN.md: "settings … sponsorships").
  'GET /sponsors': { request: () => ({ path: '/api/sponsors' }), expect: all(200) },
  'GET /builds/:buildId/sponsorships': { request: (w) => ({ path: `/api/builds/${w.ids.buildA}/sponsorships` }), expect: ownerOnly(200) },
  'POST /builds/:buildId/sponsorships': {
    request: (w) => ({ path: `/api/builds/${w.ids.buildA}/sponsorships`, body: {} }),
    expect: ownerOnly(400),
  },
  'PUT /sponsorships/:sponsorshipId': {
    request: (w) => ({ path: `/api/sponsorships/${w.ids.sponsorship}`, body: {} }),
    expect: ownerOnly(400),
  },
  'DELETE /sponsorships/:sponsorshipId': {
    request: (w) => ({ path: `/api/sponsorships/${w.ids.sponsorship}` }),
    expect: ownerOnly(204),
    freshWorldPerActor: true,
  },
};

/** A fresh cast: build A (public) with its owner and an editor, build B with another owner, a sponsor with a member, an admin. */
export async function makeWorld(app: TestApp, visibility: 'public' | 'unlisted' | 'private' = 'public'): Promise<World> {
  const db = app.deps.db;
  const users = {} as Record<Exclude<ActorName, 'visitor'>, { id: number; email: string }>;
  for (const name of ACTORS.filter((a) => a !== 'visitor')) {
    const u = await createUser(db, { is_admin: name === 'admin' });
    users[name as Exclude<ActorName, 'visitor'>] = { id: u.id, email: u.email! };
  }
  const buildA = await createBuild(db, { owner_id: users.owner.id, visibility });
  const buildB = await createBuild(db, { owner_id: users.otherOwner.id });
  await db
    .insertInto('build_members')
    .values([
      { build_id: buildA.id, user_id: users.owner.id, role: 'owner' },
      { build_id: buildA.id, user_id: users.editor.id, role: 'editor' },
      { build_id: buildB.id, user_id: users.otherOwner.id, role: 'owner' },
    ])
    .execute();
  const sponsor = await db
    .insertInto('sponsors')
    .values({ slug: `sponsor-${buildA.id}`, name: 'Invented Parts Co-op' })
    .returning('id')
    .executeTakeFirstOrThrow();
  await db.insertInto('sponsor_members').values({ sponsor_id: sponsor.id, user_id: users.sponsorMember.id }).execute();
  const sponsorship = await db
    .insertInto('sponsorships')
    .values({ build_id: buildA.id, sponsor_id: sponsor.id, kind: 'gifted', starts_on: '2026-11-01', ends_on: null })
    .returning('id')
    .executeTakeFirstOrThrow();
  const invitation = await db
    .insertInto('invitations')
    .values({
      kind: 'build-editor',
      build_id: buildA.id,
      email: `invitee-${buildA.id}@example.test`,
      token_hash: hashToken(`matrix-token-${buildA.id}`),
      invited_by: users.owner.id,
      expires_at: sql<Date>`now() + interval '7 days'`,
    })
    .returning('id')
    .executeTakeFirstOrThrow();

  await db.updateTable('builds').set({ pending_transfer_to: users.editor.id }).where('id', '=', buildA.id).execute();
  const draft = await db
    .insertInto('episodes')
    .values({
      build_id: buildA.id,
      number: 1,
      slug: `draft-${buildA.id}`,
      title: 'A draft',
      status: 'draft',
      write_up: JSON.stringify({ type: 'doc', content: [{ type: 'paragraph' }] }),
    })
    .returning(['id', 'slug'])
    .executeTakeFirstOrThrow();
  const item = await db
    .insertInto('open_items')
    .values({ build_id: buildA.id, title: 'Refill coolant', opened_in_episode_id: draft.id })
    .returning('id')
    .executeTakeFirstOrThrow();
  const figure = await db
    .insertInto('figures')
    .values({
      episode_id: draft.id,
      position: 0,
      fastener: 'Housing bolts',
      thread: 'M8',
      method: 'torque',
      value: 25,
      unit: 'N-m',
      source: 'measured',
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  const ownerRow = await db.selectFrom('users').select('handle').where('id', '=', users.owner.id).executeTakeFirstOrThrow();

  const clients = {} as Record<ActorName, TestClient>;
  for (const name of ACTORS) {
    clients[name] = new TestClient(app.baseUrl);
    if (name !== 'visitor') await signInByEmail(clients[name], db, users[name].email);
  }
  const partLine = await db
    .insertInto('part_lines')
    .values({
      build_id: buildA.id,
      episode_id: draft.id,
      position: 0,
      kind: 'part',
      description: 'Radiator cap',
      source: 'new',
      status: 'arrived',
      quantity: '1',
      unit_price_minor: 1200,
      currency: 'EUR',
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  const media = (kind: 'photo' | 'receipt', sha: string) =>
    db
      .insertInto('media')
      .values({
        build_id: buildA.id,
        kind,
        sha256: sha,
        object_key: `builds/${buildA.id}/${kind}/${sha}/original.${kind === 'photo' ? 'png' : 'pdf'}`,
        content_type: kind === 'photo' ? 'image/png' : 'application/pdf',
        size_bytes: 4,
        width: kind === 'photo' ? 10 : null,
        height: kind === 'photo' ? 10 : null,
      })
      .returning(['id', 'object_key'])
      .executeTakeFirstOrThrow();
  const photo = await media('photo', 'a'.repeat(64));
  const receipt = await media('receipt', 'b'.repeat(64));
  await app.deps.storage.put(receipt.object_key, Buffer.from('%PDF'), 'application/pdf');
  const published = await db
    .insertInto('episodes')
    .values({
      build_id: buildA.id,
      number: 2,
      slug: `published-${buildA.id}`,
      title: 'Out already',
      status: 'published',
      published_at: new Date(),
      write_up: JSON.stringify({ type: 'doc', content: [{ type: 'paragraph' }] }),
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  const post = await db
    .insertInto('posts')
    .values({
      episode_id: published.id,
      build_id: buildA.id,
      author_id: users.follower.id,
      kind: 'question',
      state: 'open',
      chapter_start_seconds: 0,
      body: 'Which stands are those?',
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  return {
    ids: {
      buildA: buildA.id,
      editor: users.editor.id,
      follower: users.follower.id,
      invitation: invitation.id,
      draft: draft.id,
      openItem: item.id,
      partLine: partLine.id,
      figure: figure.id,
      photo: photo.id,
      receipt: receipt.id,
      post: post.id,
      sponsorship: sponsorship.id,
    },
    slugs: { owner: ownerRow.handle, buildA: buildA.slug, draft: draft.slug },
    clients,
  };
}
