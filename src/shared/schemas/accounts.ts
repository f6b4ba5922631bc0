import { z } from 'zod';
import { isSameSitePath, RETURN_TO_MAX } from '../return-to';
import { pagedList, pageQuery } from './common';

export const handle = z.string().regex(/^[a-z0-9][a-z0-9-]{1,38}$/, 'lower-case letters, digits and dashes, 2–39 characters');
export const emailAddress = z
  .email('must be an e-mail address')
  .max(254)
  .transform((e) => e.toLowerCase());
export const idParam = z.coerce.number().int().positive();

/** A same-site path to return to after signing in; anything else falls back to the front page. */
export const returnTo = z.string().max(RETURN_TO_MAX).refine(isSameSitePath, 'must be a path on this site');

export const buildMembership = z.object({
  buildId: z.number().int(),
  buildTitle: z.string(),
  buildSlug: z.string(),
  role: z.enum(['owner', 'editor']),
});
export const sponsorMembership = z.object({ sponsorId: z.number().int(), sponsorName: z.string(), sponsorSlug: z.string() });

export const account = z.object({
  id: z.number().int(),
  handle: z.string(),
  displayName: z.string(),
  avatarUrl: z.string().nullable(),
  email: z.string().nullable(),
  noticeEmail: z.string().nullable(),
  isAdmin: z.boolean(),
  signInMethods: z.array(z.enum(['github', 'email'])),
  builds: z.array(buildMembership),
  sponsors: z.array(sponsorMembership),
});
export type Account = z.infer<typeof account>;

export const sessionResponse = z.object({ account: account.nullable() });
export type SessionResponse = z.infer<typeof sessionResponse>;

export const csrfResponse = z.object({ token: z.string() });

export const signInLinkRequest = z.object({ email: emailAddress, returnTo: returnTo.optional() });
export const signInLinkRedeem = z.object({ token: z.string().min(20).max(200) });
export const signInLinkRedeemResponse = z.object({ account, returnTo: z.string() });

export const accountUpdate = z
  .object({
    displayName: z.string().trim().min(1, 'must not be empty').max(80).optional(),
    noticeEmail: emailAddress.nullable().optional(),
  })
  .refine((v) => v.displayName !== undefined || v.noticeEmail !== undefined, { message: 'nothing to change', path: ['displayName'] });

export const invitationCreate = z.object({ email: emailAddress });
export const invitation = z.object({
  id: z.number().int(),
  kind: z.enum(['build-editor', 'sponsor-member']),
  email: z.string(),
  status: z.enum(['pending', 'accepted', 'revoked', 'expired']),
  expiresAt: z.string(),
  lastSentAt: z.string(),
  createdAt: z.string(),
});
export type Invitation = z.infer<typeof invitation>;
export const invitationList = z.object({ items: z.array(invitation) });
export const invitationTokenBody = z.object({ token: z.string().min(20).max(200) });
export const invitationLookup = z.object({
  kind: z.enum(['build-editor', 'sponsor-member']),
  email: z.string(),
  status: z.enum(['pending', 'accepted', 'revoked', 'expired']),
  target: z.object({ id: z.number().int(), title: z.string() }),
  invitedBy: z.string().nullable(),
});
export type InvitationLookup = z.infer<typeof invitationLookup>;
export const invitationAcceptResponse = z.object({ kind: z.enum(['build-editor', 'sponsor-member']), targetId: z.number().int() });

export const buildMember = z.object({
  userId: z.number().int(),
  handle: z.string(),
  displayName: z.string(),
  avatarUrl: z.string().nullable(),
  role: z.enum(['owner', 'editor']),
});
export const buildMemberList = z.object({ items: z.array(buildMember) });

export const adminAccountsQuery = pageQuery.extend({ q: z.string().trim().max(100).optional() });
export const adminAccount = z.object({
  id: z.number().int(),
  handle: z.string(),
  displayName: z.string(),
  email: z.string().nullable(),
  isAdmin: z.boolean(),
  suspendedAt: z.string().nullable(),
  createdAt: z.string(),
});
export type AdminAccount = z.infer<typeof adminAccount>;
export const adminAccountList = pagedList(adminAccount);
export const adminAccountAction = z.object({ action: z.enum(['suspend', 'restore', 'grant-admin', 'revoke-admin']) });
export type AdminAccountAction = z.infer<typeof adminAccountAction>['action'];
