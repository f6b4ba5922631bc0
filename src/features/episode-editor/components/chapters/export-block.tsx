import { useEffect, useId, useRef, useState } from 'react';
import { Button } from '../../../../components/ui/button';
import { fieldClass } from '../../../../components/ui/text-field';
import { exportChapterBlock, validateChapters } from '../../../../shared/chapters';
import type { ChapterRow } from '../../model/draft';
import { rowsToChapters } from '../../model/to-update';

interface ExportBlockProps {
  rows: readonly ChapterRow[];
  durationSeconds: number | null;
  /** The video host's rules (first at 0:00, at least three) apply from the first try to copy. */
  onCheckExport: (failed: boolean) => void;
  /** Opens the block when the episode needs a disclosure (the video description must carry it too). */
  disclosure?: string | null;
}

type Outcome = { kind: 'copied'; count: number } | { kind: 'manual'; text: string } | { kind: 'problems'; message: string } | null;

async function writeClipboard(text: string): Promise<boolean> {
  try {
    if (!navigator.clipboard?.writeText) return false;
    await navigator.clipboard.writeText(text);
    return true;
  } catch {
    return false;
  }
}

/** "Copy for the video description": the chapter block on the clipboard, or selected for copying by hand. */
export function ExportBlock({ rows, durationSeconds, onCheckExport, disclosure = null }: ExportBlockProps) {
  const [outcome, setOutcome] = useState<Outcome>(null);
  const manualRef = useRef<HTMLTextAreaElement>(null);
  const id = useId();

  useEffect(() => {
    if (outcome?.kind === 'manual') {
      manualRef.current?.focus();
      manualRef.current?.select();
    }
  }, [outcome]);

  const copy = async () => {
    const converted = rowsToChapters(rows);
    if (!converted.ok) {
      onCheckExport(true);
      return setOutcome({ kind: 'problems', message: 'Every chapter needs a start time and a title before the block can be copied.' });
    }
    const { chapters } = converted.value;
    const problems = validateChapters(chapters, { durationSeconds, forExport: true });
    if (problems.length) {
      onCheckExport(true);
      return setOutcome({
        kind: 'problems',
        message: `Not copied: video hosts would not show these as chapters. ${problems.length === 1 ? 'One problem is' : `${problems.length} problems are`} marked on the chapters above.`,
      });
    }
    onCheckExport(false);
    const text = exportChapterBlock(chapters, { disclosure });
    setOutcome((await writeClipboard(text)) ? { kind: 'copied', count: chapters.length } : { kind: 'manual', text });
  };

  return (
    <div className="mt-4">
      <Button variant="secondary" onClick={() => void copy()}>
        Copy for the video description
      </Button>
      <div role="status" className="mt-2">
        {outcome?.kind === 'copied' ? (
          <p className="text-gauge">Copied {outcome.count} chapters to the clipboard. Paste them into the video’s description.</p>
        ) : null}
        {outcome?.kind === 'problems' ? <p className="font-semibold text-oxide-2">{outcome.message}</p> : null}
        {outcome?.kind === 'manual' ? (
          <p className="text-ink">The clipboard is not available here: the block below is selected, copy it with Ctrl+C (or ⌘C).</p>
        ) : null}
      </div>
      {outcome?.kind === 'manual' ? (
        <>
          <label htmlFor={`${id}-manual`} className="sr-only">
            Chapters block for the video description
          </label>
          <textarea
            id={`${id}-manual`}
            ref={manualRef}
            readOnly
            value={outcome.text}
            rows={Math.min(12, outcome.text.split('\n').length + 1)}
            className={`${fieldClass} mt-2 font-mono`}
          />
        </>
      ) : null}
    </div>
  );
}
