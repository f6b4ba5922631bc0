import { describe, expect, it } from 'vitest';
import {
  chapterEnds,
  chapterLink,
  checkTime,
  exportChapterBlock,
  formatTime,
  importChapterBlock,
  parseTime,
  validateChapters,
} from './chapters';

// Sources of the check values:
// - times: arithmetic of the sexagesimal clock (1 min = 60 s, 1 h = 3600 s);
// - chapter rules (first at 0:00, at least three, ascending, each at least 10 s): common practice
//   of video hosts (REFERENCES.md "Chapter markers"); "exactly 10 s is allowed": DESIGN.md;
// - direct-file links: W3C Media Fragments URI 1.0, temporal dimension (`#t=90`);
// - hosted links: the build's pattern, default `t={seconds}` (src/shared/schemas/builds.ts).

const ch = (startSeconds: number, title = `At ${startSeconds}`) => ({ startSeconds, title });
const messages = (p: Array<{ message: string }>) => p.map((x) => x.message);

describe('parseTime and formatTime', () => {
  it.each([
    ['0:05', 5], // clock arithmetic
    ['1:05', 65], // 1 × 60 + 5
    ['12:34', 754], // 12 × 60 + 34
    ['59:59', 3599], // the last second under an hour
    ['1:02:05', 3725], // 3600 + 120 + 5
    ['01:02:03', 3723], // zero-padded hours, as some hosts write them
    ['0:00:00', 0], // hours written as zero (our own export's wide form)
    ['  2:10 ', 130], // surrounding spaces from a paste
  ])('reads %s as %i seconds', (text, seconds) => {
    expect(parseTime(text)).toBe(seconds);
  });

  it.each([
    ['', 'needs a time'],
    ['1:60', 'seconds go up to 59'], // a minute has 60 seconds, 0–59
    ['1:5', 'two digits'],
    ['-1:00', 'not a time'],
    ['1:ab', 'not a time'],
    ['abc', 'not a time'],
    ['90', 'not a time'],
    ['1:02:03:04', 'not a time'],
    ['75:00', 'h:mm:ss'], // 75 minutes: the hour must be written
    ['1:2:03', 'minutes need two digits'],
    ['1:60:00', 'minutes need two digits up to 59'],
  ])('refuses %j with a message', (text, words) => {
    const r = checkTime(text);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toContain(words);
    expect(parseTime(text)).toBeNull();
  });

  it.each([
    [0, '0:00'],
    [5, '0:05'],
    [65, '1:05'],
    [3599, '59:59'],
    [3600, '1:00:00'], // from an hour, h:mm:ss
    [3725, '1:02:05'], // the brief's example: 3600 + 2 × 60 + 5
    [36_000 + 61, '10:01:01'],
  ])('formats %i as %s (clock arithmetic)', (seconds, text) => {
    expect(formatTime(seconds)).toBe(text);
    expect(parseTime(text)).toBe(seconds);
  });

  it('forces hours for a list of one width, drops fractions, refuses negatives', () => {
    expect(formatTime(65, { withHours: true })).toBe('0:01:05');
    expect(formatTime(65.9)).toBe('1:05');
    expect(() => formatTime(-1)).toThrow(RangeError);
    expect(() => formatTime(Number.NaN)).toThrow(RangeError);
  });
});

