import type { FocusEvent, KeyboardEvent, Ref } from 'react';
import { fieldClass } from '../../../../components/ui/text-field';
import type { BuildSystem } from '../../../../shared/schemas/builds';
import type { ChapterRow } from '../../model/draft';
import type { RowMessages } from '../../model/chapter-problems';

interface ChapterRowFieldsProps {
  row: ChapterRow;
  /** 1-based, as the creator counts. */
  position: number;
  idBase: string;
  systems: readonly BuildSystem[];
  messages: RowMessages;
  /** Where this chapter starts in the video, when there is a video link and a time. */
  link: string | null;
  startRef: Ref<HTMLInputElement>;
  onChange: (patch: Partial<ChapterRow>) => void;
  onRemove: () => void;
  /** Enter in the start or title field: to the next row, or a new one after the last. */
  onEnter: () => void;
  onStartBlur: (event: FocusEvent<HTMLInputElement>) => void;
}

const labelClass = 'block text-[15px] font-semibold text-ink md:sr-only';
const inputClass = `${fieldClass} mt-1 md:mt-0`;

function describedBy(...ids: Array<string | null>): string | undefined {
  return ids.filter(Boolean).join(' ') || undefined;
}

/** One chapter: start, title, system, notes, its messages and its link into the video. */
export function ChapterRowFields({
  row,
  position,
  idBase,
  systems,
  messages,
  link,
  startRef,
  onChange,
  onRemove,
  onEnter,
  onStartBlur,
}: ChapterRowFieldsProps) {
  const startMsgId = `${idBase}-start-msg`;
  const titleMsgId = `${idBase}-title-msg`;
  const hasStart = messages.start.length > 0;
  const hasTitle = messages.title.length > 0;
  const onKeyDown = (event: KeyboardEvent<HTMLInputElement>) => {
    if (event.key !== 'Enter' || event.nativeEvent.isComposing) return;
    event.preventDefault();
    onEnter();
  };
  const name = row.title.trim() || `chapter ${position}`;

  return (
    <li className="border-b border-rule py-3" aria-label={`Chapter ${position}`}>
      <div className="grid grid-cols-1 gap-2 md:grid-cols-[7rem_minmax(0,1fr)_10rem_auto] md:items-start">
        <div>
          <label htmlFor={`${idBase}-start`} className={labelClass}>
            Start of chapter {position}
          </label>
          <input
            id={`${idBase}-start`}
            ref={startRef}
            value={row.start}
            inputMode="numeric"
            autoComplete="off"
            placeholder="0:00"
            aria-invalid={hasStart || undefined}
            aria-describedby={describedBy(hasStart ? startMsgId : null)}
            className={`${inputClass} font-mono`}
            onChange={(e) => onChange({ start: e.target.value })}
            onBlur={onStartBlur}
            onKeyDown={onKeyDown}
          />
        </div>
        <div>
          <label htmlFor={`${idBase}-title`} className={labelClass}>
            Title of chapter {position}
          </label>
          <input
            id={`${idBase}-title`}
            value={row.title}
            maxLength={120}
            autoComplete="off"
            aria-invalid={hasTitle || undefined}
            aria-describedby={describedBy(hasTitle ? titleMsgId : null)}
            className={inputClass}
            onChange={(e) => onChange({ title: e.target.value })}
            onKeyDown={onKeyDown}
          />
        </div>
        <div>
          <label htmlFor={`${idBase}-system`} className={labelClass}>
            System of chapter {position}
          </label>
          <select
            id={`${idBase}-system`}
            value={row.systemKey}
            className={inputClass}
            onChange={(e) => onChange({ systemKey: e.target.value })}
          >
            <option value="">No system</option>
            {systems.map((s) => (
              <option key={s.key} value={s.key}>
                {s.name}
                {s.safetyCritical ? ' (safety-critical)' : ''}
              </option>
            ))}
            {row.systemKey && !systems.some((s) => s.key === row.systemKey) ? (
              <option value={row.systemKey}>{row.systemKey} (no longer on the build)</option>
            ) : null}
          </select>
        </div>
        <button
          type="button"
          onClick={onRemove}
          aria-label={`Remove ${name}`}
          className="min-h-11 justify-self-start border-[1.5px] border-ink-2 bg-transparent px-3 font-condensed text-sm font-semibold tracking-label text-ink uppercase hover:bg-paper-2"
        >
          Remove
        </button>
      </div>
      <div className="mt-2">
        <label htmlFor={`${idBase}-notes`} className="block text-[15px] font-semibold text-ink">
          Notes on chapter {position} <span className="font-normal text-slate">(optional)</span>
        </label>
        <textarea
          id={`${idBase}-notes`}
          value={row.notes}
          rows={1}
          maxLength={2000}
          className={`${fieldClass} mt-1`}
          onChange={(e) => onChange({ notes: e.target.value })}
        />
      </div>
      {hasStart ? <RowMessageList id={startMsgId} messages={messages.start} /> : null}
      {hasTitle ? <RowMessageList id={titleMsgId} messages={messages.title} /> : null}
      {link ? (
        <p className="mt-1 text-[15px] text-slate">
          Link to this moment:{' '}
          <a href={link} rel="noopener noreferrer" className="font-mono break-all">
            {link}
          </a>
        </p>
      ) : null}
    </li>
  );
}

function RowMessageList({ id, messages }: { id: string; messages: readonly string[] }) {
  return (
    <ul id={id} className="mt-1 space-y-0.5 text-[15px] font-semibold text-oxide-2">
      {messages.map((m) => (
        <li key={m}>{m}</li>
      ))}
    </ul>
  );
}
