import { useQueryClient } from '@tanstack/react-query';
import { useId, useRef, useState } from 'react';
import { Button } from '../../../components/ui/button';
import { StateMessage } from '../../../components/ui/state-message';
import { ApiError } from '../../../lib/api-client';
import { GALLERY_MAX, type EpisodePictures, type EpisodePicturesUpdate, type MediaItem } from '../../../shared/schemas/media';
import { mediaKeys, useEpisodePictures, useSetEpisodePictures } from '../api/pictures';
import { DescribePhoto } from './describe-photo';
import { PhotoPicker } from './photo-picker';
import { PhotoThumb } from './photo-thumb';

const toUpdate = (p: EpisodePictures): EpisodePicturesUpdate => ({
  coverMediaId: p.cover?.id ?? null,
  gallery: p.gallery.map((m) => m.id),
});

/**
 * The episode's cover (shown above the write-up and on its card) and its gallery (after the write-up,
 * in this order). Each change is saved at once; every picture needs its description before publishing.
 */
export function EpisodePicturesPanel({ episodeId, buildId }: { episodeId: number; buildId: number }) {
  const headingId = useId();
  const { data, error, isPending, refetch } = useEpisodePictures(episodeId);
  const save = useSetEpisodePictures(episodeId);
  const [picking, setPicking] = useState<'cover' | 'gallery' | null>(null);
  const [saveError, setSaveError] = useState<string | null>(null);

  // Changes made while one is being saved (several uploads finishing together) build on it, not on stale data.
  const inFlight = useRef<EpisodePicturesUpdate | null>(null);
  const queryClient = useQueryClient();

  const change = (next: (current: EpisodePicturesUpdate) => EpisodePicturesUpdate) => {
    // What the page holds now, read from the cache at call time: an upload's callback was made in an
    // earlier render, whose `data` may predate a save that has settled since (two uploads finishing
    // one after the other: the second would have been saved over the first and dropped it).
    const latest = queryClient.getQueryData<EpisodePictures>(mediaKeys.episodePictures(episodeId)) ?? data;
    if (!latest) return;
    setSaveError(null);
    const body = next(inFlight.current ?? toUpdate(latest));
    inFlight.current = body;
    save.mutate(body, {
      onSettled: () => {
        if (inFlight.current === body) inFlight.current = null;
      },
      onError: (err) => {
        const fields = err instanceof ApiError ? Object.values(err.fields ?? {}).flat() : [];
        setSaveError(fields[0] ? `${err.message}: ${fields[0]}` : err.message);
      },
    });
  };
  const move = (index: number, by: -1 | 1) =>
    change((c) => {
      const gallery = [...c.gallery];
      const [item] = gallery.splice(index, 1);
      gallery.splice(index + by, 0, item!);
      return { ...c, gallery };
    });

  return (
    <section aria-labelledby={headingId}>
      <h2 id={headingId} className="label-condensed border-b-2 border-ink pb-2">
        Cover and gallery
      </h2>
      <p className="mt-3 text-[15px] text-slate">
        The cover sits above the write-up and on the episode’s card; the gallery follows the write-up. Describe each picture for people who
        cannot see it — publishing asks for it.
      </p>
      {saveError ? (
        <p role="alert" className="mt-3 font-semibold text-oxide-2">
          {saveError}
        </p>
      ) : null}
      {isPending ? (
        <p className="mt-3 text-slate">Loading the episode’s pictures…</p>
      ) : error ? (
        <StateMessage
          kind="error"
          title="The pictures could not be loaded."
          action={<Button onClick={() => void refetch()}>Try again</Button>}
        >
          <p>{error.message}</p>
        </StateMessage>
      ) : (
        <>
          <h3 className="mt-4 font-semibold">Cover</h3>
          {data.cover ? (
            <PictureRow media={data.cover} label="Describe the cover">
              <Button variant="secondary" onClick={() => setPicking('cover')}>
                Change cover
              </Button>
              <Button variant="secondary" disabled={save.isPending} onClick={() => change((c) => ({ ...c, coverMediaId: null }))}>
                Remove cover
              </Button>
            </PictureRow>
          ) : (
            <div className="mt-2 flex flex-wrap items-center gap-3">
              <p className="text-slate">No cover: the episode’s card shows the first picture of the write-up.</p>
              <Button variant="secondary" onClick={() => setPicking('cover')}>
                Choose a cover
              </Button>
            </div>
          )}
          {picking === 'cover' ? (
            <PhotoPicker
              buildId={buildId}
              title="Choose the cover"
              exclude={data.cover ? [data.cover.id] : []}
              onPick={(m) => {
                setPicking(null);
                change((c) => ({ ...c, coverMediaId: m.id }));
              }}
              onClose={() => setPicking(null)}
            />
          ) : null}

          <h3 className="mt-6 font-semibold">
            Gallery{' '}
            <span className="font-mono text-[14px] font-normal text-slate">
              {data.gallery.length} / {GALLERY_MAX}
            </span>
          </h3>
          {data.gallery.length === 0 ? <p className="mt-2 text-slate">No gallery pictures yet.</p> : null}
          <ol className="mt-2 space-y-3">
            {data.gallery.map((m, i) => (
              <li key={m.id}>
                <PictureRow media={m} label={`Describe gallery picture ${i + 1}`}>
                  <Button variant="secondary" disabled={i === 0 || save.isPending} onClick={() => move(i, -1)}>
                    Move up<span className="sr-only"> picture {i + 1}</span>
                  </Button>
                  <Button variant="secondary" disabled={i === data.gallery.length - 1 || save.isPending} onClick={() => move(i, 1)}>
                    Move down<span className="sr-only"> picture {i + 1}</span>
                  </Button>
                  <Button
                    variant="secondary"
                    disabled={save.isPending}
                    onClick={() => change((c) => ({ ...c, gallery: c.gallery.filter((id) => id !== m.id) }))}
                  >
                    Take out<span className="sr-only"> picture {i + 1}</span>
                  </Button>
                </PictureRow>
              </li>
            ))}
          </ol>
          {data.gallery.length < GALLERY_MAX ? (
            <div className="mt-3">
              <Button variant="secondary" onClick={() => setPicking('gallery')}>
                Add pictures to the gallery
              </Button>
            </div>
          ) : null}
          {picking === 'gallery' ? (
            <PhotoPicker
              buildId={buildId}
              title="Add to the gallery"
              multiple
              exclude={data.gallery.map((m) => m.id)}
              onPick={(m) => change((c) => (c.gallery.includes(m.id) ? c : { ...c, gallery: [...c.gallery, m.id].slice(0, GALLERY_MAX) }))}
              onClose={() => setPicking(null)}
            />
          ) : null}
        </>
      )}
    </section>
  );
}

function PictureRow({ media, label, children }: { media: MediaItem; label: string; children: React.ReactNode }) {
  return (
    <div className="mt-2 flex flex-wrap items-start gap-3 border border-rule bg-card p-3">
      <PhotoThumb media={media} />
      <div className="min-w-0 flex-1 basis-64">
        {media.status === 'processing' ? <p className="text-[14px] text-slate">Making its sizes…</p> : null}
        {media.status === 'failed' ? (
          <p className="text-[14px] font-semibold text-oxide-2">Its sizes could not be made; the original is shown.</p>
        ) : null}
        <DescribePhoto key={`${media.id}:${media.altText ?? ''}`} media={media} label={label} />
        <div className="mt-2 flex flex-wrap gap-2">{children}</div>
      </div>
    </div>
  );
}
