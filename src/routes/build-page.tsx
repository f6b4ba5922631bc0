import { SponsorCredits } from '../features/sponsors/components/sponsor-credits';
import { Link, useLoaderData } from 'react-router';
import { QueryState } from '../components/ui/query-state';
import { DateText } from '../components/ui/date-text';
import { clipDescription, PageMeta } from '../components/ui/page-meta';
import { Picture } from '../components/ui/picture';
import { Plate } from '../components/ui/plate';
import { StateMessage } from '../components/ui/state-message';
import { useSession } from '../features/accounts/api/get-session';
import { accountPaths } from '../features/accounts/paths';
import { formatHours } from '../features/builds/lib/hours';
import { FollowButtons } from '../features/following/components/follow-buttons';
import { formatMoney } from '../features/builds/lib/money';
import { formatMinor } from '../shared/money';
import type { BuildTotals } from '../shared/schemas/parts';
import { buildTotalsOptions, useBuildTotals } from '../features/parts/api/get-build-totals';
import { SpendCharts } from '../features/parts/components/spend-charts';
import { SpendSummary } from '../features/parts/components/spend-summary';
import { buildOverviewOptions, useBuildOverview } from '../features/reading/api/get-build-overview';
import { VEHICLE_KIND_LABELS, vehicleLine } from '../shared/vehicle';
import { paths } from '../shared/paths';
import type { BuildOverview } from '../shared/schemas/reading';
import { needData, resolveBuildPage } from './reading-loaders';
import type { LoaderDeps } from './route-guards';

export function buildPageLoader(deps: LoaderDeps) {
  return async ({ request, params }: { request: Request; params: Record<string, string | undefined> }) => {
    const { buildId } = await resolveBuildPage(deps, request, params);
    await Promise.all([
      needData(deps.queryClient.ensureQueryData(buildOverviewOptions(deps.api, buildId))),
      // The spend section shows its own error state; a failure here must not take the page down.
      deps.queryClient.ensureQueryData(buildTotalsOptions(deps.api, buildId)).catch(() => undefined),
    ]);
    return { buildId };
  };
}

/** The public build page: vehicle, team, episodes in order, what is still open, hours worked. */
export function BuildPage() {
  const { buildId } = useLoaderData<{ buildId: number }>();
  const { data, error, refetch, isFetching } = useBuildOverview(buildId);
  if (!data)
    return (
      <QueryState
        error={error}
        isFetching={isFetching}
        refetch={refetch}
        errorTitle="This build could not be loaded."
        loadingTitle="Loading the build…"
      />
    );
  return <Build build={data} />;
}

