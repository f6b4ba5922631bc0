import { useForm } from 'react-hook-form';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { TextField } from '../../../components/ui/text-field';
import { ApiError } from '../../../lib/api-client';
import { sponsorInput, type SponsorInput, type SponsorRef } from '../../../shared/schemas/sponsors';

type Values = { name: string; slug: string; website: string };
const FIELDS = ['name', 'slug', 'website'] as const;

/** Name, address slug and website of an organisation; the same schema the server checks. */
export function SponsorForm({
  initial,
  submitLabel,
  pending,
  onSubmit,
}: {
  initial?: SponsorRef;
  submitLabel: string;
  pending: boolean;
  onSubmit: (values: SponsorInput) => Promise<unknown>;
}) {
  const form = useForm<Values>({
    defaultValues: { name: initial?.name ?? '', slug: initial?.slug ?? '', website: initial?.website ?? '' },
  });
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitSuccessful },
  } = form;

  const submit = handleSubmit(async (v) => {
    const parsed = sponsorInput.safeParse({ name: v.name, slug: v.slug, website: v.website.trim() ? v.website : null });
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const field = String(issue.path[0]) as (typeof FIELDS)[number];
        if (FIELDS.includes(field)) setError(field, { type: 'schema', message: issue.message });
      }
      throw new Error('invalid');
    }
    try {
      await onSubmit(parsed.data);
      if (!initial) form.reset({ name: '', slug: '', website: '' });
    } catch (err) {
      if (err instanceof ApiError && err.fields) {
        for (const f of FIELDS) if (err.fields[f]?.[0]) setError(f, { type: 'server', message: err.fields[f][0] });
      }
      setError('root', { type: 'server', message: err instanceof Error ? err.message : 'Not saved' });
      throw err;
    }
  });

  return (
    <form noValidate onSubmit={(e) => void submit(e).catch(() => undefined)} className="max-w-lg space-y-4">
      <TextField label="Name" autoComplete="off" error={errors.name?.message} {...register('name')} />
      <TextField
        label="Address slug"
        hint="Lower-case letters, digits and single hyphens; the summary lives at /sponsors/<slug>."
        autoComplete="off"
        spellCheck={false}
        error={errors.slug?.message}
        {...register('slug')}
      />
      <TextField
        label="Website (optional)"
        type="url"
        inputMode="url"
        autoComplete="off"
        spellCheck={false}
        error={errors.website?.message}
        {...register('website')}
      />
      {errors.root?.message ? <Notice kind="error">Not saved: {errors.root.message}</Notice> : null}
      {isSubmitSuccessful ? <Notice kind="success">Saved.</Notice> : null}
      <Button type="submit" disabled={pending}>
        {pending ? 'Saving…' : submitLabel}
      </Button>
    </form>
  );
}
