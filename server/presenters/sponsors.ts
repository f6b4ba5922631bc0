import type { SponsorRef } from '../../src/shared/schemas/sponsors';
import { fileUrl } from './media';

/** A sponsor row with its logo's media columns (left-joined, so all may be null). */
export interface SponsorRefRow {
  id: number;
  slug: string;
  name: string;
  website: string | null;
  logo_id: number | null;
  logo_sha256: string | null;
  logo_object_key: string | null;
  logo_variants: unknown;
}

/** Maps a sponsor row to the API's reference: name, website and the served logo (the largest size made, else the original). */
export function presentSponsorRef(r: SponsorRefRow): SponsorRef {
  let logoUrl: string | null = null;
  if (r.logo_id !== null && r.logo_sha256 !== null && r.logo_object_key !== null) {
    const variants = Array.isArray(r.logo_variants) ? (r.logo_variants as Array<{ key: string }>) : [];
    const key = variants[variants.length - 1]?.key ?? r.logo_object_key;
    logoUrl = fileUrl({ id: r.logo_id, sha256: r.logo_sha256 }, key);
  }
  return { id: r.id, slug: r.slug, name: r.name, website: r.website, logoUrl };
}
