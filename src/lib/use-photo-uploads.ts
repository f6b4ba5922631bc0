import { useCallback, useRef, useState } from 'react';
import { mediaItem, type MediaItem } from '../shared/schemas/media';
import { ApiError } from './api-client';
import { useApi } from './api-context';

const MAX_BYTES = 25 * 1024 * 1024;
const PICTURE_TYPES = ['image/jpeg', 'image/png', 'image/webp', 'image/avif', 'image/gif'];

/** One photo on its way to the build: uploading (0…1), failed with a message, or stored. */
export type PhotoUpload =
  | { key: number; name: string; state: 'uploading'; progress: number; abort: AbortController }
  | { key: number; name: string; state: 'failed'; message: string }
  | { key: number; name: string; state: 'done'; media: MediaItem };

/**
 * Photos uploaded into a build's store, each with its progress, a way to cancel and a clear error;
 * files the server would refuse (type, size) fail here at once. Used by the write-up's pictures and
 * by the cover and gallery pickers, so every photo takes the same path.
 */
export function usePhotoUploads(buildId: number, onStored?: (media: MediaItem, key: number) => void) {
  const api = useApi();
  const [uploads, setUploads] = useState<PhotoUpload[]>([]);
  const next = useRef(1);
  const update = useCallback(
    (key: number, u: PhotoUpload | null) =>
      setUploads((list) => (u ? list.map((x) => (x.key === key ? u : x)) : list.filter((x) => x.key !== key))),
    [],
  );
  const stored = useRef(onStored);
  stored.current = onStored;

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
          .then((media) => {
            update(key, { key, name: file.name, state: 'done', media });
            stored.current?.(media, key);
          })
          .catch((err: unknown) => {
            if (err instanceof ApiError && err.code === 'aborted') return update(key, null);
            const message = err instanceof ApiError ? err.message : 'The upload failed.';
            update(key, { key, name: file.name, state: 'failed', message });
          });
      }
    },
    [api, buildId, update],
  );
  return { uploads, add, dismiss: useCallback((key: number) => update(key, null), [update]) };
}
