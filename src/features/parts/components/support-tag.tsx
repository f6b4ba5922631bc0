import { formatMinor } from '../../../shared/money-format';
import type { PartLine } from '../../../shared/schemas/parts';
import { SUPPORT_KIND_LABELS } from '../../../shared/constants/sponsors';

/** Support on a line as a small tag (LOOK.md "Parts table"): kind and sponsor, list price beneath. */
export function SupportTag({ line, team = false }: { line: PartLine; team?: boolean }) {
  if (!line.supportKind && !line.sponsor) {
    if (team && line.suggestedSponsor)
      return <span className="text-[13px] text-slate">Supplier backed by {line.suggestedSponsor.name}</span>;
    return <span className="text-slate">—</span>;
  }
  const missing = !line.supportKind ? 'kind of support' : !line.sponsor ? 'sponsor' : null;
  return (
    <span className="inline-block">
      <span className="inline-block border border-brass bg-brass-soft px-1.5 py-0.5 font-condensed text-xs font-semibold tracking-[0.1em] text-brass-text uppercase">
        {line.supportKind ? SUPPORT_KIND_LABELS[line.supportKind] : 'Support'}
        {line.sponsor ? ` · ${line.sponsor.name}` : ''}
      </span>
      {line.listPriceMinor !== null ? (
        <span className="block font-mono text-[13px] text-slate">list {formatMinor(line.listPriceMinor, line.currency)}</span>
      ) : null}
      {team && missing ? <span className="block text-[13px] font-semibold text-oxide-2">Needs its {missing} before publishing</span> : null}
    </span>
  );
}
