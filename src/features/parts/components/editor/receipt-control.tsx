import { useQueryClient } from '@tanstack/react-query';
import { useId, useRef, useState } from 'react';
import { ApiError } from '../../../../lib/api-client';
import { useApi } from '../../../../lib/api-context';
import { mediaItem } from '../../../../shared/schemas/media';
import { partLine, type PartLine } from '../../../../shared/schemas/parts';
import { partKeys } from '../../api/keys';

const actionClass = 'min-h-11 px-2 font-condensed text-[14px] font-semibold tracking-[0.08em] uppercase underline underline-offset-2';

/**
 * A line's receipt: a paperclip that downloads it when there is one (the build team's alone), or an
 * upload (image or PDF, with its progress) that attaches one.
 */
export function ReceiptControl({ line }: { line: PartLine }) {
  const api = useApi();
  const queryClient = useQueryClient();
  const input = useRef<HTMLInputElement>(null);
  const id = useId();
  const [progress, setProgress] = useState<number | null>(null);
  const [error, setError] = useState<string | null>(null);

  const attach = async (file: File) => {
    setError(null);
    setProgress(0);
    try {
      const form = new FormData();
      form.set('kind', 'receipt');
      form.set('file', file, file.name);
      const media = await api.upload(`/api/builds/${line.buildId}/media`, form, mediaItem, { onProgress: setProgress });
      await api.patch(`/api/part-lines/${line.id}`, { receiptMediaId: media.id }, partLine);
      await queryClient.invalidateQueries({ queryKey: partKeys.all });
    } catch (err) {
      setError(err instanceof ApiError ? err.message : 'The receipt could not be attached.');
    } finally {
      setProgress(null);
    }
  };

  if (line.receipt)
    return (
      <a href={`/api/media/${line.receipt.id}/download`} className={actionClass} download>
        <span aria-hidden="true">📎 </span>Receipt<span className="sr-only"> for {line.description}</span>
      </a>
    );
  return (
    <span className="inline-flex items-center gap-1">
      <button type="button" className={actionClass} onClick={() => input.current?.click()} disabled={progress !== null}>
        {progress !== null ? `Uploading ${Math.round(progress * 100)} %` : 'Add receipt'}
        <span className="sr-only"> for {line.description}</span>
      </button>
      <input
        ref={input}
        id={id}
        type="file"
        hidden
        accept="application/pdf,image/jpeg,image/png,image/webp,image/avif,image/gif"
        aria-label={`Receipt for ${line.description}`}
        onChange={(e) => {
          const file = e.target.files?.[0];
          e.target.value = '';
          if (file) void attach(file);
        }}
      />
      {error ? (
        <span role="alert" className="text-[13px] font-semibold text-oxide-2">
          {error}
        </span>
      ) : null}
    </span>
  );
}
