import { useEffect, useId, useLayoutEffect, useMemo, useRef, useState, type FocusEvent } from 'react';
import { Button } from '../../../../components/ui/button';
import { chapterLink, parseTime } from '../../../../shared/chapters';
import type { BuildSystem } from '../../../../shared/schemas/builds';
import { chapterRowMessages, isSorted, sortRows, type RowMessages } from '../../model/chapter-problems';
import { emptyChapterRow, isBlankRow, type ChapterRow } from '../../model/draft';
import { ChapterRowFields } from './chapter-row';
import { ExportBlock } from './export-block';
import { PasteBlock } from './paste-block';

export interface ChaptersPanelProps {
  rows: readonly ChapterRow[];
  onChange: (rows: ChapterRow[]) => void;
  systems: readonly BuildSystem[];
  durationSeconds: number | null;
  /** A video link that parses, or null: chapter links are shown only with one. */
  videoUrl: string | null;
  linkPattern: string;
  /** The server's 400 messages about a row, by row key. */
  serverMessages?: Record<string, string[]>;
  /** The disclosure line that opens the exported block, when the episode needs one. */
  disclosure?: string | null;
}

const NO_MESSAGES: RowMessages = { start: [], title: [] };

function safeLink(videoUrl: string | null, start: string, pattern: string): string | null {
  const seconds = parseTime(start);
  if (!videoUrl || seconds === null) return null;
  try {
    return chapterLink(videoUrl, seconds, pattern);
  } catch {
    return null;
  }
}

/** The chapters of the episode as editable rows, kept in time order, with import and export. */
export function ChaptersPanel({
  rows,
  onChange,
  systems,
  durationSeconds,
  videoUrl,
  linkPattern,
  serverMessages = {},
  disclosure = null,
}: ChaptersPanelProps) {
  const idBase = useId();
  const startInputs = useRef(new Map<string, HTMLInputElement>());
  const addButton = useRef<HTMLButtonElement>(null);
  const [focusKey, setFocusKey] = useState<string | 'add' | null>(null);
  const refocus = useRef<Element | null>(null);
  const [checkExport, setCheckExport] = useState(false);
  const [announcement, setAnnouncement] = useState('');

  const messages = useMemo(
    () => chapterRowMessages(rows, { durationSeconds, forExport: checkExport }),
    [rows, durationSeconds, checkExport],
  );

  useEffect(() => {
    if (focusKey === null) return;
    if (focusKey === 'add') addButton.current?.focus();
    else startInputs.current.get(focusKey)?.focus();
    setFocusKey(null);
  }, [focusKey, rows]);

  // Re-ordering moves DOM nodes, which can drop the focus: give it back to where the reader went.
  useLayoutEffect(() => {
    const target = refocus.current;
    refocus.current = null;
    if (target instanceof HTMLElement && target.isConnected && document.activeElement !== target) target.focus();
  }, [rows]);

  const update = (key: string, patch: Partial<ChapterRow>) => onChange(rows.map((r) => (r.key === key ? { ...r, ...patch } : r)));

  const addRow = () => {
    const row = emptyChapterRow();
    onChange([...rows, row]);
    setFocusKey(row.key);
  };

  const remove = (index: number) => {
    const next = rows.filter((_, i) => i !== index);
    onChange(next);
    setFocusKey(next[index]?.key ?? next[index - 1]?.key ?? 'add');
    setAnnouncement(`Removed chapter ${index + 1}.`);
  };

  const onEnter = (index: number) => {
    const next = rows[index + 1];
    if (next) setFocusKey(next.key);
    else addRow();
  };

  const onStartBlur = (event: FocusEvent<HTMLInputElement>) => {
    const sorted = sortRows(rows);
    if (isSorted(sorted, rows)) return;
    refocus.current = event.relatedTarget;
    onChange(sorted);
    setAnnouncement('Put the chapters in time order.');
  };

  const onImport = (imported: ChapterRow[], mode: 'add' | 'replace') => {
    const kept = mode === 'replace' ? [] : rows.filter((r) => !isBlankRow(r));
    onChange(sortRows([...kept, ...imported]));
  };

  const filled = rows.filter((r) => !isBlankRow(r)).length;

  return (
    <section aria-labelledby={`${idBase}-heading`}>
      <h2 id={`${idBase}-heading`} className="label-condensed border-b-2 border-ink pb-2">
        Chapters
      </h2>
      <p className="mt-2 text-[15px] text-slate">
        Start times as m:ss or h:mm:ss. Press Enter in a row to go to the next one; in the last row it adds a new one. Rows are put in time
        order when you leave a start time.
      </p>
      <div aria-hidden="true" className="mt-3 hidden grid-cols-[7rem_minmax(0,1fr)_10rem_auto] gap-2 border-b border-rule pb-1 md:grid">
        <span className="label-condensed text-xs">Start</span>
        <span className="label-condensed text-xs">Title</span>
        <span className="label-condensed text-xs">System</span>
        <span className="w-20" />
      </div>
      {rows.length === 0 ? (
        <p className="mt-3 text-ink-2">No chapters yet. Add one, or paste the block from the video’s description.</p>
      ) : null}
      <ol className="mt-1">
        {rows.map((row, index) => {
          const own = messages[row.key] ?? NO_MESSAGES;
          const server = serverMessages[row.key] ?? [];
          return (
            <ChapterRowFields
              key={row.key}
              row={row}
              position={index + 1}
              idBase={`${idBase}-${row.key}`}
              systems={systems}
              messages={{ start: [...own.start, ...server], title: own.title }}
              link={safeLink(videoUrl, row.start, linkPattern)}
              startRef={(el) => {
                if (el) startInputs.current.set(row.key, el);
                else startInputs.current.delete(row.key);
              }}
              onChange={(patch) => update(row.key, patch)}
              onRemove={() => remove(index)}
              onEnter={() => onEnter(index)}
              onStartBlur={onStartBlur}
            />
          );
        })}
      </ol>
      <div className="mt-3">
        <Button ref={addButton} variant="secondary" onClick={addRow}>
          Add a chapter
        </Button>
      </div>
      <p role="status" className="sr-only">
        {announcement}
      </p>
      <PasteBlock existing={filled} onImport={onImport} />
      <ExportBlock rows={rows} durationSeconds={durationSeconds} onCheckExport={setCheckExport} disclosure={disclosure ?? null} />
    </section>
  );
}
