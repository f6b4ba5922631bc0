import { useSearchParams } from 'react-router';
import { Button, ButtonLink } from '../components/ui/button';
import { PageMeta } from '../components/ui/page-meta';
import { Pagination } from '../components/ui/pagination';
import { StateMessage } from '../components/ui/state-message';
import { useLatestEpisodes } from '../features/episodes/api/get-latest-episodes';
import { EpisodeCard } from '../features/episodes/components/episode-card';
import { paths } from '../shared/paths';
import type { LatestEpisodesQuery, LatestEpisodesResponse } from '../shared/schemas/episodes';

export const FRONT_PAGE_SIZE = 12;

/** The highest page the API's page query accepts (pageQuery in src/shared/schemas/common.ts). */
const MAX_PAGE = 10_000;

/**
 * The query the front page shows for these search params; a bad `page` quietly means page 1. The
 * same rule as the API's page query (a whole number from 1 to 10 000), without loading zod here.
 */
export function frontPageQuery(searchParams: URLSearchParams): LatestEpisodesQuery {
  const text = searchParams.get('page');
  const page = text === null ? 1 : Number(text);
  return { page: Number.isInteger(page) && page >= 1 && page <= MAX_PAGE ? page : 1, perPage: FRONT_PAGE_SIZE };
}

const TITLE = 'Restoration builds, episode by episode';
const DESCRIPTION =
  'Old cars, motorcycles, tractors and boats restored on camera: each garage session published as an episode with chapters, parts, costs and torque figures.';

export function FrontPage() {
  const [searchParams] = useSearchParams();
  const query = frontPageQuery(searchParams);
  const { data, error, isFetching, refetch } = useLatestEpisodes(query);

  return (
    <>
      <PageMeta
        title={TITLE}
        description={DESCRIPTION}
        canonicalPath={paths.frontPage(query.page)}
        feed={{ path: paths.feeds.site(), title: 'Rivet & Reel — latest episodes' }}
      />
      <header className="max-w-measure">
        <h1 className="font-serif text-[27px] leading-tight font-bold md:text-[38px]">Restoration builds, episode by episode</h1>
        <p className="mt-3 font-serif text-[17px] leading-relaxed text-ink-2">
          Every session in the garage is an episode here: the video, the chapters, the parts and what they cost, the torque figures used and
          the jobs left for next time.
        </p>
      </header>

      <section aria-labelledby="latest-heading" className="mt-10">
        <h2 id="latest-heading" className="label-condensed mb-4 border-b-2 border-ink pb-2">
          Latest episodes
        </h2>
        {/* Data first: a failed background refetch should not hide episodes already on screen. */}
        {data ? (
          <EpisodeList data={data} />
        ) : error ? (
          <StateMessage
            kind="error"
            title="The latest episodes could not be loaded."
            action={
              <Button onClick={() => void refetch()} disabled={isFetching}>
                {isFetching ? 'Trying again…' : 'Try again'}
              </Button>
            }
          >
            <p>{error.message}</p>
          </StateMessage>
        ) : (
          <StateMessage kind="loading" title="Loading the latest episodes…" />
        )}
      </section>
    </>
  );
}

function EpisodeList({ data }: { data: LatestEpisodesResponse }) {
  const totalPages = Math.max(1, Math.ceil(data.total / data.perPage));

  if (data.items.length === 0) {
    // Past the last page is not the same as an empty site: say so, and offer the way back.
    return data.total > 0 ? (
      <StateMessage
        kind="empty"
        title={`There is no page ${data.page}.`}
        action={<ButtonLink to={paths.frontPage(1)}>Go to the first page</ButtonLink>}
      >
        <p>The latest episodes run to {totalPages === 1 ? 'one page' : `${totalPages} pages`}.</p>
      </StateMessage>
    ) : (
      <StateMessage kind="empty" title="No episodes have been published yet.">
        <p>When the first builds go up, their episodes will appear here, newest first.</p>
      </StateMessage>
    );
  }

  return (
    <>
      <ul className="grid grid-cols-1 gap-5 sm:grid-cols-2 lg:grid-cols-3">
        {data.items.map((episode) => (
          <li key={episode.id}>
            <EpisodeCard episode={episode} />
          </li>
        ))}
      </ul>
      <Pagination page={data.page} totalPages={totalPages} hrefFor={paths.frontPage} label="Pages of latest episodes" />
    </>
  );
}
