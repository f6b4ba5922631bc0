// Words and rules of posts without their zod schemas (src/shared/schemas/posts.ts), for code that
// must not load zod: the public episode page.

export const POST_KINDS = ['question', 'suggestion'] as const;
export type PostKind = (typeof POST_KINDS)[number];
export const POST_STATES = ['open', 'answered', 'adopted', 'set-aside'] as const;
export type PostState = (typeof POST_STATES)[number];
/** The states each kind may take; anything else is refused with 400. */
export const STATES_BY_KIND: Record<PostKind, readonly PostState[]> = {
  question: ['open', 'answered'],
  suggestion: ['open', 'adopted', 'set-aside'],
};
export const STATE_LABELS: Record<PostState, string> = { open: 'Open', answered: 'Answered', adopted: 'Adopted', 'set-aside': 'Set aside' };
/** Authors may edit for this long after posting; edits are marked. */
export const EDIT_WINDOW_MINUTES = 15;
