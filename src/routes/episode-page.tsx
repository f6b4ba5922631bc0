import { DisclosureBar } from '../features/reading/components/disclosure-bar';
import { disclosureShort } from '../shared/disclosure';
import { useEffect, useState } from 'react';
import { Link, useLoaderData } from 'react-router';
import { QueryState } from '../components/ui/query-state';
import { CautionBar } from '../components/ui/caution-bar';
import { Picture } from '../components/ui/picture';
import { DateText } from '../components/ui/date-text';
import { clipDescription, PageMeta } from '../components/ui/page-meta';
import { Plate } from '../components/ui/plate';
import { StateMessage } from '../components/ui/state-message';
import { formatHours } from '../features/builds/lib/hours';
import { episodeFiguresOptions } from '../features/figures/api/get-episode-figures';
import { EpisodeFigures } from '../features/figures/components/episode-figures';
import { useSession } from '../features/accounts/api/get-session';
import { accountPaths } from '../features/accounts/paths';
import { FollowButtons } from '../features/following/components/follow-buttons';
import { episodePostsOptions, useEpisodePosts } from '../features/posts/api/get-episode-posts';
import { EpisodePostsSection, preloadEpisodePosts } from '../features/posts/components/lazy-episode-posts';
import { groupByChapter } from '../shared/post-anchors';
import { buildTotalsOptions, useBuildTotals } from '../features/parts/api/get-build-totals';
import { episodePartsOptions, useEpisodeParts } from '../features/parts/api/get-episode-parts';
import { PublicPartsTable } from '../features/parts/components/public-parts-table';
import { fetchEpisodePage } from '../features/reading/api/get-episode-page';
import { episodeReadingOptions, useEpisodeReading } from '../features/reading/api/get-episode-reading';
import { chapterAt, ChapterRail } from '../features/reading/components/chapter-rail';
import { ChapterSections } from '../features/reading/components/chapter-sections';
import { EpisodeOpenItems } from '../features/reading/components/episode-open-items';
import { vehicleLine } from '../shared/vehicle';
import { WriteUp } from '../features/reading/components/write-up';
import { formatTime } from '../shared/chapters';
import { momentAnchor, parseMomentAnchor, paths } from '../shared/paths';
import type { EpisodeReading } from '../shared/schemas/reading';
import { canonicalOr301, needData, resolveBuild } from './reading-loaders';
import type { LoaderDeps } from './route-guards';

export function episodePageLoader(deps: LoaderDeps) {
  return async ({ request, params }: { request: Request; params: Record<string, string | undefined> }) => {
    const { queryClient, api } = deps;
    // The posts section's chunk loads beside the data, so the page renders with it (lazy-episode-posts.tsx);
    // if it fails, the section asks for it again when it renders.
    const posts = preloadEpisodePosts().catch(() => undefined);
    const build = await resolveBuild(deps, request, params);
    // One request for the page (it used to be five): each part goes into the cache entry its section reads.
    const page = await needData(fetchEpisodePage(api, build.buildId, params.episodeSlug ?? '', request.signal));
    canonicalOr301(request, `${build.path}/episodes/${encodeURIComponent(page.slug)}`);
    const { episodeId } = page;
    queryClient.setQueryData(episodeReadingOptions(api, episodeId).queryKey, page.reading);
    // A section the server could not read stays out of the cache; the section then asks for it itself.
    if (page.parts) queryClient.setQueryData(episodePartsOptions(api, episodeId).queryKey, page.parts);
    if (page.totals) queryClient.setQueryData(buildTotalsOptions(api, build.buildId).queryKey, page.totals);
    if (page.figures) queryClient.setQueryData(episodeFiguresOptions(api, episodeId).queryKey, page.figures);
    if (page.posts) queryClient.setQueryData(episodePostsOptions(api, episodeId).queryKey, page.posts);
    await posts;
    return { episodeId, buildId: build.buildId };
  };
}

/** The public episode page: caution, chapters beside the write-up, neighbours, open items. */
export function EpisodePage() {
  const { episodeId } = useLoaderData<{ episodeId: number }>();
  const { data, error, refetch, isFetching } = useEpisodeReading(episodeId);
  if (!data)
    return (
      <QueryState
        error={error}
        isFetching={isFetching}
        refetch={refetch}
        errorTitle="This episode could not be loaded."
        loadingTitle="Loading the episode…"
      />
    );
  return <Episode episode={data} />;
}

