import { useId } from 'react';
import type { UseFormRegisterReturn } from 'react-hook-form';
import { TextField } from '../../../components/ui/text-field';
import { chapterLink, EXAMPLE_VIDEO_URL } from '../lib/chapter-link';

const EXAMPLE_SECONDS = 65;

/** The start-time link pattern, with a live preview of the link a chapter at 1:05 would get. */
export function VideoLinkField({
  registration,
  pattern,
  error,
}: {
  registration: UseFormRegisterReturn<'videoLinkPattern'>;
  pattern: string;
  error?: string;
}) {
  const previewId = useId();
  const link = chapterLink(EXAMPLE_VIDEO_URL, pattern, EXAMPLE_SECONDS);
  return (
    <div>
      <TextField
        label="Start-time link pattern"
        hint={
          <>
            How chapters link to a moment of a video on a hosting site. <code className="font-mono">{'{seconds}'}</code> is replaced by the
            chapter’s start; begin with <code className="font-mono">#</code> to put it after the address’s #, otherwise it is added as a
            query parameter. Most hosts take <code className="font-mono">{'t={seconds}'}</code>. A direct video file always uses{' '}
            <code className="font-mono">{'#t={seconds}'}</code>.
          </>
        }
        autoComplete="off"
        spellCheck={false}
        className="max-w-md"
        error={error}
        {...registration}
        aria-controls={previewId}
      />
      <div className="mt-3 border border-dashed border-rule bg-paper-2 px-3 py-2.5">
        <p className="label-condensed">Preview</p>
        <p className="mt-1 text-[15px] text-ink-2">
          A chapter at <span className="font-mono text-oxide-2">1:05</span> of{' '}
          <span className="font-mono break-all">{EXAMPLE_VIDEO_URL}</span> links to:
        </p>
        <output id={previewId} aria-live="polite" className="mt-1 block font-mono text-[15px] break-all text-ink">
          {link ?? 'Fix the pattern above to see the link.'}
        </output>
      </div>
    </div>
  );
}
