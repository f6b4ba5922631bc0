import { Form, useSearchParams } from 'react-router';
import { ButtonLink, buttonClass } from '../components/ui/button';
import { PageMeta } from '../components/ui/page-meta';
import { Pagination } from '../components/ui/pagination';
import { QueryState } from '../components/ui/query-state';
import { StateMessage } from '../components/ui/state-message';
import { buildDirectoryOptions, useBuildDirectory } from '../features/reading/api/get-build-directory';
import { BuildCard } from '../features/reading/components/build-card';
import { VEHICLE_KIND_LABELS } from '../shared/vehicle';
import { paths } from '../shared/paths';
import { VEHICLE_KINDS } from '../shared/schemas/builds';
import { buildDirectoryQuery, type BuildDirectoryQuery, type BuildDirectoryResponse } from '../shared/schemas/reading';
import { needData } from './reading-loaders';
import type { LoaderDeps } from './route-guards';

export const DIRECTORY_PAGE_SIZE = 12;

/** The directory's query for these search params; a bad filter quietly means "any". */
export function directoryQuery(sp: URLSearchParams): BuildDirectoryQuery {
  const raw = { kind: sp.get('kind') ?? undefined, make: sp.get('make') ?? undefined, decade: sp.get('decade') ?? undefined };
  const parsed = buildDirectoryQuery.safeParse({ ...raw, page: sp.get('page') ?? undefined, perPage: DIRECTORY_PAGE_SIZE });
  if (parsed.success) return parsed.data;
  return { page: 1, perPage: DIRECTORY_PAGE_SIZE };
}

export function buildsDirectoryLoader(deps: LoaderDeps) {
  return async ({ request }: { request: Request }) => {
    await needData(deps.queryClient.ensureQueryData(buildDirectoryOptions(deps.api, directoryQuery(new URL(request.url).searchParams))));
    return null;
  };
}

/** Every public build, filtered by kind of vehicle, make and decade. */
export function BuildsDirectoryPage() {
  const [sp] = useSearchParams();
  const q = directoryQuery(sp);
  const { data, error, refetch, isFetching } = useBuildDirectory(q);
  const filtered = Boolean(q.kind || q.make || q.decade !== undefined);
  return (
    <>
      <PageMeta
        title="Builds"
        description="Every public restoration build on Rivet & Reel: cars, motorcycles, tractors and boats, filtered by kind, make and decade."
        canonicalPath={paths.builds({ kind: q.kind, make: q.make, decade: q.decade, page: q.page })}
        noindex={filtered}
      />
      <header className="max-w-measure">
        <h1 className="font-serif text-[27px] leading-tight font-bold md:text-[38px]">Builds</h1>
        <p className="mt-3 font-serif text-[17px] leading-relaxed text-ink-2">
          Every public restoration on Rivet & Reel, most recently active first.
        </p>
      </header>
      {data ? <Filters q={q} data={data} /> : null}
      <section aria-labelledby="builds-heading" className="mt-8">
        <h2 id="builds-heading" className="label-condensed mb-4 border-b-2 border-ink pb-2">
          {data ? `${data.total} ${data.total === 1 ? 'build' : 'builds'}${filtered ? ' match' : ''}` : 'Builds'}
        </h2>
        {data ? (
          <Results data={data} q={q} filtered={filtered} />
        ) : (
          <QueryState
            error={error}
            isFetching={isFetching}
            refetch={refetch}
            errorTitle="The builds could not be loaded."
            loadingTitle="Loading builds…"
          />
        )}
      </section>
    </>
  );
}

const selectClass = 'mt-1 block min-h-11 w-full border border-rule bg-card px-2 text-[15px] text-ink';

function Filters({ q, data }: { q: BuildDirectoryQuery; data: BuildDirectoryResponse }) {
  // The form's key follows the query, so its fields show the filters in force after each navigation.
  return (
    <Form
      method="get"
      action="/builds"
      key={`${q.kind}-${q.make}-${q.decade}`}
      className="mt-6 grid grid-cols-1 gap-3 sm:grid-cols-4 sm:items-end"
    >
      <label className="block text-[15px] font-semibold">
        Kind of vehicle
        <select name="kind" defaultValue={q.kind ?? ''} className={selectClass}>
          <option value="">Any kind</option>
          {VEHICLE_KINDS.map((k) => (
            <option key={k} value={k}>
              {VEHICLE_KIND_LABELS[k]}
            </option>
          ))}
        </select>
      </label>
      <label className="block text-[15px] font-semibold">
        Make
        <select name="make" defaultValue={q.make ?? ''} className={selectClass}>
          <option value="">Any make</option>
          {data.makes.map((m) => (
            <option key={m} value={m}>
              {m}
            </option>
          ))}
        </select>
      </label>
      <label className="block text-[15px] font-semibold">
        Decade
        <select name="decade" defaultValue={q.decade ?? ''} className={selectClass}>
          <option value="">Any decade</option>
          {data.decades.map((d) => (
            <option key={d} value={d}>
              {d}s
            </option>
          ))}
        </select>
      </label>
      <div className="flex gap-2">
        <button type="submit" className={buttonClass('primary')}>
          Show builds
        </button>
        {q.kind || q.make || q.decade !== undefined ? <ButtonLink to={paths.builds()}>Clear</ButtonLink> : null}
      </div>
    </Form>
  );
}

function Results({ data, q, filtered }: { data: BuildDirectoryResponse; q: BuildDirectoryQuery; filtered: boolean }) {
  const totalPages = Math.max(1, Math.ceil(data.total / data.perPage));
  if (!data.items.length) {
    if (data.total > 0)
      return (
        <StateMessage
          kind="empty"
          title={`There is no page ${data.page}.`}
          action={<ButtonLink to={paths.builds({ ...q, page: 1 })}>Go to the first page</ButtonLink>}
        />
      );
    return filtered ? (
      <StateMessage
        kind="empty"
        title="No build matches these filters."
        action={<ButtonLink to={paths.builds()}>Show every build</ButtonLink>}
      />
    ) : (
      <StateMessage kind="empty" title="No public builds yet.">
        <p>When creators make their builds public, they are listed here.</p>
      </StateMessage>
    );
  }
  return (
    <>
      <ul className="grid grid-cols-1 gap-5 sm:grid-cols-2 lg:grid-cols-3">
        {data.items.map((b) => (
          <li key={b.id}>
            <BuildCard build={b} />
          </li>
        ))}
      </ul>
      <Pagination page={data.page} totalPages={totalPages} hrefFor={(page) => paths.builds({ ...q, page })} label="Pages of builds" />
    </>
  );
}
