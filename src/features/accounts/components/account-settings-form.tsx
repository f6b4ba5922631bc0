import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { TextField } from '../../../components/ui/text-field';
import { accountUpdate, type Account } from '../../../shared/schemas/accounts';
import { useUpdateAccount } from '../api/update-account';
import { applyFieldErrors } from './field-errors';

/** An empty notice address means "none": the schema takes null, not an empty string. */
const emptyToNull = (value: unknown) => (typeof value === 'string' && value.trim() === '' ? null : value);

/** Display name and notice address, validated with the schema the server uses. */
export function AccountSettingsForm({ account }: { account: Account }) {
  const update = useUpdateAccount();
  const form = useForm({
    resolver: zodResolver(accountUpdate),
    defaultValues: { displayName: account.displayName, noticeEmail: account.noticeEmail },
  });
  const {
    register,
    handleSubmit,
    formState: { errors, isDirty },
  } = form;

  const onSubmit = handleSubmit((values) =>
    update
      .mutateAsync(values)
      .then(({ account: saved }) => form.reset({ displayName: saved.displayName, noticeEmail: saved.noticeEmail }))
      .catch((err: unknown) => {
        applyFieldErrors(err, form.setError, ['displayName', 'noticeEmail']);
      }),
  );

  return (
    <form noValidate onSubmit={(event) => void onSubmit(event)} className="max-w-md space-y-5">
      <TextField
        label="Display name"
        hint="Shown beside your episodes and posts."
        autoComplete="name"
        error={errors.displayName?.message}
        {...register('displayName')}
      />
      <TextField
        label="Notice e-mail address"
        hint={
          account.email
            ? `Where e-mail notices go (answers to your posts, new episodes of builds you follow). Your sign-in address is ${account.email}.`
            : 'Where e-mail notices go (answers to your posts, new episodes of builds you follow). Leave it empty for none.'
        }
        type="email"
        autoComplete="email"
        inputMode="email"
        spellCheck={false}
        error={errors.noticeEmail?.message}
        {...register('noticeEmail', { setValueAs: emptyToNull })}
      />
      {update.isSuccess && !isDirty ? <Notice kind="success">Your settings are saved.</Notice> : null}
      {update.isError && !errors.displayName && !errors.noticeEmail ? (
        <Notice kind="error">Your settings could not be saved: {update.error.message}</Notice>
      ) : null}
      <Button type="submit" disabled={update.isPending}>
        {update.isPending ? 'Saving…' : 'Save settings'}
      </Button>
    </form>
  );
}
