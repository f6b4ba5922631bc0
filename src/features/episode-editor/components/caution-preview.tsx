import { cautionText, needsCaution } from '../../../shared/safety';
import type { BuildSystem } from '../../../shared/schemas/builds';
import type { ChapterRow } from '../model/draft';

interface CautionPreviewProps {
  raisedVehicle: boolean;
  rows: readonly ChapterRow[];
  /** The systems the episode's saved figures name. */
  figureSystemKeys?: readonly string[];
  /** The build's systems; until they load, the server's answer stands in. */
  systems: readonly BuildSystem[] | undefined;
  serverNeedsCaution: boolean;
}

/** The caution bar readers will see under the title, worked out from what is on screen now. */
export function CautionPreview({ raisedVehicle, rows, figureSystemKeys = [], systems, serverNeedsCaution }: CautionPreviewProps) {
  const systemKeys = [...new Set([...rows.map((r) => r.systemKey), ...figureSystemKeys].filter((k) => k !== ''))];
  const result = needsCaution({ raisedVehicle, systemKeys }, systems ?? []);
  // Without the build's systems only the raised-vehicle mark can be worked out here; the server knows the rest.
  const fromServerOnly = !systems && serverNeedsCaution && !result.needed;
  const needed = result.needed || fromServerOnly;
  return (
    <section aria-labelledby="caution-preview-heading">
      <h2 id="caution-preview-heading" className="label-condensed border-b-2 border-ink pb-2">
        Safety caution
      </h2>
      {needed ? (
        <div className="mt-3 border-l-4 border-caution bg-caution-soft px-4 py-3">
          <p className="font-condensed text-sm font-semibold tracking-label text-caution uppercase">Safety-critical</p>
          {!fromServerOnly ? (
            <ul className="mt-1 space-y-1 text-ink">
              {cautionText(result.reasons).map((t) => (
                <li key={t}>{t}</li>
              ))}
            </ul>
          ) : (
            <p className="mt-1 text-ink">This episode touches a safety-critical system, so readers see a caution under its title.</p>
          )}
          <p className="mt-2 text-[15px] text-ink-2">
            Readers see this under the title. It follows the raised-vehicle mark and the systems of the chapters and figures.
          </p>
        </div>
      ) : (
        <p className="mt-3 text-ink-2">
          No caution: nothing here is marked as work under a raised vehicle, and no chapter or figure names a safety-critical system.
        </p>
      )}
    </section>
  );
}
