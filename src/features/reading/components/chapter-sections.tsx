import { Plate } from '../../../components/ui/plate';
import { formatTime } from '../../../shared/chapters';
import { momentAnchor } from '../../../shared/paths';
import type { EpisodeReading } from '../../../shared/schemas/reading';

/** The episode read chapter by chapter: each chapter's anchor, moment, system and notes. */
export function ChapterSections({ chapters, active }: { chapters: EpisodeReading['chapters']; active: number | null }) {
  if (!chapters.length) return null;
  return (
    <section aria-labelledby="by-chapter-heading" className="mt-10">
      <h2 id="by-chapter-heading" className="label-condensed border-b-2 border-ink pb-2">
        Chapter by chapter
      </h2>
      {chapters.map((c, i) => (
        <section
          key={c.id}
          id={momentAnchor(c.startSeconds)}
          aria-labelledby={`chapter-${c.id}-title`}
          className={`scroll-mt-4 border-b border-rule py-5 ${i === active ? 'border-l-4 border-l-oxide pl-4' : ''}`}
        >
          <h3
            id={`chapter-${c.id}-title`}
            className="flex flex-wrap items-baseline gap-x-3 font-serif text-[20px] leading-snug font-bold md:text-[22px]"
          >
            <span className="font-mono text-sm font-normal text-oxide">
              {formatTime(c.startSeconds)}
              {c.endSeconds !== null ? <span className="sr-only"> to {formatTime(c.endSeconds)}</span> : null}
            </span>
            {c.title}
          </h3>
          {c.system ? (
            <p className="mt-2">
              <Plate tone={c.system.safetyCritical ? 'oxide' : 'ink'}>{c.system.name}</Plate>
            </p>
          ) : null}
          {c.notes ? (
            <p className="mt-2 max-w-measure font-serif text-[16px] leading-[1.75] whitespace-pre-line text-ink md:text-[17px]">
              {c.notes}
            </p>
          ) : null}
          {c.videoLink ? (
            <p className="mt-2 text-[15px]">
              <a href={c.videoLink} rel="noopener noreferrer" className="font-semibold">
                Watch this chapter from <span className="font-mono">{formatTime(c.startSeconds)}</span>
                <span className="sr-only">: {c.title}</span>
              </a>
            </p>
          ) : null}
        </section>
      ))}
    </section>
  );
}
