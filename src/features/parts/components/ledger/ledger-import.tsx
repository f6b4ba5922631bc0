import { useId, useRef, useState, type ChangeEvent } from 'react';
import { Button } from '../../../../components/ui/button';
import { Notice } from '../../../../components/ui/notice';
import { ImportRefused, useLedgerImport, type ImportRow } from '../../api/ledger-import';

const SHOWN_ROWS = 100;

type Step = { at: 'choose' } | { at: 'preview'; fileName: string; csv: string; rows: ImportRow[] } | { at: 'done'; imported: number };

/**
 * Import part lines from a CSV: choose a file → the server checks every row (dryRun, nothing
 * saved) → the preview lists the rows with their problems by column → "Import N lines" saves all
 * of them or none (a row that fails then comes back as a 422 with the rows again) — or Cancel.
 */
export function LedgerImport({ buildId }: { buildId: number }) {
  const id = useId();
  const fileRef = useRef<HTMLInputElement>(null);
  const [step, setStep] = useState<Step>({ at: 'choose' });
  const [readError, setReadError] = useState<string | null>(null);
  const run = useLedgerImport(buildId);

  const choose = async (event: ChangeEvent<HTMLInputElement>) => {
    const file = event.target.files?.[0];
    if (!file) return;
    setReadError(null);
    run.reset();
    if (file.size > 900_000) return setReadError('That file is larger than 900 kB; split it into smaller files.');
    const csv = await file.text();
    run.mutate(
      { csv, dryRun: true },
      { onSuccess: (result) => setStep({ at: 'preview', fileName: file.name, csv, rows: result.rows ?? [] }) },
    );
  };
  const cancel = () => {
    setStep({ at: 'choose' });
    run.reset();
    if (fileRef.current) fileRef.current.value = '';
  };
  const confirm = (csv: string, fileName: string) =>
    run.mutate(
      { csv, dryRun: false },
      {
        onSuccess: (result) => setStep({ at: 'done', imported: result.imported ?? 0 }),
        onError: (err) => {
          if (err instanceof ImportRefused) setStep({ at: 'preview', fileName, csv, rows: err.rows });
        },
      },
    );

  const failure = run.error && !(run.error instanceof ImportRefused) ? run.error.message : readError;
  return (
    <div className="space-y-4">
      {step.at !== 'preview' ? (
        <div>
          <label htmlFor={`${id}-file`} className="block font-semibold text-ink">
            CSV file to import
          </label>
          <p id={`${id}-hint`} className="mt-0.5 text-[15px] text-slate">
            The same columns as the export. Nothing is saved until you have seen the check of every row.
          </p>
          <input
            id={`${id}-file`}
            ref={fileRef}
            type="file"
            accept=".csv,text/csv"
            aria-describedby={`${id}-hint`}
            className="mt-2 block w-full max-w-md text-[15px] file:mr-3 file:min-h-11 file:border-[1.5px] file:border-ink file:bg-transparent file:px-4 file:font-condensed file:text-sm file:font-semibold file:tracking-label file:uppercase"
            onChange={(e) => void choose(e)}
          />
          {run.isPending ? <p className="mt-2 text-[15px] text-slate">Checking the rows…</p> : null}
        </div>
      ) : (
        <Preview
          step={step}
          pending={run.isPending}
          refused={run.error instanceof ImportRefused}
          onImport={() => confirm(step.csv, step.fileName)}
          onCancel={cancel}
        />
      )}
      {step.at === 'done' ? (
        <Notice kind="success">
          Imported {step.imported} {step.imported === 1 ? 'line' : 'lines'}.
        </Notice>
      ) : null}
      {failure ? <Notice kind="error">The file could not be checked: {failure}</Notice> : null}
    </div>
  );
}

function Preview({
  step,
  pending,
  refused,
  onImport,
  onCancel,
}: {
  step: { fileName: string; rows: ImportRow[] };
  pending: boolean;
  refused: boolean;
  onImport: () => void;
  onCancel: () => void;
}) {
  const bad = step.rows.filter((r) => Object.keys(r.errors).length > 0);
  const good = step.rows.length - bad.length;
  const shown = (bad.length ? bad : step.rows).slice(0, SHOWN_ROWS);
  return (
    <div className="border border-rule bg-card p-4">
      <h3 className="font-serif text-lg font-bold">Check of {step.fileName}</h3>
      <p className="mt-1 text-ink-2" role="status">
        {step.rows.length} {step.rows.length === 1 ? 'row' : 'rows'}: {good} ready
        {bad.length
          ? `, ${bad.length} with problems — fix them in the file and choose it again; nothing is saved while any row fails.`
          : '.'}
      </p>
      {refused ? (
        <Notice kind="error" className="mt-3">
          Nothing was saved: some rows have problems (listed below).
        </Notice>
      ) : null}
      <div className="relative mt-3 max-h-[28rem] overflow-auto">
        <table className="w-full min-w-[32rem] border-collapse text-[15px]">
          <caption className="sr-only">{bad.length ? 'Rows with problems' : 'Rows to import'}</caption>
          <thead>
            <tr className="border-b-2 border-ink text-left font-condensed text-[13px] tracking-[0.1em] text-slate uppercase">
              <th scope="col" className="py-2 pr-3">
                Row
              </th>
              <th scope="col" className="py-2 pr-3">
                Episode
              </th>
              <th scope="col" className="py-2 pr-3">
                Description
              </th>
              <th scope="col" className="py-2">
                Problems
              </th>
            </tr>
          </thead>
          <tbody>
            {shown.map((r) => (
              <tr key={r.row} className="border-b border-rule align-top">
                <td className="py-2 pr-3 font-mono">{r.row}</td>
                <td className="py-2 pr-3 font-mono">{r.episode ?? '—'}</td>
                <td className="py-2 pr-3">{r.description || '—'}</td>
                <td className="py-2">
                  {Object.keys(r.errors).length ? (
                    <ul className="text-oxide-2">
                      {Object.entries(r.errors).map(([column, message]) => (
                        <li key={column}>
                          <span className="font-mono">{column}</span>: {message}
                        </li>
                      ))}
                    </ul>
                  ) : (
                    <span className="text-gauge">Ready</span>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {(bad.length || step.rows.length) > SHOWN_ROWS ? (
        <p className="mt-2 text-[14px] text-slate">The first {SHOWN_ROWS} are listed.</p>
      ) : null}
      <div className="mt-4 flex flex-wrap gap-3">
        {bad.length === 0 && step.rows.length > 0 ? (
          <Button onClick={onImport} disabled={pending}>
            {pending ? 'Importing…' : `Import ${good} ${good === 1 ? 'line' : 'lines'}`}
          </Button>
        ) : null}
        <Button variant="secondary" onClick={onCancel} disabled={pending}>
          Cancel
        </Button>
      </div>
    </div>
  );
}
