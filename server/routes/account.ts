import { sql } from 'kysely';
import { accountUpdate } from '../../src/shared/schemas/accounts';
import { signedIn } from '../auth/policy';
import { endSession } from '../auth/session';
import { defineRoute } from '../http/registry';
import { deleteAccount, exportAccountData } from '../services/account-data';
import { getAccount } from '../services/accounts';

export const accountRoutes = [
  defineRoute({
    method: 'patch',
    path: '/account',
    summary: 'Change my display name or notice e-mail address',
    action: 'account.self',
    body: accountUpdate,
    handler: async ({ deps, actor, body }) => {
      const me = signedIn(actor);
      await deps.db
        .updateTable('users')
        .set({
          ...(body.displayName !== undefined ? { display_name: body.displayName } : {}),
          ...(body.noticeEmail !== undefined ? { notice_email: body.noticeEmail } : {}),
          updated_at: sql<Date>`now()`,
        })
        .where('id', '=', me.userId)
        .execute();
      return { account: await getAccount(deps.db, me.userId) };
    },
  }),
  defineRoute({
    method: 'get',
    path: '/account/export',
    summary: 'Download my data as JSON',
    action: 'account.self',
    handler: async ({ deps, actor, res }) => {
      const me = signedIn(actor);
      res.setHeader('content-disposition', `attachment; filename="rivet-reel-account-${me.userId}.json"`);
      res.setHeader('cache-control', 'no-store');
      return exportAccountData(deps.db, me.userId);
    },
  }),
  defineRoute({
    method: 'delete',
    path: '/account',
    summary: 'Delete my account (refused while it owns builds); what it wrote stays as "former member"',
    action: 'account.self',
    handler: async ({ deps, actor, req, res }) => {
      await deleteAccount(deps.db, signedIn(actor).userId);
      await endSession(req);
      res.clearCookie('rr_sid');
      res.status(204);
    },
  }),
];
