import { useMemo } from 'react';
import { useParams } from 'react-router';
import { Button } from '../components/ui/button';
import { StateMessage } from '../components/ui/state-message';
import { useEditorBuild } from '../features/episode-editor/api/get-build';
import { useEditorEpisode } from '../features/episode-editor/api/get-episode';
import { useOpenItems } from '../features/episode-editor/api/get-open-items';
import { EpisodeEditor } from '../features/episode-editor/components/episode-editor';
import { EpisodePicturesPanel } from '../features/media/components/episode-pictures-panel';
import { PartsPanel } from '../features/parts/components/editor/parts-panel';
import { useEpisodeParts } from '../features/parts/api/get-episode-parts';
import { ApiError } from '../lib/api-client';
import type { Build } from '../shared/schemas/builds';
import type { Episode } from '../shared/schemas/episodes';
import { idParam } from '../shared/schemas/accounts';
import { NotFound } from './not-found';

// A lazy route module (`lazy: () => import('../routes/episode-editor')`): the editor, Tiptap and
// ProseMirror load only on this route. It has no loader of its own, because a lazy module cannot
// reach the app's query client; the data comes through the query hooks once it renders.

function parseEpisodeId(value: string | undefined): number | null {
  const parsed = idParam.safeParse(value);
  return parsed.success ? parsed.data : null;
}

/** The editor's outline while the episode loads (also the route's HydrateFallback). */
export function HydrateFallback() {
  return (
    <div aria-busy="true" className="min-w-0">
      <title>Episode editor — Rivet &amp; Reel</title>
      <meta name="robots" content="noindex" />
      <div aria-hidden="true" className="h-4 w-48 bg-paper-2" />
      <div aria-hidden="true" className="mt-4 h-9 w-full max-w-xl bg-paper-2" />
      <div className="mt-6">
        <StateMessage kind="loading" title="Opening the episode editor…" />
      </div>
      <div aria-hidden="true" className="mt-6 grid gap-10 lg:grid-cols-[minmax(0,1fr)_22rem]">
        <div className="space-y-4">
          <div className="h-11 bg-paper-2" />
          <div className="h-24 bg-paper-2" />
          <div className="h-64 bg-paper-2" />
        </div>
        <div className="h-48 bg-paper-2" />
      </div>
    </div>
  );
}

export function Component() {
  const episodeId = parseEpisodeId(useParams().episodeId);
  if (episodeId === null) return <NotFound />;
  return <EditorScreen episodeId={episodeId} />;
}

function EditorScreen({ episodeId }: { episodeId: number }) {
  const { data: episode, error, isFetching, refetch } = useEditorEpisode(episodeId);
  const { data: build } = useEditorBuild(episode?.buildId);
  // The disclosure follows the saved part lines, so it comes with them (refreshed on every line change).
  const { data: parts } = useEpisodeParts(episodeId);

  if (!episode) {
    if (!error) return <HydrateFallback />;
    // Drafts of builds one is not on answer 404, like anything hidden.
    if (error instanceof ApiError && (error.status === 404 || error.status === 403)) return <NotFound />;
    return (
      <StateMessage
        kind="error"
        title="The episode could not be opened."
        action={
          <Button onClick={() => void refetch()} disabled={isFetching}>
            {isFetching ? 'Trying again…' : 'Try again'}
          </Button>
        }
      >
        <p>
          {error instanceof ApiError && error.status === 401 ? 'You are signed out. Sign in, then open the episode again.' : error.message}
        </p>
      </StateMessage>
    );
  }
  // Keyed by episode, so moving to another episode starts a fresh autosave.
  return (
    <EpisodeEditor
      key={episode.id}
      episode={episode}
      build={build}
      disclosure={parts ? parts.disclosure : undefined}
      parts={
        build ? (
          <div className="space-y-10">
            <EpisodePicturesPanel episodeId={episode.id} buildId={build.id} />
            <EditorParts episode={episode} build={build} />
          </div>
        ) : null
      }
    />
  );
}

/** The parts feature inside the editor: the build's systems and currency, the episode's saved chapters, open items. */
function EditorParts({ episode, build }: { episode: Episode; build: Build }) {
  const { data: openItems } = useOpenItems(build.id, episode.id);
  const ctx = useMemo(
    () => ({
      buildId: build.id,
      buildCurrency: build.currency,
      systems: build.systems,
      chapters: episode.chapters,
      openItems: (openItems?.items ?? []).filter((o) => o.closedIn === null),
    }),
    [build, episode.chapters, openItems],
  );
  return <PartsPanel episodeId={episode.id} ctx={ctx} />;
}
