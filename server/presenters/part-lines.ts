import { formatScaled, parseScaled, QUANTITY_SCALE, RATE_SCALE } from '../../src/shared/money';
import type { PartLine } from '../../src/shared/schemas/parts';
import type { LineRow } from '../db/part-lines.queries';

/** numeric arrives as a string ("2.500"); the API sends it without trailing zeros ("2.5"). */
const decimal = (v: string, scale: number) => formatScaled(parseScaled(v, scale) ?? 0n, scale);

/** Maps a converted line row to the API's part line. */
export function presentPartLine(r: LineRow): PartLine {
  return {
    id: r.id,
    buildId: r.build_id,
    episodeId: r.episode_id,
    position: r.position,
    kind: r.kind,
    description: r.description,
    partNumber: r.part_number,
    supplier: r.supplier_id !== null && r.supplier_name !== null ? { id: r.supplier_id, name: r.supplier_name } : null,
    systemKey: r.system_key,
    atSeconds: r.at_seconds,
    source: r.source,
    status: r.status,
    quantity: decimal(r.quantity, QUANTITY_SCALE),
    unit: r.unit as PartLine['unit'],
    unitPriceMinor: r.unit_price_minor,
    currency: r.currency,
    taxRateBp: r.tax_rate_bp,
    taxIncluded: r.tax_included,
    fxRate: r.fx_rate === null ? null : decimal(r.fx_rate, RATE_SCALE),
    avoidedCostMinor: r.avoided_cost_minor,
    buyUrl: r.buy_url,
    affiliate: r.affiliate,
    openItem: r.open_item_id !== null && r.open_item_title !== null ? { id: r.open_item_id, title: r.open_item_title } : null,
    receipt:
      r.receipt_media_id !== null && r.receipt_content_type !== null
        ? { id: r.receipt_media_id, contentType: r.receipt_content_type }
        : null,
    supportKind: r.support_kind,
    sponsor:
      r.sponsor_id !== null && r.sponsor_name !== null ? { id: r.sponsor_id, slug: r.sponsor_slug ?? '', name: r.sponsor_name } : null,
    listPriceMinor: r.list_price_minor,
    valueGivenMinor: r.value_given_minor,
    suggestedSponsor:
      r.suggested_sponsor_id !== null && r.suggested_sponsor_name !== null
        ? { id: r.suggested_sponsor_id, slug: r.suggested_sponsor_slug ?? '', name: r.suggested_sponsor_name }
        : null,
    amounts: { netMinor: r.net_minor, taxMinor: r.tax_minor, grossMinor: r.gross_minor },
    buildAmounts:
      r.b_gross === null ? null : { netMinor: r.b_net ?? 0, taxMinor: r.b_tax ?? 0, grossMinor: r.b_gross, avoidedMinor: r.b_avoided },
    episode: { number: r.episode_number, title: r.episode_title, slug: r.episode_slug },
  };
}
