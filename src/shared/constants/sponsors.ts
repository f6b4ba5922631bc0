// Kinds of support without the sponsor schemas (src/shared/schemas/sponsors.ts), for code that must
// not load zod: the public episode page.

export const SUPPORT_KINDS = ['gifted', 'discounted', 'paid'] as const;
export type SupportKind = (typeof SUPPORT_KINDS)[number];
export const SUPPORT_KIND_LABELS: Record<SupportKind, string> = { gifted: 'Gifted', discounted: 'Discounted', paid: 'Paid' };