/** The chapter named by the address's moment (`#at-312`), worked out after hydration. */
function useActiveChapter(chapters: EpisodeReading['chapters']): number | null {
  const [active, setActive] = useState<number | null>(null);
  useEffect(() => {
    const follow = () => {
      const seconds = parseMomentAnchor(window.location.hash);
      const index = seconds === null ? null : chapterAt(chapters, seconds);
      setActive(index);
      // A moment inside a chapter has no element of its own: bring its chapter into view.
      if (seconds !== null && index !== null && !document.getElementById(momentAnchor(seconds))) {
        document.getElementById(momentAnchor(chapters[index]!.startSeconds))?.scrollIntoView();
      }
    };
    follow();
    window.addEventListener('hashchange', follow);
    return () => window.removeEventListener('hashchange', follow);
  }, [chapters]);
  return active;
}

/** Post counts and adopted suggestions' notes per chapter, for the chapter rail. */
function usePostMarks(episode: EpisodeReading) {
  const { data } = useEpisodePosts(episode.id);
  const groups = groupByChapter(episode.chapters, data?.items ?? []);
  return {
    counts: groups.map((g) => g.length),
    adopted: groups.map((g) => g.flatMap((p) => (p.state === 'adopted' && p.adoptedNote ? [p.adoptedNote] : []))),
  };
}

function Episode({ episode }: { episode: EpisodeReading }) {
  const { build } = episode;
  const active = useActiveChapter(episode.chapters);
  const marks = usePostMarks(episode);
  const session = useSession();
  const buildPath = paths.build(build.owner.handle, build.slug);
  const canonical = paths.episode(build.owner.handle, build.slug, episode.slug);
  const systems = [...new Map(episode.chapters.flatMap((c) => (c.system ? [[c.system.key, c.system] as const] : []))).values()];
  // The share card says the disclosure first, so it survives being cut short.
  const description = clipDescription(
    [
      episode.disclosure ? disclosureShort(episode.disclosure) : null,
      episode.summary ??
        `Episode ${episode.number} of ${build.title}, a ${vehicleLine(build)} restored on camera by ${build.owner.displayName}.`,
    ]
      .filter(Boolean)
      .join(' '),
    episode.disclosure ? 300 : 160,
  );

  return (
    <>
      <PageMeta
        title={`Ep. ${episode.number}: ${episode.title} · ${build.title}`}
        description={description}
        canonicalPath={canonical}
        noindex={build.visibility !== 'public' || episode.status !== 'published'}
        ogType="article"
        imagePath={episode.cover?.src ?? null}
        feed={{ path: paths.feeds.build(build.id), title: `${build.title} — new episodes` }}
      />
      <nav aria-label="Breadcrumbs" className="font-condensed text-sm font-medium tracking-[0.08em] text-slate uppercase">
        <Link to={paths.builds()} className="text-slate">
          Builds
        </Link>
        <span aria-hidden="true"> / </span>
        <Link to={buildPath} className="font-semibold text-ink-2">
          {build.title}
        </Link>
        <span aria-hidden="true"> / </span>
        <span aria-current="page">Episode {episode.number}</span>
      </nav>

      {/* Disclosure first, before anything else of the episode (CAP/ASA guide: up front; FTC 16 CFR 255: hard to miss). */}
      {episode.disclosure ? <DisclosureBar disclosure={episode.disclosure} /> : null}

      <header className="mt-4">
        <p className="font-condensed text-[15px] font-semibold tracking-[0.14em] text-oxide uppercase">
          Episode {episode.number} · {vehicleLine(build)}
        </p>
        <h1 className="mt-1.5 max-w-[32ch] font-serif text-[27px] leading-tight font-bold md:text-[38px]">{episode.title}</h1>
        <p className="mt-2 flex flex-wrap items-center gap-x-4 gap-y-1 text-[15px] text-slate">
          {episode.status !== 'published' ? (
            <Plate tone="caution">{episode.status === 'draft' ? 'Draft preview' : 'Scheduled'}</Plate>
          ) : null}
          {episode.publishedAt ? (
            <span>
              Published <DateText iso={episode.publishedAt} />
            </span>
          ) : null}
          {episode.durationSeconds ? (
            <span>
              <span className="font-mono">{formatTime(episode.durationSeconds)}</span> video
            </span>
          ) : null}
          {episode.hoursWorked !== null ? <span>{formatHours(episode.hoursWorked)} in the workshop</span> : null}
          <span>
            by{' '}
            <Link to={paths.creator(build.owner.handle)} className="font-semibold">
              {build.owner.displayName}
            </Link>
          </span>
          {systems.map((s) => (
            <Plate key={s.key} tone={s.safetyCritical ? 'oxide' : 'ink'}>
              {s.name}
            </Plate>
          ))}
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
        {episode.summary ? <p className="mt-3 max-w-measure font-serif text-[17px] leading-relaxed text-ink-2">{episode.summary}</p> : null}
        {episode.caution.length ? (
          <div className="mt-4">
            <CautionBar label="Safety-critical">
              {episode.caution.map((t) => (
                <p key={t}>{t}</p>
              ))}
            </CautionBar>
          </div>
        ) : null}
        {episode.videoUrl ? (
          <p className="mt-4">
            <a
              href={episode.videoUrl}
              rel="noopener noreferrer"
              className="inline-flex min-h-11 items-center border-[1.5px] border-ink bg-ink px-4 font-condensed text-[15px] font-semibold tracking-label text-paper uppercase no-underline hover:bg-ink-2"
            >
              Watch the video <span aria-hidden="true">&nbsp;▸</span>
            </a>
          </p>
        ) : null}
      </header>

      <div className="mt-7 grid grid-cols-1 gap-6 lg:grid-cols-[240px_minmax(0,1fr)] lg:gap-10">
        <ChapterRail chapters={episode.chapters} active={active} postCounts={marks.counts} adopted={marks.adopted} />
        <div className="min-w-0">
          {episode.cover ? (
            <figure className="mb-6">
              <Picture image={episode.cover} sizes="(min-width: 1024px) 840px, 100vw" eager className="aspect-video object-cover" />
            </figure>
          ) : null}
          <article aria-label="Write-up">
            <WriteUp html={episode.writeUpHtml} />
          </article>
          <EpisodeGallery images={episode.gallery} />
          <ChapterSections chapters={episode.chapters} active={active} />
          <EpisodeParts episode={episode} />
          <div className="mt-10">
            <EpisodeFigures episodeId={episode.id} />
          </div>
          <EpisodePostsSection episodeId={episode.id} chapters={episode.chapters} signInPath={accountPaths.signIn(canonical)} />
          <EpisodeOpenItems episode={episode} />
          <EpisodeNeighbours episode={episode} />
        </div>
      </div>
    </>
  );
}

