// Posts are stored against a moment of the video (the chapter's start, or a moment inside it), not
// a chapter row: the chapter is worked out when reading, from the chapters as they are now.

/** The index of the chapter that holds a moment: the last one starting at or before it (else the first). */
export function chapterIndexAt(chapters: ReadonlyArray<{ startSeconds: number }>, seconds: number): number {
  let found = 0;
  chapters.forEach((c, i) => {
    if (c.startSeconds <= seconds) found = i;
  });
  return found;
}

/** The moment a post is about: its own, else its chapter's start. */
export const postMoment = (p: { atSeconds: number | null; chapterStartSeconds: number }) => p.atSeconds ?? p.chapterStartSeconds;

/** Posts grouped by the chapter that holds them now, one list per chapter in order. */
export function groupByChapter<P extends { atSeconds: number | null; chapterStartSeconds: number }>(
  chapters: ReadonlyArray<{ startSeconds: number }>,
  posts: readonly P[],
): P[][] {
  const groups: P[][] = chapters.map(() => []);
  if (!chapters.length) return groups;
  for (const p of posts) groups[chapterIndexAt(chapters, postMoment(p))]!.push(p);
  return groups;
}
