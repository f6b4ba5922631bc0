import { Form, Link, useSearchParams } from 'react-router';
import { buttonClass } from '../components/ui/button';
import { DateText } from '../components/ui/date-text';
import { PageMeta } from '../components/ui/page-meta';
import { Pagination } from '../components/ui/pagination';
import { QueryState } from '../components/ui/query-state';
import { StateMessage } from '../components/ui/state-message';
import { searchOptions, useSearch } from '../features/reading/api/search';
import { Snippet } from '../features/reading/components/snippet';
import { paths } from '../shared/paths';
import { searchQuery, type SearchHit, type SearchQuery } from '../shared/schemas/reading';
import { needData } from './reading-loaders';
import type { LoaderDeps } from './route-guards';

export function searchParamsQuery(sp: URLSearchParams): SearchQuery {
  const parsed = searchQuery.safeParse({ q: (sp.get('q') ?? '').slice(0, 200), page: sp.get('page') ?? undefined });
  return parsed.success ? parsed.data : { q: '', page: 1 };
}

export function searchPageLoader(deps: LoaderDeps) {
  return async ({ request }: { request: Request }) => {
    const q = searchParamsQuery(new URL(request.url).searchParams);
    if (q.q) await needData(deps.queryClient.ensureQueryData(searchOptions(deps.api, q.q, q.page)));
    return null;
  };
}

/** Search over published episodes and public builds, with the matched words marked. */
export function SearchPage() {
  const [sp] = useSearchParams();
  const { q, page } = searchParamsQuery(sp);
  const { data, error, refetch, isFetching } = useSearch(q, page);
  return (
    <>
      <PageMeta
        title={q ? `Search: ${q}` : 'Search'}
        description="Search every published episode and public build on Rivet & Reel: titles, summaries, write-ups and chapters."
        canonicalPath={q ? paths.search(q, page) : '/search'}
        noindex
      />
      <h1 className="font-serif text-[27px] leading-tight font-bold md:text-[38px]">Search</h1>
      <Form method="get" action="/search" role="search" key={q} className="mt-5 flex max-w-measure flex-wrap gap-2">
        <label htmlFor="search-page-q" className="sr-only">
          Search words
        </label>
        <input
          id="search-page-q"
          name="q"
          type="search"
          defaultValue={q}
          maxLength={200}
          placeholder="a part, a job, a chapter…"
          className="min-h-11 min-w-0 flex-1 border border-rule bg-card px-3 text-base text-ink"
        />
        <button type="submit" className={buttonClass('primary')}>
          Search
        </button>
      </Form>
      <section aria-labelledby="results-heading" aria-live="polite" className="mt-8">
        <h2 id="results-heading" className="label-condensed mb-2 border-b-2 border-ink pb-2">
          {!q ? 'Results' : data ? `${data.total} ${data.total === 1 ? 'result' : 'results'} for “${q}”` : 'Results'}
        </h2>
        {!q ? (
          <p className="mt-3 text-ink-2">Type a few words: a part, a job done, a chapter title or the vehicle’s make.</p>
        ) : data ? (
          data.items.length ? (
            <>
              <ol className="divide-y divide-rule">
                {data.items.map((hit) => (
                  <Result key={`${hit.kind}-${hit.id}`} hit={hit} />
                ))}
              </ol>
              <Pagination
                page={data.page}
                totalPages={Math.max(1, Math.ceil(data.total / data.perPage))}
                hrefFor={(p) => paths.search(q, p)}
                label="Pages of results"
              />
            </>
          ) : data.total > 0 ? (
            <StateMessage
              kind="empty"
              title={`There is no page ${data.page} of results for “${q}”.`}
              action={
                <Link to={paths.search(q, 1)} className={buttonClass('secondary')}>
                  Back to the first page
                </Link>
              }
            />
          ) : (
            <StateMessage kind="empty" title={`Nothing found for “${q}”.`}>
              <p>Try fewer or other words; quotes look for an exact phrase, and a minus sign leaves a word out.</p>
            </StateMessage>
          )
        ) : (
          <QueryState
            error={error}
            isFetching={isFetching}
            refetch={refetch}
            errorTitle="The search could not be run."
            loadingTitle="Searching…"
          />
        )}
      </section>
    </>
  );
}

function Result({ hit }: { hit: SearchHit }) {
  const href = hit.episode
    ? paths.episode(hit.creator.handle, hit.build.slug, hit.episode.slug)
    : paths.build(hit.creator.handle, hit.build.slug);
  return (
    <li className="py-4">
      <p className="font-condensed text-[13px] font-semibold tracking-[0.1em] text-slate uppercase">
        {hit.episode ? (
          <>
            {hit.kind === 'part' ? 'Part used in ' : null}
            <span className="text-oxide">Ep. {hit.episode.number}</span> · {hit.build.title}
          </>
        ) : (
          'Build'
        )}
      </p>
      <h3 className="mt-0.5 font-serif text-lg leading-snug font-bold">
        <Link to={href} className="text-ink no-underline hover:underline">
          {hit.title}
        </Link>
      </h3>
      <p className="mt-1 max-w-measure text-[15px] leading-relaxed text-ink-2">
        <Snippet text={hit.snippet} />
      </p>
      <p className="mt-1 text-[14px] text-slate">
        {hit.creator.displayName}
        {hit.publishedAt ? (
          <>
            {' '}
            · <DateText iso={hit.publishedAt} />
          </>
        ) : null}
      </p>
    </li>
  );
}
