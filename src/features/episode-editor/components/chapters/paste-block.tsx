import { useId, useState } from 'react';
import { Button } from '../../../../components/ui/button';
import { fieldClass } from '../../../../components/ui/text-field';
import { rowsFromBlock } from '../../model/chapter-problems';
import type { ChapterRow } from '../../model/draft';

interface PasteBlockProps {
  /** How many rows the panel has now (not counting blank ones): with some, the creator chooses add or replace. */
  existing: number;
  onImport: (rows: ChapterRow[], mode: 'add' | 'replace') => void;
}

/** "Paste a block": lines such as "0:00 Intro" from a video description become rows. */
export function PasteBlock({ existing, onImport }: PasteBlockProps) {
  const [open, setOpen] = useState(false);
  const [text, setText] = useState('');
  const [problems, setProblems] = useState<Array<{ line: number; message: string }>>([]);
  const [result, setResult] = useState<string | null>(null);
  const id = useId();

  const run = (mode: 'add' | 'replace') => {
    const { rows, problems: found } = rowsFromBlock(text);
    setProblems(found);
    if (rows.length === 0) {
      setResult(found.length ? null : 'There is nothing to add: paste one “0:00 Title” line per chapter.');
      return;
    }
    onImport(rows, mode);
    setResult(
      `${mode === 'replace' ? 'Replaced the chapters with' : 'Added'} ${rows.length} ${rows.length === 1 ? 'chapter' : 'chapters'}${found.length ? `; ${found.length} ${found.length === 1 ? 'line was' : 'lines were'} left out` : ''}.`,
    );
    if (found.length === 0) setText('');
  };

  return (
    <div className="mt-4">
      <Button variant="secondary" aria-expanded={open} aria-controls={`${id}-panel`} onClick={() => setOpen((o) => !o)}>
        Paste a block
      </Button>
      <div id={`${id}-panel`} hidden={!open} className="mt-3 border border-rule bg-card p-4">
        <label htmlFor={`${id}-text`} className="block font-semibold text-ink">
          Chapters block
        </label>
        <p id={`${id}-hint`} className="mt-0.5 text-[15px] text-slate">
          One chapter per line, the start time first: “0:00 Intro”, “(4:05) Seals” and “1:02:05 – Road test” all work.
        </p>
        <textarea
          id={`${id}-text`}
          value={text}
          rows={6}
          aria-describedby={`${id}-hint${problems.length ? ` ${id}-problems` : ''}`}
          className={`${fieldClass} mt-1.5 font-mono`}
          onChange={(e) => setText(e.target.value)}
        />
        <div className="mt-3 flex flex-wrap gap-3">
          {existing > 0 ? (
            <>
              <Button onClick={() => run('add')}>Add to the chapters</Button>
              <Button variant="secondary" onClick={() => run('replace')}>
                Replace the {existing} {existing === 1 ? 'chapter' : 'chapters'}
              </Button>
            </>
          ) : (
            <Button onClick={() => run('add')}>Add these chapters</Button>
          )}
        </div>
        <div role="status">{result ? <p className="mt-3 text-ink">{result}</p> : null}</div>
        {problems.length ? (
          <ul id={`${id}-problems`} className="mt-2 space-y-0.5 text-[15px] font-semibold text-oxide-2">
            {problems.map((p) => (
              <li key={p.line}>{p.message}</li>
            ))}
          </ul>
        ) : null}
      </div>
    </div>
  );
}