function Build({ build }: { build: BuildOverview }) {
  const session = useSession();
  const canonical = paths.build(build.owner.handle, build.slug);
  const vehicle = vehicleLine(build);
  const description = clipDescription(build.summary ?? `${vehicle} restored on camera by ${build.owner.displayName}, episode by episode.`);
  return (
    <>
      <PageMeta
        title={`${build.title} — a ${vehicle} build by ${build.owner.displayName}`}
        description={description}
        canonicalPath={canonical}
        noindex={build.visibility !== 'public'}
        imagePath={build.cover?.src ?? null}
        feed={{ path: paths.feeds.build(build.id), title: `${build.title} — new episodes` }}
      />
      <nav aria-label="Breadcrumbs" className="font-condensed text-sm font-medium tracking-[0.08em] text-slate uppercase">
        <Link to={paths.builds()} className="text-slate">
          Builds
        </Link>
        <span aria-hidden="true"> / </span>
        <span aria-current="page" className="font-semibold text-ink-2">
          {build.title}
        </span>
      </nav>
      {build.cover ? (
        <figure className="mt-4 max-w-4xl">
          <Picture image={build.cover} sizes="(min-width: 960px) 896px, 100vw" eager className="aspect-[21/9] object-cover" />
        </figure>
      ) : null}
      <header className="mt-4 max-w-measure">
        <p className="flex flex-wrap items-center gap-2 font-condensed text-[15px] font-semibold tracking-[0.14em] text-oxide uppercase">
          <Plate tone="slate">{VEHICLE_KIND_LABELS[build.vehicleKind]}</Plate>
          {vehicle}
        </p>
        <h1 className="mt-1.5 font-serif text-[27px] leading-tight font-bold md:text-[38px]">{build.title}</h1>
        {build.summary ? <p className="mt-3 font-serif text-[17px] leading-relaxed text-ink-2">{build.summary}</p> : null}
        <p className="mt-3 text-[15px] text-slate">
          by{' '}
          <Link to={paths.creator(build.owner.handle)} className="font-semibold">
            {build.owner.displayName}
          </Link>
          {build.editors.length ? (
            <>
              {' '}
              with{' '}
              {build.editors.map((e, i) => (
                <span key={e.handle}>
                  {i > 0 ? (i === build.editors.length - 1 ? ' and ' : ', ') : null}
                  <Link to={paths.creator(e.handle)}>{e.displayName}</Link>
                </span>
              ))}
            </>
          ) : null}
        </p>
        <FollowButtons
          signedIn={!!session.data?.account}
          buildId={build.id}
          buildTitle={build.title}
          creatorHandle={build.owner.handle}
          creatorName={build.owner.displayName}
          signInPath={accountPaths.signIn(canonical)}
          showCreator={session.data?.account?.handle !== build.owner.handle}
        />
      </header>

      <dl className="mt-6 grid grid-cols-2 border border-rule bg-card sm:grid-cols-4">
        <Figure label="Episodes" value={String(build.episodes.length)} />
        <Figure label="Hours worked" value={formatHours(build.hoursWorked)} />
        <Figure label="Still open" value={String(build.openItems.length)} />
        <Figure label="Budget" value={build.budgetMinor !== null ? formatMoney(build.budgetMinor, build.currency) : '—'} />
      </dl>
      <p className="mt-3 text-[15px]">
        <a href={paths.feeds.build(build.id)}>Follow new episodes with a feed reader (Atom)</a>
      </p>

      <SponsorCredits sponsors={build.sponsors} />

      <section aria-labelledby="episodes-heading" className="mt-10">
        <h2 id="episodes-heading" className="label-condensed border-b-2 border-ink pb-2">
          Episodes in order
        </h2>
        {build.episodes.length ? (
          <ol className="divide-y divide-rule">
            {build.episodes.map((e) => (
              <li key={e.id} className="py-4">
                <p className="font-condensed text-[13px] font-semibold tracking-[0.1em] text-oxide uppercase">Episode {e.number}</p>
                <h3 className="mt-0.5 font-serif text-lg leading-snug font-bold">
                  <Link to={paths.episode(build.owner.handle, build.slug, e.slug)} className="text-ink no-underline hover:underline">
                    {e.title}
                  </Link>
                </h3>
                <p className="mt-1 text-[15px] text-slate">
                  <DateText iso={e.publishedAt} />
                  {e.hoursWorked !== null ? <> · {formatHours(e.hoursWorked)} worked</> : null}
                  {e.chapterCount ? (
                    <>
                      {' '}
                      · <span className="font-mono">{e.chapterCount}</span> {e.chapterCount === 1 ? 'chapter' : 'chapters'}
                    </>
                  ) : null}
                </p>
                {e.summary ? <p className="mt-1.5 max-w-measure text-[15px] leading-relaxed text-ink-2">{e.summary}</p> : null}
              </li>
            ))}
          </ol>
        ) : (
          <div className="mt-3">
            <StateMessage kind="empty" title="No episodes published yet.">
              <p>Follow the feed to hear when the first one goes up.</p>
            </StateMessage>
          </div>
        )}
      </section>

      <BuildSpend build={build} />

      <section aria-labelledby="open-heading" className="mt-10">
        <h2 id="open-heading" className="label-condensed border-b-2 border-ink pb-2">
          Still open
        </h2>
        {build.openItems.length ? (
          <ul className="mt-3 flex flex-wrap gap-2.5">
            {build.openItems.map((o) => (
              <li key={o.id} className="border-[1.5px] border-dashed border-brass bg-card px-3 py-2 text-[15px]">
                {o.title}
                <small className="block text-[13px] text-slate">
                  opened in{' '}
                  <Link className="underline" to={paths.episode(build.owner.handle, build.slug, o.openedIn.slug)}>
                    episode {o.openedIn.number}
                  </Link>
                  {o.note ? ` · ${o.note}` : ''}
                </small>
              </li>
            ))}
          </ul>
        ) : (
          <p className="mt-3 text-ink-2">Nothing left open: every job started so far has been finished.</p>
        )}
      </section>
    </>
  );
}

function Figure({ label, value }: { label: string; value: string }) {
  return (
    <div className="border-rule px-4 py-3 [&:not(:last-child)]:border-r">
      <dt className="font-condensed text-xs font-semibold tracking-label text-slate uppercase">{label}</dt>
      <dd className="mt-1 font-mono text-xl">{value}</dd>
    </div>
  );
}

/** Spend by system against budgets, and over the series (lines of published episodes). */
function BuildSpend({ build }: { build: BuildOverview }) {
  const { data, error } = useBuildTotals(build.id);
  return (
    <section aria-labelledby="spend-heading" className="mt-10">
      <h2 id="spend-heading" className="label-condensed mb-4 border-b-2 border-ink pb-2">
        Spend
      </h2>
      {data ? (
        data.totals.lines ? (
          <div className="space-y-6">
            <SpendSummary totals={data} />
            <OnOrder totals={data} build={build} />
            <SpendCharts totals={data} />
          </div>
        ) : (
          <StateMessage kind="empty" title="No parts recorded yet." />
        )
      ) : error ? (
        <StateMessage kind="error" title="The spend figures could not be loaded." />
      ) : (
        <StateMessage kind="loading" title="Loading the spend figures…" />
      )}
    </section>
  );
}

/** What the build is waiting for: lines on order, each with the job it holds up. */
function OnOrder({ totals, build }: { totals: BuildTotals; build: BuildOverview }) {
  if (!totals.onOrder.length) return null;
  const money = (m: number | null) => (m === null ? '—' : formatMinor(m, totals.totals.currency));
  return (
    <div>
      <h3 className="label-condensed mb-2">On order</h3>
      <ul className="divide-y divide-rule border-y border-rule text-[15px]">
        {totals.onOrder.map((l) => (
          <li key={l.id} className="flex flex-wrap items-baseline justify-between gap-x-3 py-2">
            <span>
              {l.description}
              <span className="block text-[14px] text-slate">
                ordered in <Link to={paths.episode(build.owner.handle, build.slug, l.episode.slug)}>episode {l.episode.number}</Link>
                {l.openItemTitle ? <> · holds up “{l.openItemTitle}”</> : null}
              </span>
            </span>
            <span className="font-mono text-brass-text">{money(l.grossMinor)}</span>
          </li>
        ))}
      </ul>
    </div>
  );
}
