import type { SponsorRef } from '../../src/shared/schemas/sponsors';
import type { Variant } from '../services/media/pipeline';
import { fileUrl } from './media';

export interface SponsorRow {
  id: number;
  slug: string;
  name: string;
  website: string | null;
  /** The logo's media row fields, joined (null when there is no logo). */
  logo_id: number | null;
  logo_sha256: string | null;
  logo_object_key: string | null;
  logo_variants: unknown;
}

/** The logo's address: its smallest WebP size once made (logos show small), else the cleaned original. */
export function logoUrl(r: Pick<SponsorRow, 'logo_id' | 'logo_sha256' | 'logo_object_key' | 'logo_variants'>): string | null {
  if (r.logo_id === null || !r.logo_sha256 || !r.logo_object_key) return null;
  const variants = Array.isArray(r.logo_variants) ? (r.logo_variants as Variant[]) : [];
  const smallest = [...variants].sort((a, b) => a.width - b.width)[0];
  return fileUrl({ id: r.logo_id, sha256: r.logo_sha256 }, smallest ? smallest.key : r.logo_object_key);
}

/** Maps a sponsor row (with its logo joined) to the shared `sponsorRef`. */
export function presentSponsorRef(r: SponsorRow): SponsorRef {
  return { id: r.id, slug: r.slug, name: r.name, website: r.website, logoUrl: logoUrl(r) };
}
