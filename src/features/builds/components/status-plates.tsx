import { Plate, type PlateTone } from '../../../components/ui/plate';
import type { Build } from '../../../shared/schemas/builds';
import type { EpisodeSummary } from '../../../shared/schemas/episodes';

const statusTone: Record<EpisodeSummary['status'], PlateTone> = { draft: 'slate', scheduled: 'brass', published: 'gauge' };
const visibilityTone: Record<Build['visibility'], PlateTone> = { public: 'gauge', unlisted: 'ink', private: 'oxide' };

export function EpisodeStatusPlate({ status }: { status: EpisodeSummary['status'] }) {
  return <Plate tone={statusTone[status]}>{status}</Plate>;
}

export function VisibilityPlate({ visibility }: { visibility: Build['visibility'] }) {
  return <Plate tone={visibilityTone[visibility]}>{visibility}</Plate>;
}
