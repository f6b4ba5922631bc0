import { useEffect, useId, useState } from 'react';
import { Button } from '../../../components/ui/button';
import { StateMessage } from '../../../components/ui/state-message';
import { isTorqueUnit, type TorqueUnit } from '../../../shared/torque';
import { useEpisodeFigures } from '../api/get-episode-figures';
import { FigureCard } from './figure-card';

const STORAGE_KEY = 'rr-torque-unit';

/** The reader's unit, remembered in this browser; read after hydration so the server's HTML matches. */
function useReaderUnit(): [TorqueUnit | null, (u: TorqueUnit) => void] {
  const [unit, setUnit] = useState<TorqueUnit | null>(null);
  useEffect(() => {
    try {
      const saved = window.localStorage.getItem(STORAGE_KEY);
      if (isTorqueUnit(saved)) setUnit(saved);
    } catch {
      // Storage can be blocked; the toggle still works for this page.
    }
  }, []);
  const choose = (u: TorqueUnit) => {
    setUnit(u);
    try {
      window.localStorage.setItem(STORAGE_KEY, u);
    } catch {
      // As above.
    }
  };
  return [unit, choose];
}

/**
 * An episode's workshop figures as figure cards, with the reader's unit toggle (the recorded unit
 * stays the source of truth), each figure's checks as caution bars and its plain caution. Renders
 * nothing when the episode has no figures.
 */
export function EpisodeFigures({ episodeId }: { episodeId: number }) {
  const { data, error, isFetching, refetch } = useEpisodeFigures(episodeId);
  const [unit, setUnit] = useReaderUnit();
  // The episode page composes several sections: an id of its own avoids clashing with theirs.
  const headingId = useId();

  if (!data) {
    return (
      <section aria-labelledby={headingId}>
        <h2 id={headingId} className="label-condensed border-b-2 border-ink pb-2">
          Figures
        </h2>
        <div className="mt-3">
          {error ? (
            <StateMessage
              kind="error"
              title="The figures could not be loaded."
              action={
                <Button variant="secondary" onClick={() => void refetch()} disabled={isFetching}>
                  {isFetching ? 'Trying again…' : 'Try again'}
                </Button>
              }
            >
              <p>{error.message}</p>
            </StateMessage>
          ) : (
            <StateMessage kind="loading" title="Loading the figures…" />
          )}
        </div>
      </section>
    );
  }
  if (data.items.length === 0) return null;

  return (
    <section aria-labelledby={headingId}>
      <h2 id={headingId} className="label-condensed border-b-2 border-ink pb-2">
        Figures
      </h2>
      <p className="mt-2 text-[15px] text-slate">
        Torque and fasteners as used on this vehicle. Pick a unit on any figure to read them all in it.
      </p>
      <ul className="mt-3 space-y-3">
        {data.items.map((f) => (
          <FigureCard key={f.id} figure={f} unit={unit} onUnitChange={setUnit} />
        ))}
      </ul>
    </section>
  );
}