function EpisodeGallery({ images }: { images: EpisodeReading['gallery'] }) {
  if (!images.length) return null;
  return (
    <section aria-labelledby="gallery-heading" className="mt-10">
      <h2 id="gallery-heading" className="label-condensed border-b-2 border-ink pb-2">
        From the workshop <span className="font-mono font-normal text-slate">({images.length})</span>
      </h2>
      <ul className="mt-4 grid grid-cols-1 gap-4 sm:grid-cols-2">
        {images.map((image) => (
          <li key={image.id}>
            <figure>
              <a href={image.src} className="block">
                <Picture image={image} sizes="(min-width: 640px) 360px, 100vw" />
              </a>
              <figcaption className="mt-1.5 text-[15px] text-ink-2">{image.alt}</figcaption>
            </figure>
          </li>
        ))}
      </ul>
    </section>
  );
}

function EpisodeNeighbours({ episode }: { episode: EpisodeReading }) {
  const { build, previous, next } = episode;
  if (!previous && !next) return null;
  const link = (e: NonNullable<EpisodeReading['previous']>) => paths.episode(build.owner.handle, build.slug, e.slug);
  return (
    <nav aria-label="More episodes of this build" className="mt-10 grid grid-cols-1 gap-3 sm:grid-cols-2">
      {previous ? (
        <Link to={link(previous)} rel="prev" className="block border border-rule bg-card px-4 py-3 no-underline hover:border-ink">
          <span className="label-condensed block">← Previous · Ep. {previous.number}</span>
          <span className="mt-1 block font-serif font-bold text-ink">{previous.title}</span>
        </Link>
      ) : (
        <span className="hidden sm:block" />
      )}
      {next ? (
        <Link to={link(next)} rel="next" className="block border border-rule bg-card px-4 py-3 text-right no-underline hover:border-ink">
          <span className="label-condensed block">Next · Ep. {next.number} →</span>
          <span className="mt-1 block font-serif font-bold text-ink">{next.title}</span>
        </Link>
      ) : null}
    </nav>
  );
}

function EpisodeParts({ episode }: { episode: EpisodeReading }) {
  const parts = useEpisodeParts(episode.id);
  const totals = useBuildTotals(episode.build.id);
  if (!parts.data) return parts.error ? <StateMessage kind="error" title="The parts list could not be loaded." /> : null;
  if (!parts.data.items.length) return null;
  return <PublicPartsTable parts={parts.data} chapters={episode.chapters} systems={episode.systems} buildTotals={totals.data} />;
}
