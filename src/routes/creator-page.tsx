import { useParams } from 'react-router';
import { QueryState } from '../components/ui/query-state';
import { clipDescription, PageMeta } from '../components/ui/page-meta';
import { StateMessage } from '../components/ui/state-message';
import { EpisodeCard } from '../features/episodes/components/episode-card';
import { creatorOptions, useCreator } from '../features/reading/api/get-creator';
import { BuildCard } from '../features/reading/components/build-card';
import { paths } from '../shared/paths';
import type { CreatorPage as CreatorData } from '../shared/schemas/reading';
import { needData } from './reading-loaders';
import type { LoaderDeps } from './route-guards';

export function creatorPageLoader(deps: LoaderDeps) {
  return async ({ params }: { params: Record<string, string | undefined> }) => {
    await needData(deps.queryClient.ensureQueryData(creatorOptions(deps.api, params.handle ?? '')));
    return null;
  };
}

/** A creator's page: their public builds and latest episodes. */
export function CreatorPage() {
  const handle = useParams().handle ?? '';
  const { data, error, refetch, isFetching } = useCreator(handle);
  if (!data)
    return (
      <QueryState
        error={error}
        isFetching={isFetching}
        refetch={refetch}
        errorTitle="This page could not be loaded."
        loadingTitle="Loading…"
      />
    );
  return <Creator creator={data} />;
}

function Creator({ creator }: { creator: CreatorData }) {
  const builds = creator.builds.length;
  return (
    <>
      <PageMeta
        title={`${creator.displayName} — restoration builds`}
        description={clipDescription(
          builds
            ? `${creator.displayName} restores vehicles on camera: ${builds} ${builds === 1 ? 'build' : 'builds'} on Rivet & Reel, episode by episode.`
            : `${creator.displayName} on Rivet & Reel.`,
        )}
        canonicalPath={paths.creator(creator.handle)}
      />
      <header className="flex items-center gap-4">
        {creator.avatarUrl ? (
          <img src={creator.avatarUrl} alt="" width={64} height={64} className="h-16 w-16 border border-rule bg-paper-2 object-cover" />
        ) : null}
        <div>
          <p className="label-condensed text-oxide">Creator</p>
          <h1 className="mt-1 font-serif text-[27px] leading-tight font-bold md:text-[38px]">{creator.displayName}</h1>
        </div>
      </header>

      <section aria-labelledby="creator-builds-heading" className="mt-10">
        <h2 id="creator-builds-heading" className="label-condensed mb-4 border-b-2 border-ink pb-2">
          Builds
        </h2>
        {builds ? (
          <ul className="grid grid-cols-1 gap-5 sm:grid-cols-2 lg:grid-cols-3">
            {creator.builds.map((b) => (
              <li key={b.id}>
                <BuildCard build={b} showOwner={false} />
              </li>
            ))}
          </ul>
        ) : (
          <StateMessage kind="empty" title="No public builds yet." />
        )}
      </section>

      <section aria-labelledby="creator-latest-heading" className="mt-10">
        <h2 id="creator-latest-heading" className="label-condensed mb-4 border-b-2 border-ink pb-2">
          Latest episodes
        </h2>
        {creator.latestEpisodes.length ? (
          <ul className="grid grid-cols-1 gap-5 sm:grid-cols-2 lg:grid-cols-3">
            {creator.latestEpisodes.map((e) => (
              <li key={e.id}>
                <EpisodeCard episode={e} />
              </li>
            ))}
          </ul>
        ) : (
          <StateMessage kind="empty" title="No episodes published yet." />
        )}
      </section>
    </>
  );
}
