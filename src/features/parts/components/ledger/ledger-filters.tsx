import { Form } from 'react-router';
import { Button, ButtonLink } from '../../../../components/ui/button';
import { SelectField } from '../../../../components/ui/select-field';
import { PART_KINDS, PART_STATUSES, type LedgerQuery } from '../../../../shared/schemas/parts';
import { KIND_LABELS, STATUS_LABELS } from '../../lib/labels';

export interface LedgerFilterOptions {
  episodes: ReadonlyArray<{ id: number; number: number; title: string }>;
  systems: ReadonlyArray<{ key: string; name: string }>;
  suppliers: ReadonlyArray<{ supplierId: number | null; name: string }>;
}

/**
 * The filter as a GET form: it changes the URL's search params, which the loader and the page read
 * (so a filtered ledger can be bookmarked and works without JavaScript). Sorting stays as it was.
 */
export function LedgerFilters({ query, options, resetHref }: { query: LedgerQuery; options: LedgerFilterOptions; resetHref: string }) {
  const filtered = Boolean(query.episodeId || query.systemKey || query.supplierId || query.kind || query.status || query.receipt);
  return (
    <Form
      method="get"
      role="search"
      aria-label="Filter the ledger"
      className="grid grid-cols-1 gap-3 sm:grid-cols-2 lg:grid-cols-6 lg:items-end"
    >
      {/* Keyed by the query so the selects follow the URL on back and forward. */}
      <SelectField key={`e${query.episodeId ?? ''}`} label="Episode" name="episodeId" defaultValue={query.episodeId ?? ''}>
        <option value="">All episodes</option>
        {options.episodes.map((e) => (
          <option key={e.id} value={e.id}>
            {e.number} · {e.title}
          </option>
        ))}
      </SelectField>
      <SelectField key={`s${query.systemKey ?? ''}`} label="System" name="systemKey" defaultValue={query.systemKey ?? ''}>
        <option value="">All systems</option>
        {options.systems.map((s) => (
          <option key={s.key} value={s.key}>
            {s.name}
          </option>
        ))}
      </SelectField>
      <SelectField key={`p${query.supplierId ?? ''}`} label="Supplier" name="supplierId" defaultValue={query.supplierId ?? ''}>
        <option value="">All suppliers</option>
        {options.suppliers
          .filter((s) => s.supplierId !== null)
          .map((s) => (
            <option key={s.supplierId} value={s.supplierId ?? ''}>
              {s.name}
            </option>
          ))}
      </SelectField>
      <SelectField key={`k${query.kind ?? ''}`} label="Kind" name="kind" defaultValue={query.kind ?? ''}>
        <option value="">All kinds</option>
        {PART_KINDS.map((k) => (
          <option key={k} value={k}>
            {KIND_LABELS[k]}
          </option>
        ))}
      </SelectField>
      <SelectField key={`t${query.status ?? ''}`} label="Status" name="status" defaultValue={query.status ?? ''}>
        <option value="">All statuses</option>
        {PART_STATUSES.map((s) => (
          <option key={s} value={s}>
            {STATUS_LABELS[s]}
          </option>
        ))}
      </SelectField>
      <SelectField key={`r${query.receipt ?? ''}`} label="Receipt" name="receipt" defaultValue={query.receipt ?? ''}>
        <option value="">With or without</option>
        <option value="missing">Lines without a receipt</option>
        <option value="attached">Lines with a receipt</option>
      </SelectField>
      {query.sort !== 'episode' ? <input type="hidden" name="sort" value={query.sort} /> : null}
      {query.dir !== 'asc' ? <input type="hidden" name="dir" value={query.dir} /> : null}
      <div className="flex flex-wrap gap-2">
        <Button type="submit">Filter</Button>
        {filtered ? <ButtonLink to={resetHref}>Clear</ButtonLink> : null}
      </div>
    </Form>
  );
}
