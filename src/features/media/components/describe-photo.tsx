import { useId, useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { ApiError } from '../../../lib/api-client';
import type { MediaItem } from '../../../shared/schemas/media';
import { useDescribePhoto } from '../api/pictures';

/** Edits a photo's alt text in place; readers of every page that shows the photo get the new words. */
export function DescribePhoto({ media, label }: { media: MediaItem; label: string }) {
  const id = useId();
  const [value, setValue] = useState(media.altText ?? '');
  const describe = useDescribePhoto();
  const [error, setError] = useState<string | null>(null);
  const unchanged = value.trim() === (media.altText ?? '').trim();
  const submit = (e: FormEvent) => {
    e.preventDefault();
    if (!value.trim()) return setError('Describe the picture for people who cannot see it.');
    setError(null);
    describe.mutate(
      { id: media.id, altText: value.trim() },
      { onError: (err) => setError(err instanceof ApiError ? err.message : 'The description could not be saved.') },
    );
  };
  return (
    <form onSubmit={submit} className="flex min-w-0 flex-1 flex-wrap items-end gap-2">
      <div className="min-w-0 flex-1 basis-48">
        <label htmlFor={id} className="block text-[15px] font-semibold">
          {label}
        </label>
        <input
          id={id}
          value={value}
          onChange={(e) => setValue(e.target.value)}
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
      <Button type="submit" variant="secondary" disabled={unchanged || describe.isPending}>
        {describe.isPending ? 'Saving…' : 'Save description'}
      </Button>
    </form>
  );
}
