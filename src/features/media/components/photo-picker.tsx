import { useId, useRef, useState } from 'react';
import { Button } from '../../../components/ui/button';
import { StateMessage } from '../../../components/ui/state-message';
import { UploadProgress } from '../../../components/ui/upload-progress';
import { usePhotoUploads } from '../../../lib/use-photo-uploads';
import type { MediaItem } from '../../../shared/schemas/media';
import { PHOTOS_PER_PAGE, useBuildPhotos } from '../api/pictures';
import { photoLabel, PhotoThumb } from './photo-thumb';

/**
 * Choose one of the build's photos, or upload new ones (each with its progress bar). Opens in place,
 * under the button that asked for it; `onPick` gets the chosen or freshly stored photo.
 */
export function PhotoPicker({
  buildId,
  title,
  exclude = [],
  multiple = false,
  onPick,
  onClose,
}: {
  buildId: number;
  title: string;
  /** Photos already used here (not offered again). */
  exclude?: readonly number[];
  /** Uploading several files picks each of them. */
  multiple?: boolean;
  onPick: (media: MediaItem) => void;
  onClose: () => void;
}) {
  const headingId = useId();
  const fileId = useId();
  const [page, setPage] = useState(1);
  const photos = useBuildPhotos(buildId, page);
  const fileInput = useRef<HTMLInputElement>(null);
  const { uploads, add, dismiss } = usePhotoUploads(buildId, (media, key) => {
    dismiss(key);
    onPick(media);
  });
  const offered = photos.data?.items.filter((m) => !exclude.includes(m.id)) ?? [];
  const totalPages = photos.data ? Math.max(1, Math.ceil(photos.data.total / PHOTOS_PER_PAGE)) : 1;

  return (
    <section aria-labelledby={headingId} className="mt-3 border border-rule bg-card p-4">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h4 id={headingId} className="font-condensed text-lg font-semibold">
          {title}
        </h4>
        <Button variant="secondary" onClick={onClose}>
          Close
        </Button>
      </div>

      <div className="mt-3 flex flex-wrap items-center gap-3">
        <label htmlFor={fileId} className="font-semibold">
          Upload {multiple ? 'photos' : 'a photo'}
        </label>
        <input
          id={fileId}
          ref={fileInput}
          type="file"
          accept="image/jpeg,image/png,image/webp,image/avif,image/gif"
          multiple={multiple}
          onChange={(e) => {
            add([...(e.target.files ?? [])]);
            if (fileInput.current) fileInput.current.value = '';
          }}
          className="min-w-0 text-[15px]"
        />
      </div>
      {uploads.length ? (
        <ul aria-label="Photos being uploaded" className="mt-3 space-y-2">
          {uploads.map((u) => (
            <li key={u.key} className="text-[15px]">
              {u.state === 'uploading' ? (
                <UploadProgress name={u.name} progress={u.progress} onCancel={() => u.abort.abort()} />
              ) : u.state === 'failed' ? (
                <div role="alert" className="flex flex-wrap items-center gap-3">
                  <span className="font-semibold text-oxide-2">
                    {u.name}: {u.message}
                  </span>
                  <Button variant="secondary" onClick={() => dismiss(u.key)}>
                    Dismiss
                  </Button>
                </div>
              ) : null}
            </li>
          ))}
        </ul>
      ) : null}

      <h5 className="mt-4 font-semibold">Or choose one of this build’s photos</h5>
      {photos.isPending ? (
        <p className="mt-2 text-slate">Loading the build’s photos…</p>
      ) : photos.isError ? (
        <StateMessage
          kind="error"
          title="The build’s photos could not be loaded."
          action={<Button onClick={() => void photos.refetch()}>Try again</Button>}
        >
          <p>{photos.error.message}</p>
        </StateMessage>
      ) : offered.length === 0 ? (
        <p className="mt-2 text-slate">
          {photos.data.total ? 'Every photo on this page is used here already.' : 'No photos yet: upload one above.'}
        </p>
      ) : (
        <ul className="mt-2 grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-4">
          {offered.map((m) => (
            <li key={m.id}>
              <button
                type="button"
                onClick={() => onPick(m)}
                className="block w-full border-[1.5px] border-transparent p-1 text-left hover:border-ink focus-visible:border-ink"
              >
                <PhotoThumb media={m} className="aspect-[4/3] h-auto w-full" />
                <span className="mt-1 block truncate text-[14px]">
                  <span className="sr-only">Choose: </span>
                  {photoLabel(m)}
                </span>
              </button>
            </li>
          ))}
        </ul>
      )}
      {totalPages > 1 ? (
        <div className="mt-3 flex flex-wrap items-center gap-3">
          <Button variant="secondary" disabled={page <= 1} onClick={() => setPage((p) => p - 1)}>
            Newer photos
          </Button>
          <span className="font-mono text-[14px]">
            {page} / {totalPages}
          </span>
          <Button variant="secondary" disabled={page >= totalPages} onClick={() => setPage((p) => p + 1)}>
            Older photos
          </Button>
        </div>
      ) : null}
    </section>
  );
}
