import { lazy, memo, Suspense, useState, type ComponentProps } from 'react';
import { StateMessage } from '../../../components/ui/state-message';
import type { EpisodePosts } from './episode-posts';

// The followers' posts under an episode load in a chunk of their own (with linkifyjs, the post form
// and the post mutations): they are below the write-up, so the episode's first JavaScript leaves them out.
//
// - On the server the route's loader awaits preloadEpisodePosts(), so the section renders in full
//   (renderToString would otherwise render the Suspense fallback).
// - In the browser the first render is a hydration: the lazy component suspends, React keeps the
//   server's HTML of the section as it is and hydrates it when the chunk arrives (no fallback shown).
// - On a later navigation the loader has preloaded the chunk, so the section renders at once.

interface PostsModule {
  EpisodePosts: typeof EpisodePosts;
}
type Props = ComponentProps<typeof EpisodePosts>;

let loaded: PostsModule | undefined;
let pending: Promise<PostsModule> | undefined;

/** Starts loading the posts section's chunk (once); the episode page's loader awaits it. */
export function preloadEpisodePosts(): Promise<PostsModule> {
  pending ??= import('./episode-posts').then(
    (m) => (loaded = m),
    (err: unknown) => {
      // A chunk that failed to load (a deploy, the network) is asked for again next time.
      pending = undefined;
      throw err;
    },
  );
  return pending;
}

const LazyEpisodePosts = lazy(async () => ({ default: (await preloadEpisodePosts()).EpisodePosts }));

/**
 * The posts section. Memoised: its props rarely change, and a section still waiting to hydrate must
 * not receive an update before its chunk arrives (React would then drop the server's HTML for the fallback).
 */
export const EpisodePostsSection = memo(function EpisodePostsSection(props: Props) {
  // Chosen once per mounted section, so the component type never changes under the form's state.
  const [Posts] = useState(() => loaded?.EpisodePosts ?? LazyEpisodePosts);
  return (
    <Suspense fallback={<StateMessage kind="loading" title="Loading posts…" />}>
      <Posts {...props} />
    </Suspense>
  );
});
