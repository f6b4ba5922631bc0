import { SNIPPET_MARK_END, SNIPPET_MARK_START } from '../../../shared/schemas/reading';

/** A search snippet with its matched words in <mark>; the text is never parsed as HTML. */
export function Snippet({ text }: { text: string }) {
  const parts = text.split(SNIPPET_MARK_START);
  return (
    <>
      {parts.map((part, i) => {
        if (i === 0) return <span key={i}>{part}</span>;
        const end = part.indexOf(SNIPPET_MARK_END);
        const marked = end < 0 ? part : part.slice(0, end);
        const rest = end < 0 ? '' : part.slice(end + 1);
        return (
          <span key={i}>
            <mark className="bg-brass-soft px-0.5 text-ink">{marked}</mark>
            {rest}
          </span>
        );
      })}
    </>
  );
}
