import type { Editor } from '@tiptap/react';
import { useId, useState, type FormEvent } from 'react';
import { Button } from '../../../../components/ui/button';
import { UploadProgress } from '../../../../components/ui/upload-progress';
import { usePhotoUploads } from '../../../../lib/use-photo-uploads';
import type { MediaItem } from '../../../../shared/schemas/media';

/**
 * Pictures going into the write-up: each file uploads with a progress bar and a Cancel button, then asks
 * for its description (alt text) before it is placed. Files come from the toolbar, a drop or a paste.
 */
export function usePictureUploads(buildId: number) {
  return usePhotoUploads(buildId);
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
            <UploadProgress name={u.name} progress={u.progress} onCancel={() => u.abort.abort()} />
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
