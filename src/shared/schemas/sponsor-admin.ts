import { z } from 'zod';
import { invitation } from './accounts';
import { sponsorRef } from './sponsors';

// Sponsor organisations as admins keep them (DESIGN.md roles: admins manage sponsor organisations):
// details and logo, the suppliers they stand behind, their members and invitations.

/** One organisation in the admin list. */
export const adminSponsor = sponsorRef.extend({
  members: z.number().int(),
  suppliers: z.number().int(),
  pendingInvitations: z.number().int(),
});
export type AdminSponsor = z.infer<typeof adminSponsor>;
export const adminSponsorList = z.object({ items: z.array(adminSponsor) });

export const sponsorSupplier = z.object({ id: z.number().int(), name: z.string(), website: z.string().nullable() });
export type SponsorSupplier = z.infer<typeof sponsorSupplier>;

export const sponsorMember = z.object({
  userId: z.number().int(),
  handle: z.string(),
  displayName: z.string(),
  email: z.string().nullable(),
  since: z.string(),
});
export type SponsorMember = z.infer<typeof sponsorMember>;

/** One organisation with everything its admin screen shows. */
export const adminSponsorDetail = z.object({
  sponsor: sponsorRef,
  suppliers: z.array(sponsorSupplier),
  members: z.array(sponsorMember),
  invitations: z.array(invitation),
});
export type AdminSponsorDetail = z.infer<typeof adminSponsorDetail>;

/** Linking a supplier carries nothing but the path. */
export const emptyBody = z.object({}).strict();

/** The fields of a logo upload besides the file: the logo's description for screen readers. */
export const sponsorLogoFields = z.object({
  altText: z
    .string()
    .trim()
    .max(300)
    .optional()
    .transform((v) => (v ? v : null)),
});
