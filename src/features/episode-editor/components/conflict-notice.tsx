import { Button } from '../../../components/ui/button';
import type { Episode } from '../../../shared/schemas/episodes';
import { formatLocalDateTime } from '../model/local-time';

interface ConflictNoticeProps {
  current: Episode;
  onLoadSaved: () => void;
  onKeepMine: () => void;
}

/** Shown on a 409: someone (or another tab) saved this episode after this editor last did. */
export function ConflictNotice({ current, onLoadSaved, onKeepMine }: ConflictNoticeProps) {
  return (
    <section role="alert" aria-labelledby="conflict-heading" className="border border-l-4 border-rule border-l-oxide-2 bg-card px-4 py-4">
      <h2 id="conflict-heading" className="font-serif text-lg font-bold">
        This episode was saved elsewhere
      </h2>
      <p className="mt-2 text-ink-2">
        Another tab or another member of the build team saved it at {formatLocalDateTime(current.updatedAt)} (version {current.version}).
        Nothing of yours has been sent over it. Choose which copy to go on with.
      </p>
      <div className="mt-4 flex flex-wrap gap-3">
        <Button variant="secondary" onClick={onLoadSaved}>
          Load the saved version
        </Button>
        <Button onClick={onKeepMine}>Keep mine</Button>
      </div>
      <p className="mt-2 text-[15px] text-slate">
        “Load the saved version” drops your unsaved changes. “Keep mine” saves the fields you changed over the saved version and keeps the
        rest of it.
      </p>
    </section>
  );
}
