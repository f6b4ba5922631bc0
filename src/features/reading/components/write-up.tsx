/**
 * The episode's write-up. The HTML was rendered from the editor's document and passed through the
 * server's allow-list (server/services/write-up-html.ts) before it was stored, so it is safe to insert.
 */
export function WriteUp({ html }: { html: string }) {
  if (!html.replace(/<[^>]*>/g, '').trim()) return null;
  return (
    <div
      className="write-up max-w-measure font-serif text-[16px] leading-[1.75] text-ink md:text-[17px]"
      dangerouslySetInnerHTML={{ __html: html }}
    />
  );
}
