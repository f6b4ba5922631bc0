import { EDIT_WINDOW_MINUTES, type Post, type Reply } from '../../src/shared/schemas/posts';
import type { PostKind, PostStateColumn } from '../db/followers-tables';

/** A post row as the read queries select it (author joined). */
export interface PostRow {
  id: number;
  parent_id: number | null;
  kind: PostKind;
  state: PostStateColumn | null;
  chapter_start_seconds: number | null;
  at_seconds: number | null;
  body: string;
  adopted_note: string | null;
  by_team: boolean;
  author_id: number;
  author_handle: string;
  author_name: string;
  created_at: Date;
  edited_at: Date | null;
  hidden_at: Date | null;
  hidden_reason: string | null;
}

export const POST_COLUMNS = [
  'p.id',
  'p.parent_id',
  'p.kind',
  'p.state',
  'p.chapter_start_seconds',
  'p.at_seconds',
  'p.body',
  'p.adopted_note',
  'p.by_team',
  'p.author_id',
  'a.handle as author_handle',
  'a.display_name as author_name',
  'p.created_at',
  'p.edited_at',
  'p.hidden_at',
  'p.hidden_reason',
] as const;

/** A reply as readers get it; `viewerId` decides `mine` and the edit window. */
export function presentReply(r: PostRow, viewerId: number | null, now = Date.now()): Reply {
  const mine = viewerId !== null && r.author_id === viewerId;
  const until = r.created_at.getTime() + EDIT_WINDOW_MINUTES * 60_000;
  return {
    id: r.id,
    author: { handle: r.author_handle, displayName: r.author_name },
    byTeam: r.by_team,
    body: r.body,
    createdAt: r.created_at.toISOString(),
    editedAt: r.edited_at?.toISOString() ?? null,
    hidden: r.hidden_at !== null,
    mine,
    editableUntil: mine && until > now ? new Date(until).toISOString() : null,
  };
}

/** A question or suggestion with its replies (already filtered for the viewer). */
export function presentPost(r: PostRow, replies: PostRow[], viewerId: number | null): Post {
  return {
    ...presentReply(r, viewerId),
    kind: r.kind === 'suggestion' ? 'suggestion' : 'question',
    state: r.state ?? 'open',
    chapterStartSeconds: r.chapter_start_seconds ?? 0,
    atSeconds: r.at_seconds,
    adoptedNote: r.adopted_note,
    hiddenReason: r.hidden_at ? r.hidden_reason : null,
    replies: replies.map((x) => presentReply(x, viewerId)),
  };
}

/** Groups rows (parents and replies, any order) into presented posts, parents in the given order. */
export function presentThreads(rows: PostRow[], viewerId: number | null): Post[] {
  const replies = new Map<number, PostRow[]>();
  for (const r of rows) if (r.parent_id !== null) replies.set(r.parent_id, [...(replies.get(r.parent_id) ?? []), r]);
  return rows.filter((r) => r.parent_id === null).map((r) => presentPost(r, replies.get(r.id) ?? [], viewerId));
}