describe('validateChapters', () => {
  it('accepts a good list', () => {
    expect(validateChapters([ch(0), ch(65), ch(130)], { durationSeconds: 200, forExport: true })).toEqual([]);
  });

  it('needs titles', () => {
    expect(validateChapters([ch(0, '  '), ch(30)])).toEqual([{ index: 0, field: 'title', message: 'Needs a title' }]);
  });

  it('needs strictly ascending times, in words', () => {
    expect(validateChapters([ch(0), ch(70), ch(65)])).toEqual([
      { index: 2, field: 'startSeconds', message: 'Starts at 1:05, before the chapter above (1:10): chapters must go in time order' },
    ]);
    expect(messages(validateChapters([ch(0), ch(70), ch(70)]))).toEqual([
      'Starts at 1:10, the same time as the chapter above: each chapter needs its own start',
    ]);
  });

  // Common practice of video hosts: at least 10 s; DESIGN.md: exactly 10 s is allowed.
  it.each([
    [9, 1],
    [10, 0],
    [11, 0],
  ])('a chapter %i seconds long gives %i problems', (length, count) => {
    const problems = validateChapters([ch(0), ch(length), ch(length + 60)]);
    expect(problems).toHaveLength(count);
    if (count)
      expect(problems[0]).toMatchObject({
        index: 0,
        field: 'startSeconds',
        message: 'Only 9 seconds long (the next chapter starts at 0:09): each chapter must be at least 10 seconds',
      });
  });

  it.each([
    [109, 1],
    [110, 0],
    [111, 0],
  ])('the last chapter counts against a duration of %i s (starts at 100 s)', (duration, count) => {
    expect(validateChapters([ch(0), ch(100)], { durationSeconds: duration })).toHaveLength(count);
  });

  it('refuses chapters at or past the duration, and ignores an unknown duration', () => {
    expect(validateChapters([ch(0), ch(100)], { durationSeconds: 100 })).toEqual([
      { index: 1, field: 'startSeconds', message: 'Starts at 1:40, at or after the end of the video (1:40)' },
    ]);
    expect(messages(validateChapters([ch(0), ch(4000)], { durationSeconds: 3725 }))).toEqual([
      'Starts at 1:06:40, at or after the end of the video (1:02:05)',
    ]);
    expect(validateChapters([ch(0), ch(100)], { durationSeconds: null })).toEqual([]);
  });

  it('for export: the first at 0:00 and at least three (common practice of video hosts)', () => {
    expect(validateChapters([ch(5), ch(65), ch(130)], { forExport: true })).toEqual([
      { index: 0, field: 'startSeconds', message: 'Starts at 0:05: for the video host the first chapter must start at 0:00' },
    ]);
    expect(validateChapters([ch(0), ch(65)], { forExport: true })).toEqual([
      { index: 1, field: 'startSeconds', message: 'Video hosts show chapters only from 3 on: add 1 more' },
    ]);
    expect(validateChapters([], { forExport: true })).toEqual([
      { index: 0, field: 'startSeconds', message: 'Video hosts show chapters only from 3 on: add 3 more' },
    ]);
    // Without forExport neither rule applies: a draft may start anywhere and have one chapter.
    expect(validateChapters([ch(5)])).toEqual([]);
  });

  it('reports a missing start time instead of comparing it', () => {
    expect(validateChapters([ch(0), ch(Number.NaN), ch(60)])).toEqual([
      { index: 1, field: 'startSeconds', message: 'Needs a start time such as 1:05' },
    ]);
  });
});

