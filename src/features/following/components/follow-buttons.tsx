import { Link } from 'react-router';
import { useFollowing } from '../api/queries';
import { useFollow, type FollowTarget } from '../api/mutations';

const btn =
  'inline-flex min-h-11 items-center border-[1.5px] px-3 font-condensed text-[14px] font-semibold tracking-[0.08em] uppercase no-underline disabled:opacity-60';

/** Follow / stop following a build and its creator; visitors get a link to sign in. */
export function FollowButtons({
  signedIn,
  buildId,
  buildTitle,
  creatorHandle,
  creatorName,
  signInPath,
  showCreator = true,
}: {
  signedIn: boolean;
  buildId: number;
  buildTitle: string;
  creatorHandle: string;
  creatorName: string;
  signInPath: string;
  showCreator?: boolean;
}) {
  const following = useFollowing(signedIn);
  const follow = useFollow();
  if (!signedIn)
    return (
      <p className="mt-3 text-[15px] text-ink-2">
        <Link to={signInPath} className="underline underline-offset-2">
          Sign in
        </Link>{' '}
        to follow this build and hear about new episodes.
      </p>
    );
  const onBuild = following.data?.builds.some((b) => b.id === buildId) ?? false;
  const onCreator = following.data?.creators.some((c) => c.handle === creatorHandle) ?? false;
  const toggle = (target: FollowTarget, now: boolean) => follow.mutate({ target, follow: !now });
  const state = (on: boolean) => (on ? 'border-gauge bg-gauge-soft text-gauge' : 'border-ink text-ink hover:bg-paper-2');
  return (
    <div className="mt-3 flex flex-wrap gap-2">
      <button
        type="button"
        aria-pressed={onBuild}
        disabled={!following.data || follow.isPending}
        onClick={() => toggle({ kind: 'build', buildId }, onBuild)}
        className={`${btn} ${state(onBuild)}`}
      >
        {onBuild ? '✓ Following the build' : 'Follow the build'}
        <span className="sr-only"> {buildTitle}</span>
      </button>
      {showCreator ? (
        <button
          type="button"
          aria-pressed={onCreator}
          disabled={!following.data || follow.isPending}
          onClick={() => toggle({ kind: 'creator', handle: creatorHandle }, onCreator)}
          className={`${btn} ${state(onCreator)}`}
        >
          {onCreator ? `✓ Following ${creatorName}` : `Follow ${creatorName}`}
        </button>
      ) : null}
      {follow.isError ? (
        <p role="alert" className="w-full text-[14px] text-oxide-2">
          That did not work; try again.
        </p>
      ) : null}
    </div>
  );
}
