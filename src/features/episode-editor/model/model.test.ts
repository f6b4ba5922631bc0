import { describe, expect, it } from 'vitest';
import { readLinkHref } from './link-href';
import { localInputToIso } from './local-time';
import { parseHours, planUpdate } from './to-update';
import { emptyChapterRow } from './draft';

describe('localInputToIso', () => {
  it('adds the offset of the reader’s zone on that date', () => {
    const iso = localInputToIso('2026-12-05T18:30');
    expect(iso).toMatch(/^2026-12-05T18:30:00[+-]\d{2}:\d{2}$/);
    // The same instant as the browser's own reading of the local time.
    expect(new Date(iso ?? '').getTime()).toBe(new Date(2026, 11, 5, 18, 30).getTime());
  });

  it('refuses what is not a local date and time', () => {
    expect(localInputToIso('')).toBeNull();
    expect(localInputToIso('2026-02-30T10:00')).toBeNull();
  });
});

describe('parseHours', () => {
  it('reads decimal hours with a point or a comma', () => {
    expect(parseHours('3.5')).toBe(3.5);
    expect(parseHours('3,5')).toBe(3.5);
    expect(parseHours('.25')).toBe(0.25);
    expect(parseHours('three')).toBeNull();
    expect(parseHours('-1')).toBeNull();
  });
});

describe('planUpdate', () => {
  it('converts typed values to the API’s and holds back what does not convert', () => {
    const plan = planUpdate({ title: '  Front brake ', duration: '14:20', number: 'x', summary: '' });
    expect(plan.body).toEqual({ title: 'Front brake', durationSeconds: 860, summary: null });
    expect(Object.keys(plan.held)).toEqual(['number']);
  });

  it('sends chapters in screen order without blank rows, and names the row of each', () => {
    const a = { ...emptyChapterRow(), start: '0:00', title: 'Recap', systemKey: 'brakes' };
    const blank = emptyChapterRow();
    const b = { ...emptyChapterRow(), start: '1:12', title: 'Piston', notes: ' grease gun ' };
    const plan = planUpdate({ chapters: [a, blank, b] });
    expect(plan.body.chapters).toEqual([
      { startSeconds: 0, title: 'Recap', systemKey: 'brakes', notes: null },
      { startSeconds: 72, title: 'Piston', systemKey: null, notes: 'grease gun' },
    ]);
    expect(plan.chapterRowKeys).toEqual([a.key, b.key]);
  });

  it('holds the chapters while a row lacks its title', () => {
    const plan = planUpdate({ chapters: [{ ...emptyChapterRow(), start: '0:00' }] });
    expect(plan.sent).toEqual([]);
    expect(plan.held.chapters).toMatch(/start time and a title/);
  });
});

describe('readLinkHref', () => {
  it('accepts http, https and mailto, and reads a bare address as https', () => {
    expect(readLinkHref('https://parts.example/kit')).toEqual({ ok: true, href: 'https://parts.example/kit' });
    expect(readLinkHref('parts.example/kit')).toEqual({ ok: true, href: 'https://parts.example/kit' });
    expect(readLinkHref('mailto:shop@parts.example')).toEqual({ ok: true, href: 'mailto:shop@parts.example' });
  });

  it('refuses other schemes', () => {
    expect(readLinkHref('javascript:alert(1)').ok).toBe(false);
    expect(readLinkHref('data:text/html,hi').ok).toBe(false);
    expect(readLinkHref(' ').ok).toBe(false);
  });
});
