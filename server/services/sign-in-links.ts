import { sql } from 'kysely';
import type { AppDeps } from '../app-deps';
import { HttpError } from '../http/http-error';
import { signInWithEmail } from './accounts';
import { hashToken, newToken } from './tokens';

export const SIGN_IN_LINK_MINUTES = 20;

/** Queues a single-use sign-in link for the address; the caller answers the same either way. */
export async function requestSignInLink(deps: AppDeps, email: string, returnTo: string | undefined): Promise<void> {
  const { token, hash } = newToken();
  const link = `${deps.config.PUBLIC_URL}/sign-in/link#token=${token}`;
  await deps.db.transaction().execute(async (trx) => {
    await trx
      .insertInto('sign_in_tokens')
      .values({
        token_hash: hash,
        email,
        return_to: returnTo ?? null,
        expires_at: sql<Date>`now() + make_interval(mins => ${SIGN_IN_LINK_MINUTES})`,
      })
      .execute();
    await deps.outbox.enqueue(trx, {
      to: email,
      kind: 'sign-in-link',
      subject: 'Your Rivet & Reel sign-in link',
      text: [
        'Someone (we hope you) asked to sign in to Rivet & Reel with this address.',
        '',
        `Open this link and press "Sign in": ${link}`,
        '',
        `It works once, for ${SIGN_IN_LINK_MINUTES} minutes. If you did not ask for it, ignore this message.`,
      ].join('\n'),
    });
  });
}

/** Uses up a sign-in link: returns the account it signs in and where to go next. */
export async function redeemSignInLink(deps: AppDeps, token: string): Promise<{ userId: number; returnTo: string }> {
  return deps.db.transaction().execute(async (trx) => {
    const row = await trx
      .selectFrom('sign_in_tokens')
      .select(['id', 'email', 'return_to'])
      .where('token_hash', '=', hashToken(token))
      .where('used_at', 'is', null)
      .where('expires_at', '>', sql<Date>`now()`)
      .forUpdate()
      .executeTakeFirst();
    if (!row)
      throw new HttpError(400, 'link_invalid', 'This sign-in link was already used or has expired; ask for a new one', {
        token: ['used or expired'],
      });
    await trx
      .updateTable('sign_in_tokens')
      .set({ used_at: sql<Date>`now()` })
      .where('id', '=', row.id)
      .execute();
    const userId = await signInWithEmail(trx, row.email);
    return { userId, returnTo: row.return_to ?? '/' };
  });
}
