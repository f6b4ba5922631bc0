import { Link } from 'react-router';
import { ButtonLink } from '../../../components/ui/button';
import { DateText } from '../../../components/ui/date-text';
import { Plate, type PlateTone } from '../../../components/ui/plate';
import { StateMessage } from '../../../components/ui/state-message';
import type { Workbench } from '../../../shared/schemas/episodes';
import { workbenchPaths } from '../paths';

type WorkbenchBuild = Workbench['builds'][number];

const visibilityTone: Record<WorkbenchBuild['visibility'], PlateTone> = { public: 'gauge', unlisted: 'ink', private: 'oxide' };
const hoursFormat = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 2 });

/** My builds, each with its visibility, my role, episode counts, last published and hours worked. */
export function WorkbenchBuilds({ builds }: { builds: readonly WorkbenchBuild[] }) {
  if (builds.length === 0) {
    return (
      <StateMessage
        kind="empty"
        title="You have no builds yet."
        action={
          <ButtonLink to={workbenchPaths.newBuild()} variant="primary">
            Start a build
          </ButtonLink>
        }
      >
        <p>Start one for the vehicle on your bench, then publish an episode for each session in the garage.</p>
      </StateMessage>
    );
  }
  return (
    <ul className="grid gap-4 md:grid-cols-2">
      {builds.map((b) => (
        <li key={b.id} className="border border-rule bg-card px-4 py-4">
          <h3 className="font-serif text-lg leading-snug font-bold">
            <Link to={workbenchPaths.build(b.id)} className="text-ink underline underline-offset-2">
              {b.title}
            </Link>
          </h3>
          <p className="mt-2 flex flex-wrap gap-2">
            <Plate tone={visibilityTone[b.visibility]}>{b.visibility}</Plate>
            <Plate tone={b.role === 'owner' ? 'oxide' : 'slate'}>{b.role}</Plate>
          </p>
          <dl className="mt-3 grid grid-cols-2 gap-2 text-[15px] sm:grid-cols-3">
            <div>
              <dt className="label-condensed">Episodes</dt>
              <dd className="font-mono">
                {b.episodeCount}
                {b.publishedCount !== b.episodeCount ? <span className="text-slate"> ({b.publishedCount} out)</span> : null}
              </dd>
            </div>
            <div>
              <dt className="label-condensed">Hours</dt>
              <dd className="font-mono">{hoursFormat.format(b.hoursWorked)} h</dd>
            </div>
            <div>
              <dt className="label-condensed">Last out</dt>
              <dd>
                {b.lastPublishedAt ? (
                  <DateText iso={b.lastPublishedAt} className="font-mono" />
                ) : (
                  <span className="text-slate">Not yet</span>
                )}
              </dd>
            </div>
          </dl>
        </li>
      ))}
    </ul>
  );
}
