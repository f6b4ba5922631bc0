import { disclosureLine } from '../../src/shared/disclosure';
import { episodeDisclosure } from './disclosure';
import type { Kysely } from 'kysely';
import { paths } from '../../src/shared/paths';
import type { AppDeps } from '../app-deps';
import type { Database } from '../db/database';
import type { NoticeEmail } from '../db/followers-tables';
import { noticeMail } from './notice-mail';
import { noticeRecipients, type NoticeRecipient } from './notice-recipients';
import { noticeSponsorMembers } from './sponsor-notices';

export type NoticeDeps = Pick<AppDeps, 'outbox' | 'config'>;
type Trx = Kysely<Database>;

async function episodeFacts(trx: Trx, episodeId: number) {
  return trx
    .selectFrom('episodes as e')
    .innerJoin('builds as b', 'b.id', 'e.build_id')
    .innerJoin('users as o', 'o.id', 'b.owner_id')
    .select(['e.id', 'e.number', 'e.title', 'e.slug', 'e.summary', 'b.id as build_id', 'b.title as build_title', 'b.slug as build_slug'])
    .select(['b.visibility', 'b.owner_id', 'o.handle as owner_handle', 'o.display_name as owner_name'])
    .where('e.id', '=', episodeId)
    .executeTakeFirstOrThrow();
}
type EpisodeFacts = Awaited<ReturnType<typeof episodeFacts>>;
const episodePath = (e: EpisodeFacts) => paths.episode(e.owner_handle, e.build_slug, e.slug);

/**
 * Announces a newly published episode to the people following its build or (for a public build)
 * its creator: once per episode, ever (publish now, the scheduled job, or a re-publish), and once
 * per person however many of their follows match; and the members of each organisation whose
 * support is on it (sponsor-notices.ts). Call inside the publishing transaction.
 */
export async function announceEpisode(trx: Trx, deps: NoticeDeps, episodeId: number): Promise<number> {
  // Sponsors' members are told on every publish, once each per episode (their own unique index),
  // so support added before a re-publish still reaches its organisation.
  await noticeSponsorMembers(trx, deps, episodeId);
  const fresh = await trx
    .insertInto('episode_announcements')
    .values({ episode_id: episodeId })
    .onConflict((oc) => oc.column('episode_id').doNothing())
    .returning('episode_id')
    .executeTakeFirst();
  if (!fresh) return 0;
  const e = await episodeFacts(trx, episodeId);
  if (e.visibility === 'private') return 0;
  const followers = await trx
    .selectFrom('follows')
    .select('user_id')
    .distinct()
    .where((eb) => eb.or([eb('build_id', '=', e.build_id), ...(e.visibility === 'public' ? [eb('creator_id', '=', e.owner_id)] : [])]))
    .where('user_id', 'not in', trx.selectFrom('build_members').select('user_id').where('build_id', '=', e.build_id))
    .execute();
  let mailed = 0;
  // The disclosure goes first in the mail, as on the page (CAP/ASA guide: up front).
  const disclosure = await episodeDisclosure(trx, episodeId);
  for (const r of await noticeRecipients(
    trx,
    followers.map((f) => f.user_id),
  )) {
    const mode = r.prefs.newEpisodes;
    const email: NoticeEmail = !r.address || mode === 'none' ? 'none' : mode === 'weekly' ? 'digest' : 'sent';
    const row = await trx
      .insertInto('notifications')
      .values({ user_id: r.userId, kind: 'new-episode', episode_id: episodeId, email })
      .onConflict((oc) => oc.columns(['user_id', 'episode_id']).where('kind', '=', 'new-episode').doNothing())
      .returning('id')
      .executeTakeFirst();
    if (!row || email !== 'sent') continue;
    await deps.outbox.enqueue(
      trx,
      noticeMail(deps.config, {
        to: r.address!,
        userId: r.userId,
        scope: 'new-episodes',
        kind: 'notice-new-episode',
        subject: `New episode of ${e.build_title}: ${e.title}`,
        paragraphs: [
          ...(disclosure ? [disclosureLine(disclosure)] : []),
          `${e.owner_name} published episode ${e.number} of ${e.build_title}: “${e.title}”.`,
          ...(e.summary ? [e.summary] : []),
        ],
        links: [{ label: 'Read the episode', path: episodePath(e) }],
        reason: `You follow ${e.build_title} or ${e.owner_name} on Rivet & Reel.`,
      }),
    );
    mailed += 1;
  }
  return mailed;
}

async function postFacts(trx: Trx, postId: number) {
  return trx
    .selectFrom('posts as p')
    .innerJoin('users as a', 'a.id', 'p.author_id')
    .select([
      'p.id',
      'p.kind',
      'p.state',
      'p.episode_id',
      'p.author_id',
      'p.parent_id',
      'p.body',
      'p.adopted_note',
      'a.display_name as author_name',
    ])
    .where('p.id', '=', postId)
    .executeTakeFirstOrThrow();
}

