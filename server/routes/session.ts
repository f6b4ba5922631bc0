import { z } from 'zod';
import { signInLinkRedeem, signInLinkRequest, type SessionResponse } from '../../src/shared/schemas/accounts';
import { endSession, signInSession } from '../auth/session';
import { HttpError } from '../http/http-error';
import { defineRoute } from '../http/registry';
import { getAccount } from '../services/accounts';
import { redeemSignInLink, requestSignInLink } from '../services/sign-in-links';

export const sessionRoutes = [
  defineRoute({
    method: 'get',
    path: '/session',
    summary: 'The signed-in account with its memberships, or null',
    action: 'site.read',
    handler: async ({ deps, actor }): Promise<SessionResponse> => ({ account: actor ? await getAccount(deps.db, actor.userId) : null }),
  }),
  defineRoute({
    method: 'get',
    path: '/csrf-token',
    summary: "The session's CSRF token, sent back in the x-csrf-token header of every mutation",
    action: 'site.read',
    handler: ({ req, res }) => {
      res.setHeader('cache-control', 'no-store');
      return { token: req.csrfToken?.() ?? '' };
    },
  }),
  defineRoute({
    method: 'post',
    path: '/session/sign-out',
    summary: 'Sign out: the session ends',
    action: 'account.self',
    body: z.object({}).strict(),
    handler: async ({ req, res }) => {
      await endSession(req);
      res.clearCookie('rr_sid');
      res.status(204);
    },
  }),
  defineRoute({
    method: 'post',
    path: '/sign-in-links',
    summary: 'E-mail a single-use sign-in link (the answer never says whether the address has an account)',
    action: 'site.read',
    body: signInLinkRequest,
    rateLimit: ({ req, body }) => [
      ['sign-in-link-ip', req.ip ?? 'unknown'],
      ['sign-in-link-email', body.email],
    ],
    handler: async ({ deps, body, res }) => {
      await requestSignInLink(deps, body.email, body.returnTo);
      res.status(202);
      return { ok: true };
    },
  }),
  defineRoute({
    method: 'post',
    path: '/sign-in-links/redeem',
    summary: 'Sign in with the token from an e-mailed link (a POST, so mail scanners cannot use it up)',
    action: 'site.read',
    body: signInLinkRedeem,
    rateLimit: ({ req }) => [['sign-in', req.ip ?? 'unknown']],
    handler: async ({ deps, body, req }) => {
      const { userId, returnTo } = await redeemSignInLink(deps, body.token);
      await signInSession(req, userId);
      const account = await getAccount(deps.db, userId);
      if (!account) throw new HttpError(500, 'internal', 'Account vanished during sign-in');
      return { account, returnTo };
    },
  }),
];
