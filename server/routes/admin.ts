import { z } from 'zod';
import { adminAccountAction, adminAccountsQuery, idParam } from '../../src/shared/schemas/accounts';
import { signedIn } from '../auth/policy';
import { defineRoute } from '../http/registry';
import { applyAccountAction, listAccounts } from '../services/admin-accounts';

export const adminRoutes = [
  defineRoute({
    method: 'get',
    path: '/admin/accounts',
    summary: 'Accounts, searched by handle, name or e-mail (admins)',
    action: 'admin.accounts',
    query: adminAccountsQuery,
    handler: ({ deps, query }) => listAccounts(deps.db, query),
  }),
  defineRoute({
    method: 'post',
    path: '/admin/accounts/:userId/actions',
    summary: 'Suspend or restore an account, grant or revoke admin (admins; recorded)',
    action: 'admin.accounts',
    params: z.object({ userId: idParam }),
    body: adminAccountAction,
    handler: ({ deps, actor, params, body }) => applyAccountAction(deps.db, signedIn(actor).userId, params.userId, body.action),
  }),
];