async function notify(
  trx: Trx,
  deps: NoticeDeps,
  r: NoticeRecipient,
  n: { kind: 'reply' | 'state-change' | 'new-post'; episodeId: number; postId: number; email: NoticeEmail },
  mail: () => Parameters<typeof noticeMail>[1],
): Promise<void> {
  const email: NoticeEmail = r.address ? n.email : 'none';
  await trx
    .insertInto('notifications')
    .values({ user_id: r.userId, kind: n.kind, episode_id: n.episodeId, post_id: n.postId, email })
    .execute();
  if (email === 'sent') await deps.outbox.enqueue(trx, noticeMail(deps.config, mail()));
}

const excerpt = (s: string) => (s.length > 140 ? `${s.slice(0, 139)}…` : s);

/** A new question or suggestion: tells the build team (except its author). */
export async function noticeNewPost(trx: Trx, deps: NoticeDeps, postId: number): Promise<void> {
  const p = await postFacts(trx, postId);
  const e = await episodeFacts(trx, p.episode_id);
  const team = await trx.selectFrom('build_members').select('user_id').where('build_id', '=', e.build_id).execute();
  const ids = team.map((t) => t.user_id).filter((id) => id !== p.author_id);
  for (const r of await noticeRecipients(trx, ids)) {
    const mode = r.prefs.newPosts;
    await notify(
      trx,
      deps,
      r,
      { kind: 'new-post', episodeId: e.id, postId, email: mode === 'each' ? 'sent' : mode === 'daily' ? 'digest' : 'none' },
      () => ({
        to: r.address!,
        userId: r.userId,
        scope: 'new-posts',
        kind: 'notice-new-post',
        subject: `New ${p.kind} on ${e.build_title}, episode ${e.number}`,
        paragraphs: [
          `${p.author_name} ${p.kind === 'suggestion' ? 'made a suggestion' : 'asked a question'} on “${e.title}”:`,
          excerpt(p.body),
        ],
        links: [{ label: 'Answer it in your inbox', path: '/inbox' }],
        reason: `You are on the build team of ${e.build_title}.`,
      }),
    );
  }
}

/** A reply: tells the author of the post it answers (unless they wrote the reply). */
export async function noticeReply(trx: Trx, deps: NoticeDeps, replyId: number): Promise<void> {
  const reply = await postFacts(trx, replyId);
  const parent = await postFacts(trx, reply.parent_id!);
  if (parent.author_id === reply.author_id) return;
  const e = await episodeFacts(trx, parent.episode_id);
  const [r] = await noticeRecipients(trx, [parent.author_id]);
  if (!r) return;
  await notify(trx, deps, r, { kind: 'reply', episodeId: e.id, postId: parent.id, email: r.prefs.replies ? 'sent' : 'none' }, () => ({
    to: r.address!,
    userId: r.userId,
    scope: 'replies',
    kind: 'notice-reply',
    subject: `${reply.author_name} replied to your ${parent.kind} on ${e.build_title}`,
    paragraphs: [`${reply.author_name} replied to your ${parent.kind} on episode ${e.number}, “${e.title}”:`, excerpt(reply.body)],
    links: [{ label: 'See the reply', path: `${episodePath(e)}#post-${parent.id}` }],
    reason: 'You posted on this episode.',
  }));
}

const STATE_WORDS: Record<string, string> = { open: 'reopened', answered: 'marked answered', adopted: 'adopted', 'set-aside': 'set aside' };

/** A state change: tells the post's author (unless they made the change). */
export async function noticeStateChange(trx: Trx, deps: NoticeDeps, postId: number, byUserId: number): Promise<void> {
  const p = await postFacts(trx, postId);
  if (p.author_id === byUserId) return;
  const e = await episodeFacts(trx, p.episode_id);
  const [r] = await noticeRecipients(trx, [p.author_id]);
  if (!r) return;
  const words = STATE_WORDS[p.state ?? 'open'];
  await notify(trx, deps, r, { kind: 'state-change', episodeId: e.id, postId, email: r.prefs.stateChanges ? 'sent' : 'none' }, () => ({
    to: r.address!,
    userId: r.userId,
    scope: 'state-changes',
    kind: 'notice-state-change',
    subject: `Your ${p.kind} on ${e.build_title} was ${words}`,
    paragraphs: [
      `The build team of ${e.build_title} ${words} your ${p.kind} on episode ${e.number}, “${e.title}”.`,
      ...(p.adopted_note ? [`What changed: ${p.adopted_note}`] : []),
    ],
    links: [{ label: 'See it on the episode', path: `${episodePath(e)}#post-${p.id}` }],
    reason: 'You posted on this episode.',
  }));
}
