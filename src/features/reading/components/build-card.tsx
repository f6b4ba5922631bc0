import { Link } from 'react-router';
import { DateText } from '../../../components/ui/date-text';
import { Plate } from '../../../components/ui/plate';
import { paths } from '../../../shared/paths';
import type { BuildCard as BuildCardData } from '../../../shared/schemas/reading';
import { VEHICLE_KIND_LABELS, vehicleLine } from '../../../shared/vehicle';

/** One build in a list: kind, vehicle, title, creator, how far the series has got. */
export function BuildCard({ build, showOwner = true }: { build: BuildCardData; showOwner?: boolean }) {
  return (
    <article className="flex h-full flex-col border border-rule bg-card px-4 pt-3 pb-4">
      <p className="flex flex-wrap items-center gap-2 font-condensed text-[13px] font-semibold tracking-[0.1em] text-slate uppercase">
        <Plate tone="slate">{VEHICLE_KIND_LABELS[build.vehicleKind]}</Plate>
        <span>{vehicleLine(build)}</span>
      </p>
      <h3 className="mt-2 font-serif text-lg leading-snug font-bold">
        <Link to={paths.build(build.owner.handle, build.slug)} className="text-ink no-underline hover:underline">
          {build.title}
        </Link>
      </h3>
      {showOwner ? (
        <p className="mt-1 text-[15px] text-slate">
          by{' '}
          <Link to={paths.creator(build.owner.handle)} className="font-semibold text-oxide-2 underline underline-offset-2">
            {build.owner.displayName}
          </Link>
        </p>
      ) : null}
      {build.summary ? <p className="mt-2 text-[15px] leading-relaxed text-ink-2">{build.summary}</p> : null}
      <p className="mt-auto pt-3 text-[15px] text-slate">
        <span className="font-mono">{build.episodeCount}</span> {build.episodeCount === 1 ? 'episode' : 'episodes'}
        {build.lastPublishedAt ? (
          <>
            <span aria-hidden="true"> · </span>latest <DateText iso={build.lastPublishedAt} />
          </>
        ) : null}
      </p>
    </article>
  );
}
