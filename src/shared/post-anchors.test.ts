import { describe, expect, it } from 'vitest';
import { chapterIndexAt, groupByChapter } from './post-anchors';

const chapters = [{ startSeconds: 0 }, { startSeconds: 120 }, { startSeconds: 400 }];

describe('post anchors', () => {
  it('finds the chapter holding a moment, the boundary belonging to the later chapter', () => {
    expect(chapterIndexAt(chapters, 0)).toBe(0);
    expect(chapterIndexAt(chapters, 119)).toBe(0);
    expect(chapterIndexAt(chapters, 120)).toBe(1);
    expect(chapterIndexAt(chapters, 9999)).toBe(2);
  });

  it('regroups posts when chapters move: the moment decides, not the chapter the post was made on', () => {
    const posts = [
      { id: 1, atSeconds: 150, chapterStartSeconds: 120 },
      { id: 2, atSeconds: null, chapterStartSeconds: 400 },
    ];
    expect(groupByChapter(chapters, posts).map((g) => g.map((p) => p.id))).toEqual([[], [1], [2]]);
    const moved = [{ startSeconds: 0 }, { startSeconds: 160 }, { startSeconds: 400 }];
    expect(groupByChapter(moved, posts).map((g) => g.map((p) => p.id))).toEqual([[1], [], [2]]);
  });
});
