import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { TextField } from '../../../components/ui/text-field';
import { invitationCreate } from '../../../shared/schemas/accounts';
import { useCreateInvitation } from '../api/invitation-mutations';
import { applyFieldErrors } from './field-errors';
import { rateLimitText } from './rate-limit-text';

/** The owner invites an editor by e-mail address; the link in the mail works once, for 7 days. */
export function InviteForm({ buildId }: { buildId: number }) {
  const create = useCreateInvitation(buildId);
  const form = useForm({ resolver: zodResolver(invitationCreate), defaultValues: { email: '' } });
  const {
    register,
    handleSubmit,
    formState: { errors },
  } = form;

  const onSubmit = handleSubmit((values) =>
    create
      .mutateAsync(values)
      .then(() => form.reset({ email: '' }))
      .catch((err: unknown) => {
        applyFieldErrors(err, form.setError, ['email']);
      }),
  );

  return (
    <form noValidate onSubmit={(event) => void onSubmit(event)} className="max-w-md space-y-4">
      <TextField
        label="Editor’s e-mail address"
        hint="They get a link that works once, for 7 days. They can sign in with GitHub or by e-mail to accept."
        type="email"
        autoComplete="off"
        inputMode="email"
        spellCheck={false}
        error={errors.email?.message}
        {...register('email')}
      />
      {create.isSuccess ? <Notice kind="success">Invitation sent to {create.data.email}.</Notice> : null}
      {create.isError && !errors.email ? (
        <Notice kind="error">{rateLimitText(create.error) ?? `The invitation could not be sent: ${create.error.message}`}</Notice>
      ) : null}
      <Button type="submit" disabled={create.isPending}>
        {create.isPending ? 'Sending…' : 'Send invitation'}
      </Button>
    </form>
  );
}
