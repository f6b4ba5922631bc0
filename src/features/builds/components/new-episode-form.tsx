import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { TextField } from '../../../components/ui/text-field';
import { ApiError } from '../../../lib/api-client';
import { episodeCreate, type Episode } from '../../../shared/schemas/episodes';
import { useCreateEpisode } from '../api/episode-mutations';

/** An empty number means "the next free one"; anything else is read as a number for the schema. */
const optionalNumber = (value: unknown) => (value === '' || value === null || value === undefined ? undefined : Number(value));

/** Starts a draft episode (title and, optionally, its number), then hands it to `onCreated` (the editor). */
export function NewEpisodeForm({ buildId, onCreated }: { buildId: number; onCreated: (episode: Episode) => void | Promise<void> }) {
  const create = useCreateEpisode(buildId);
  const form = useForm({ resolver: zodResolver(episodeCreate), defaultValues: { title: '', number: undefined } });
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = form;

  const onSubmit = handleSubmit((values) =>
    create
      .mutateAsync(values)
      .then(onCreated)
      .catch((err: unknown) => {
        if (!(err instanceof ApiError) || !err.fields) return;
        for (const name of ['title', 'number'] as const) {
          const message = err.fields[name]?.[0];
          if (message) setError(name, { type: 'server', message });
        }
      }),
  );

  const numberError = errors.number
    ? errors.number.type === 'invalid_type'
      ? 'a whole number such as 4'
      : errors.number.message
    : undefined;

  return (
    <form noValidate onSubmit={(event) => void onSubmit(event)} className="flex max-w-2xl flex-wrap items-start gap-x-4 gap-y-4">
      <TextField
        label="Title"
        autoComplete="off"
        className="min-w-0 flex-1 basis-64"
        error={errors.title?.message}
        {...register('title')}
      />
      <TextField
        label="Number"
        hint="Empty: the next free one."
        inputMode="numeric"
        autoComplete="off"
        className="w-40"
        error={numberError}
        {...register('number', { setValueAs: optionalNumber })}
      />
      <div className="w-full space-y-3">
        {create.isError && !errors.title && !errors.number ? (
          <Notice kind="error">The episode could not be started: {create.error.message}</Notice>
        ) : null}
        <Button type="submit" disabled={create.isPending}>
          {create.isPending ? 'Starting…' : 'Start the episode'}
        </Button>
      </div>
    </form>
  );
}
