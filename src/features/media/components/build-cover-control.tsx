import { useId, useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { StateMessage } from '../../../components/ui/state-message';
import { ApiError } from '../../../lib/api-client';
import { useBuildCover, useDescribePhoto, useSetBuildCover } from '../api/pictures';
import type { MediaItem } from '../../../shared/schemas/media';
import { DescribePhoto } from './describe-photo';
import { PhotoPicker } from './photo-picker';
import { PhotoThumb } from './photo-thumb';

/** The owner's choice of the build's cover: shown at the top of the build page. It must be described first. */
export function BuildCoverControl({ buildId }: { buildId: number }) {
  const headingId = useId();
  const { data, error, isPending, refetch } = useBuildCover(buildId);
  const set = useSetBuildCover(buildId);
  const [picking, setPicking] = useState(false);
  const [saveError, setSaveError] = useState<string | null>(null);
  // A photo picked without a description waits here for one before it becomes the cover.
  const [undescribed, setUndescribed] = useState<MediaItem | null>(null);
  const choose = (id: number | null) => {
    setSaveError(null);
    set.mutate(id, {
      onSuccess: () => {
        setPicking(false);
        setUndescribed(null);
      },
      onError: (err) => {
        const fields = err instanceof ApiError ? Object.values(err.fields ?? {}).flat() : [];
        setSaveError(fields[0] ? `That photo cannot be the cover yet: ${fields[0]}.` : err.message);
      },
    });
  };
  return (
    <section aria-labelledby={headingId} className="max-w-2xl">
      <h2 id={headingId} className="label-condensed mb-4 border-b-2 border-ink pb-2">
        Cover photo
      </h2>
      <p className="mt-1 text-slate">Shown at the top of the build page. Readers see it at once, so describe it before you choose it.</p>
      {saveError ? (
        <p role="alert" className="mt-3 font-semibold text-oxide-2">
          {saveError}
        </p>
      ) : null}
      {isPending ? (
        <p className="mt-3 text-slate">Loading the cover…</p>
      ) : error ? (
        <StateMessage
          kind="error"
          title="The cover could not be loaded."
          action={<Button onClick={() => void refetch()}>Try again</Button>}
        >
          <p>{error.message}</p>
        </StateMessage>
      ) : data.cover ? (
        <div className="mt-3 flex flex-wrap items-start gap-3 border border-rule bg-card p-3">
          <PhotoThumb media={data.cover} />
          <div className="min-w-0 flex-1 basis-64">
            <DescribePhoto key={`${data.cover.id}:${data.cover.altText ?? ''}`} media={data.cover} label="Describe the cover" />
            <div className="mt-2 flex flex-wrap gap-2">
              <Button variant="secondary" onClick={() => setPicking(true)}>
                Change cover
              </Button>
              <Button variant="secondary" disabled={set.isPending} onClick={() => choose(null)}>
                Remove cover
              </Button>
            </div>
          </div>
        </div>
      ) : (
        <div className="mt-3 flex flex-wrap items-center gap-3">
          <p className="text-slate">No cover chosen.</p>
          <Button variant="secondary" onClick={() => setPicking(true)}>
            Choose a cover
          </Button>
        </div>
      )}
      {picking ? (
        <PhotoPicker
          buildId={buildId}
          title="Choose the build’s cover"
          exclude={data?.cover ? [data.cover.id] : []}
          onPick={(m) => {
            if (m.altText?.trim()) return choose(m.id);
            setPicking(false);
            setUndescribed(m);
          }}
          onClose={() => setPicking(false)}
        />
      ) : null}
      {undescribed ? (
        <DescribeThenChoose media={undescribed} pending={set.isPending} onDone={(id) => choose(id)} onCancel={() => setUndescribed(null)} />
      ) : null}
    </section>
  );
}

function DescribeThenChoose({
  media,
  pending,
  onDone,
  onCancel,
}: {
  media: MediaItem;
  pending: boolean;
  onDone: (id: number) => void;
  onCancel: () => void;
}) {
  const id = useId();
  const [alt, setAlt] = useState('');
  const [error, setError] = useState<string | null>(null);
  const describe = useDescribePhoto();
  const submit = (e: FormEvent) => {
    e.preventDefault();
    if (!alt.trim()) return setError('Describe the picture for people who cannot see it.');
    describe.mutate(
      { id: media.id, altText: alt.trim() },
      {
        onSuccess: () => onDone(media.id),
        onError: (err) => setError(err instanceof ApiError ? err.message : 'The description could not be saved.'),
      },
    );
  };
  return (
    <form onSubmit={submit} className="mt-3 flex flex-wrap items-end gap-3 border border-rule bg-card p-3">
      <PhotoThumb media={media} />
      <div className="min-w-0 flex-1 basis-56">
        <label htmlFor={id} className="block font-semibold">
          Describe this photo to use it as the cover
        </label>
        <input
          id={id}
          value={alt}
          onChange={(e) => setAlt(e.target.value)}
          maxLength={300}
          aria-invalid={error ? 'true' : undefined}
          aria-describedby={error ? `${id}-error` : undefined}
          placeholder="What the picture shows"
          className="mt-1 min-h-11 w-full border border-ink-2 bg-card px-2"
        />
        {error ? (
          <p id={`${id}-error`} role="alert" className="mt-1 text-[14px] font-semibold text-oxide-2">
            {error}
          </p>
        ) : null}
      </div>
      <Button type="submit" disabled={describe.isPending || pending}>
        Use as cover
      </Button>
      <Button variant="secondary" onClick={onCancel}>
        Cancel
      </Button>
    </form>
  );
}