describe('importChapterBlock and exportChapterBlock', () => {
  it('reads the separators people paste', () => {
    const text = [
      '0:00 Intro',
      '1:05 - Removing the caliper',
      '',
      '(2:10) Bleeding',
      '2:30 – New pads',
      '3:00: Test drive',
      '[4:00] Outro',
      '01:02:03 Late',
    ].join('\n');
    expect(importChapterBlock(text)).toEqual({
      chapters: [
        ch(0, 'Intro'),
        ch(65, 'Removing the caliper'),
        ch(130, 'Bleeding'),
        ch(150, 'New pads'),
        ch(180, 'Test drive'),
        ch(240, 'Outro'),
        ch(3723, 'Late'),
      ],
      problems: [],
    });
  });

  it('reports lines without a time, bad times and missing titles by line number', () => {
    const { chapters, problems } = importChapterBlock('Parts list below\r\n0:00 Intro\r\n1:5 Oops\r\n1:60 Oops\r\n2:00\r\n');
    expect(chapters).toEqual([ch(0, 'Intro')]);
    expect(problems.map((p) => p.line)).toEqual([1, 3, 4, 5]);
    expect(problems[0]?.message).toBe('Line 1 has no start time at the beginning, as in “0:00 Intro”');
    expect(problems[1]?.message).toContain('two digits');
    expect(problems[3]?.message).toBe('Line 5 has a time but no title');
  });

  it('exports m:ss lines, one width for all once any chapter is past an hour', () => {
    expect(exportChapterBlock([ch(0, 'Intro'), ch(65, 'Caliper'), ch(130, 'Pads')])).toBe('0:00 Intro\n1:05 Caliper\n2:10 Pads');
    expect(exportChapterBlock([ch(0, 'Intro'), ch(65, 'Caliper'), ch(3725, 'Test\ndrive')])).toBe(
      '0:00:00 Intro\n0:01:05 Caliper\n1:02:05 Test drive',
    );
  });

  it('puts the disclosure first and round-trips', () => {
    const list = [ch(0, 'Intro'), ch(65, 'Removing the caliper'), ch(3725, 'Test drive')];
    const block = exportChapterBlock(list, { disclosure: 'Ad: parts gifted by an invented supplier' });
    expect(block.split('\n').slice(0, 2)).toEqual(['Ad: parts gifted by an invented supplier', '']);
    const back = importChapterBlock(block);
    expect(back.chapters).toEqual(list);
    expect(back.problems.map((p) => p.line)).toEqual([1]);
    expect(importChapterBlock(exportChapterBlock(list)).problems).toEqual([]);
    expect(exportChapterBlock(list, { disclosure: '  ' })).toBe(exportChapterBlock(list));
  });
});

describe('chapterEnds', () => {
  it('ends each chapter at the next start, the last at the duration or null', () => {
    expect(chapterEnds([ch(0), ch(65), ch(130)], 200)).toEqual([65, 130, 200]);
    expect(chapterEnds([ch(0), ch(65)], null)).toEqual([65, null]);
    expect(chapterEnds([], 200)).toEqual([]);
  });
});

describe('chapterLink', () => {
  // W3C Media Fragments URI 1.0, temporal dimension: `#t=90` starts playback at 90 s.
  it.each([
    ['https://cdn.example.com/ep1.mp4', 'https://cdn.example.com/ep1.mp4#t=90'],
    ['https://cdn.example.com/ep1.WEBM?x=1', 'https://cdn.example.com/ep1.WEBM?x=1#t=90'],
    ['https://cdn.example.com/ep1.ogv#t=5', 'https://cdn.example.com/ep1.ogv#t=90'],
    ['https://cdn.example.com/a.mov', 'https://cdn.example.com/a.mov#t=90'],
    ['https://cdn.example.com/a.m4v', 'https://cdn.example.com/a.m4v#t=90'],
  ])('a direct file %s gets a Media Fragments time', (url, link) => {
    expect(chapterLink(url, 90, 't={seconds}')).toBe(link);
  });

  // The default pattern t={seconds} (src/shared/schemas/builds.ts), a `t` parameter in seconds.
  it('adds or replaces the pattern parameter on a hosted video', () => {
    expect(chapterLink('https://video.example/watch?v=abc', 90)).toBe('https://video.example/watch?v=abc&t=90');
    expect(chapterLink('https://video.example/abc', 90)).toBe('https://video.example/abc?t=90');
    expect(chapterLink('https://video.example/watch?t=5&v=a%2Cb', 90, 't={seconds}')).toBe('https://video.example/watch?v=a%2Cb&t=90');
    expect(chapterLink('https://video.example/watch?v=abc#x', 90, 'start={seconds}&autoplay=1')).toBe(
      'https://video.example/watch?v=abc&start=90&autoplay=1#x',
    );
  });

  it('sets the fragment for a pattern that starts with #', () => {
    expect(chapterLink('https://video.example/abc#old', 90, '#t={seconds}s')).toBe('https://video.example/abc#t=90s');
  });

  it('uses whole, non-negative seconds and throws on a bad URL', () => {
    expect(chapterLink('https://video.example/abc', 90.7)).toBe('https://video.example/abc?t=90');
    expect(() => chapterLink('not a url', 5)).toThrow(TypeError);
  });
});
