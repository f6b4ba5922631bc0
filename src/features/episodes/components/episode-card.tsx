import { Link } from 'react-router';
import { paths } from '../../../shared/paths';
import type { EpisodeListItem } from '../../../shared/schemas/episodes';

// Fixed locale and UTC so the server's HTML and the hydrating client print the same date.
const dateFormat = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeZone: 'UTC' });

function formatPublished(iso: string): string {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? '' : dateFormat.format(date);
}

/** One episode in a list: cover, build and number, title, who and when, summary. */
export function EpisodeCard({ episode }: { episode: EpisodeListItem }) {
  const { build, creator } = episode;
  const href = paths.episode(creator.handle, build.slug, episode.slug);
  const published = formatPublished(episode.publishedAt);

  return (
    <article className="flex h-full flex-col border border-rule bg-card">
      {episode.coverUrl ? (
        <img
          src={episode.coverUrl}
          alt={`Cover photo of ${build.title}, episode ${episode.number}`}
          width={640}
          height={360}
          loading="lazy"
          decoding="async"
          className="aspect-video w-full border-b border-rule bg-paper-2 object-cover"
        />
      ) : (
        // A quiet block keeps every card the same shape when a creator has not set a cover.
        <div aria-hidden="true" className="aspect-video w-full border-b border-rule bg-paper-2" />
      )}
      <div className="flex flex-1 flex-col px-4 pt-3 pb-4">
        <p className="font-condensed text-[13px] font-semibold tracking-[0.1em] text-slate uppercase">
          <span className="text-oxide">Ep. {episode.number}</span>
          <span aria-hidden="true"> · </span>
          <span className="sr-only">, </span>
          {build.title}
        </p>
        {!build.title.includes(build.vehicle) ? <p className="mt-0.5 text-[14px] text-slate">{build.vehicle}</p> : null}
        <h3 className="mt-1.5 font-serif text-lg leading-snug font-bold">
          <Link to={href} className="text-ink no-underline hover:underline">
            {episode.title}
          </Link>
        </h3>
        <p className="mt-1.5 text-[15px] text-slate">
          <Link to={paths.creator(creator.handle)} className="font-semibold text-oxide-2 underline underline-offset-2 hover:decoration-2">
            {creator.displayName}
          </Link>
          {published ? (
            <>
              <span aria-hidden="true"> · </span>
              <time dateTime={episode.publishedAt}>{published}</time>
            </>
          ) : null}
        </p>
        {episode.summary ? <p className="mt-2 text-[15px] leading-relaxed text-ink-2">{episode.summary}</p> : null}
      </div>
    </article>
  );
}
