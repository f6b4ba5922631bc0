import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { TextField } from '../../../components/ui/text-field';
import { ApiError } from '../../../lib/api-client';
import { signInLinkRequest } from '../../../shared/schemas/accounts';
import { useRequestSignInLink } from '../api/request-sign-in-link';
import { applyFieldErrors } from './field-errors';
import { rateLimitText } from './rate-limit-text';

export const CHECK_INBOX_MESSAGE =
  'Check your inbox: if an account or invitation matches, a link is on its way; it works once, for 20 minutes.';

/** The e-mail half of the sign-in page: ask for a one-time link, then say the same thing whatever the address. */
export function SignInForm({ returnTo }: { returnTo: string }) {
  const request = useRequestSignInLink();
  const form = useForm({
    resolver: zodResolver(signInLinkRequest),
    defaultValues: { email: '', returnTo },
  });
  const {
    register,
    handleSubmit,
    formState: { errors },
  } = form;

  const onSubmit = handleSubmit((values) =>
    request.mutateAsync(values).catch((err: unknown) => {
      applyFieldErrors(err, form.setError, ['email']);
    }),
  );

  if (request.isSuccess) {
    return (
      <div className="space-y-4">
        <Notice kind="success">
          <p className="font-semibold">{CHECK_INBOX_MESSAGE}</p>
          <p className="mt-1 text-ink-2">
            Open the link on this device to be signed in here. Nothing arrived? Look in the spam folder, or ask again.
          </p>
        </Notice>
        <Button
          variant="secondary"
          onClick={() => {
            request.reset();
            form.reset({ email: '', returnTo });
          }}
        >
          Use a different address
        </Button>
      </div>
    );
  }

  return (
    <form noValidate onSubmit={(event) => void onSubmit(event)} className="space-y-4">
      <TextField
        label="E-mail address"
        hint="We send a one-time link; no password to remember."
        type="email"
        autoComplete="email"
        inputMode="email"
        spellCheck={false}
        error={errors.email?.message}
        {...register('email')}
      />
      {request.isError && !(request.error instanceof ApiError && request.error.fields?.email) ? (
        <Notice kind="error">{requestErrorText(request.error)}</Notice>
      ) : null}
      <Button type="submit" disabled={request.isPending}>
        {request.isPending ? 'Sending…' : 'E-mail me a sign-in link'}
      </Button>
    </form>
  );
}

function requestErrorText(error: Error): string {
  const limited = rateLimitText(error);
  return limited
    ? `Too many sign-in links were asked for. ${limited.replace('Too many tries for now. ', '')}`
    : `The link could not be sent: ${error.message}`;
}
