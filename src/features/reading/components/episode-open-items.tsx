import { Link } from 'react-router';
import { paths } from '../../../shared/paths';
import type { EpisodeReading } from '../../../shared/schemas/reading';

/** Work this episode left open (dashed brass cards, per LOOK.md) and what it finished from earlier ones. */
export function EpisodeOpenItems({ episode }: { episode: EpisodeReading }) {
  const { opened, closed } = episode.openItems;
  if (!opened.length && !closed.length) return null;
  const { build } = episode;
  return (
    <section aria-labelledby="open-items-heading" className="mt-10">
      <h2 id="open-items-heading" className="label-condensed border-b-2 border-ink pb-2">
        Left open and finished
      </h2>
      {opened.length ? (
        <ul className="mt-3 flex flex-wrap gap-2.5">
          {opened.map((o) => (
            <li key={o.id} className="border-[1.5px] border-dashed border-brass bg-card px-3 py-2 text-[15px]">
              {o.title}
              <small className="block text-[13px] text-slate">
                opened in this episode{o.closed ? ' · since finished' : ' · still open'}
                {o.note ? ` · ${o.note}` : ''}
              </small>
            </li>
          ))}
        </ul>
      ) : null}
      {closed.length ? (
        <ul className="mt-3 space-y-1 text-[15px]">
          {closed.map((o) => (
            <li key={o.id}>
              <span className="font-semibold text-gauge">Finished:</span> {o.title}{' '}
              <span className="text-slate">
                (left open in{' '}
                <Link className="underline" to={paths.episode(build.owner.handle, build.slug, o.openedIn.slug)}>
                  episode {o.openedIn.number}
                </Link>
                )
              </span>
            </li>
          ))}
        </ul>
      ) : null}
    </section>
  );
}
