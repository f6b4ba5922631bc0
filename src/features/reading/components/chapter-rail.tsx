import { formatTime } from '../../../shared/chapters';
import { momentAnchor } from '../../../shared/paths';
import type { EpisodeReading } from '../../../shared/schemas/reading';

type Chapter = EpisodeReading['chapters'][number];

/**
 * The chapter list beside the write-up: a vertical rail with a dot per chapter on wide screens, a
 * strip that scrolls sideways on a phone. Each entry jumps to its chapter (the address carries the
 * moment, `#at-312`); the active one is filled oxide.
 */
export function ChapterRail({
  chapters,
  active,
  postCounts,
  adopted,
}: {
  chapters: readonly Chapter[];
  active: number | null;
  /** Posts per chapter (same order), shown at the right of each entry. */
  postCounts?: readonly number[];
  /** Per chapter, the notes of adopted suggestions: a gauge mark with the note. */
  adopted?: ReadonlyArray<readonly string[]>;
}) {
  if (!chapters.length) return null;
  const current = active !== null ? chapters[active] : chapters[0];
  return (
    <nav aria-labelledby="chapters-heading" className="min-w-0 lg:sticky lg:top-4 lg:self-start">
      <h2 id="chapters-heading" className="label-condensed mb-2.5">
        Chapters
      </h2>
      <ol className="flex gap-1 overflow-x-auto border-t-2 border-rule lg:block lg:overflow-visible lg:border-t-0 lg:border-l-2">
        {chapters.map((c, i) => {
          const on = i === active;
          return (
            <li key={c.id} className="relative shrink-0 lg:shrink">
              <span
                aria-hidden="true"
                className={`absolute -top-[7px] left-2.5 h-3 w-3 rounded-[50%] border-2 lg:top-[13px] lg:-left-[7px] ${on ? 'border-oxide bg-oxide' : 'border-rule bg-paper'}`}
              />
              <a
                href={`#${momentAnchor(c.startSeconds)}`}
                aria-current={on ? 'location' : undefined}
                className={`block min-h-11 px-2.5 pt-3 pb-1 text-[15px] whitespace-nowrap text-ink no-underline hover:underline lg:py-2 lg:pr-0 lg:pl-4 lg:whitespace-normal ${on ? 'font-semibold' : ''}`}
              >
                <span className="mr-2 font-mono text-[13px] text-oxide-2">{formatTime(c.startSeconds)}</span>
                {c.title}
                {postCounts?.[i] ? (
                  <span className="ml-2 font-condensed text-[13px] font-medium tracking-[0.06em] text-slate uppercase lg:float-right">
                    {postCounts[i]} post{postCounts[i] === 1 ? '' : 's'}
                  </span>
                ) : null}
              </a>
              {adopted?.[i]?.length ? (
                <p className="hidden px-2.5 pb-1 text-[13px] text-gauge lg:block lg:pl-4">
                  <span className="font-condensed font-semibold tracking-[0.1em] uppercase">✓ Adopted:</span> {adopted[i]!.join(' · ')}
                </p>
              ) : null}
            </li>
          );
        })}
      </ol>
      {current?.videoLink ? (
        <a
          href={current.videoLink}
          rel="noopener noreferrer"
          className="mt-3.5 block border-[1.5px] border-ink px-2 py-2 text-center font-condensed text-sm font-semibold tracking-label text-ink uppercase no-underline hover:bg-paper-2"
        >
          Watch from <span className="font-mono">{formatTime(current.startSeconds)}</span> <span aria-hidden="true">▸</span>
        </a>
      ) : null}
    </nav>
  );
}

/** The chapter that holds a moment: the last one starting at or before it. */
export function chapterAt(chapters: ReadonlyArray<{ startSeconds: number }>, seconds: number): number | null {
  let found: number | null = null;
  chapters.forEach((c, i) => {
    if (c.startSeconds <= seconds) found = i;
  });
  return found;
}
