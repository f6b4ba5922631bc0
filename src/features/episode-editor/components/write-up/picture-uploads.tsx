import type { Editor } from '@tiptap/react';
import { useCallback, useId, useRef, useState, type FormEvent } from 'react';
import { Button } from '../../../../components/ui/button';
import { ApiError } from '../../../../lib/api-client';
import { useApi } from '../../../../lib/api-context';
import { mediaItem, type MediaItem } from '../../../../shared/schemas/media';

const MAX_BYTES = 25 * 1024 * 1024;
const PICTURE_TYPES = ['image/jpeg', 'image/png', 'image/webp', 'image/avif', 'image/gif'];

type Upload =
  | { key: number; name: string; state: 'uploading'; progress: number; abort: AbortController }
  | { key: number; name: string; state: 'failed'; message: string }
  | { key: number; name: string; state: 'describe'; media: MediaItem };

/**
 * Pictures going into the write-up: each file uploads with a progress bar and a Cancel button, then asks
 * for its description (alt text) before it is placed. Files come from the toolbar, a drop or a paste.
 */
export function usePictureUploads(buildId: number) {
  const api = useApi();
  const [uploads, setUploads] = useState<Upload[]>([]);
  const next = useRef(1);
  const update = (key: number, u: Upload | null) =>
    setUploads((list) => (u ? list.map((x) => (x.key === key ? u : x)) : list.filter((x) => x.key !== key)));

  const add = useCallback(
    (files: readonly File[]) => {
      for (const file of files) {
        const key = next.current++;
        if (!PICTURE_TYPES.includes(file.type)) {
          setUploads((l) => [...l, { key, name: file.name, state: 'failed', message: 'Only pictures: JPEG, PNG, WebP, AVIF or GIF.' }]);
          continue;
        }
        if (file.size > MAX_BYTES) {
          setUploads((l) => [...l, { key, name: file.name, state: 'failed', message: 'Pictures may be at most 25 MB.' }]);
          continue;
        }
        const abort = new AbortController();
        setUploads((l) => [...l, { key, name: file.name, state: 'uploading', progress: 0, abort }]);
        const form = new FormData();
        form.set('kind', 'photo');
        form.set('file', file, file.name);
        api
          .upload(`/api/builds/${buildId}/media`, form, mediaItem, {
            signal: abort.signal,
            onProgress: (progress) => update(key, { key, name: file.name, state: 'uploading', progress, abort }),
          })
          .then((media) => update(key, { key, name: file.name, state: 'describe', media }))
          .catch((err: unknown) => {
            if (err instanceof ApiError && err.code === 'aborted') return update(key, null);
            const message = err instanceof ApiError ? err.message : 'The upload failed.';
            update(key, { key, name: file.name, state: 'failed', message });
          });
      }
    },
    [api, buildId],
  );
  return { uploads, add, dismiss: (key: number) => update(key, null) };
}

/** The uploads in progress, failed, or waiting for their description. */
export function PictureUploads({
  uploads,
  editor,
  onDismiss,
}: {
  uploads: ReturnType<typeof usePictureUploads>['uploads'];
  editor: Editor;
  onDismiss: (key: number) => void;
}) {
  if (!uploads.length) return null;
  return (
    <ul aria-label="Pictures being added" className="space-y-2 border-b border-rule bg-paper px-3 py-2">
      {uploads.map((u) => (
        <li key={u.key} className="text-[15px]">
          {u.state === 'uploading' ? (
            <UploadingRow name={u.name} progress={u.progress} onCancel={() => u.abort.abort()} />
          ) : u.state === 'failed' ? (
            <div role="alert" className="flex flex-wrap items-center gap-3">
              <span className="font-semibold text-oxide-2">
                {u.name}: {u.message}
              </span>
              <Button variant="secondary" onClick={() => onDismiss(u.key)}>
                Dismiss
              </Button>
            </div>
          ) : (
            <DescribeRow
              media={u.media}
              name={u.name}
              onInsert={(alt) => {
                editor
                  .chain()
                  .focus()
                  .insertContent({ type: 'mediaImage', attrs: { mediaId: u.media.id, alt, src: u.media.src } })
                  .run();
                onDismiss(u.key);
              }}
              onCancel={() => onDismiss(u.key)}
            />
          )}
        </li>
      ))}
    </ul>
  );
}

function UploadingRow({ name, progress, onCancel }: { name: string; progress: number; onCancel: () => void }) {
  const id = useId();
  return (
    <div className="flex flex-wrap items-center gap-3">
      <label htmlFor={id} className="min-w-0 truncate">
        Uploading {name}
      </label>
      <progress id={id} max={1} value={progress} className="h-2.5 w-40 accent-oxide" />
      <span className="font-mono text-[13px] text-slate">{Math.round(progress * 100)} %</span>
      <Button variant="secondary" onClick={onCancel}>
        Cancel
      </Button>
    </div>
  );
}

function DescribeRow({
  media,
  name,
  onInsert,
  onCancel,
}: {
  media: MediaItem;
  name: string;
  onInsert: (alt: string) => void;
  onCancel: () => void;
}) {
  const id = useId();
  const [alt, setAlt] = useState('');
  const [error, setError] = useState<string | null>(null);
  const submit = (e: FormEvent) => {
    e.preventDefault();
    if (!alt.trim()) return setError('Describe the picture for people who cannot see it.');
    onInsert(alt.trim());
  };
  return (
    <form onSubmit={submit} className="flex flex-wrap items-end gap-3">
      {media.src ? <img src={media.src} alt="" width={64} height={48} className="h-12 w-16 border border-rule object-cover" /> : null}
      <div className="min-w-0 flex-1">
        <label htmlFor={id} className="block font-semibold">
          Describe {name}
        </label>
        <input
          id={id}
          value={alt}
          onChange={(e) => setAlt(e.target.value)}
          maxLength={300}
          aria-invalid={error ? 'true' : undefined}
          aria-describedby={error ? `${id}-error` : undefined}
          placeholder="What the picture shows, e.g. the caliper bore after cleaning"
          className="mt-1 min-h-11 w-full border border-ink-2 bg-card px-2"
        />
        {error ? (
          <p id={`${id}-error`} className="mt-1 text-[14px] font-semibold text-oxide-2">
            {error}
          </p>
        ) : null}
      </div>
      <Button type="submit">Insert picture</Button>
      <Button variant="secondary" onClick={onCancel}>
        Leave out
      </Button>
    </form>
  );
}
