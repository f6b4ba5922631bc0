import { useEffect, useId, useState, type KeyboardEvent } from 'react';
import { fieldClass } from '../../../../components/ui/text-field';
import { useCreateSupplier, useSuppliers, type Supplier } from '../../api/get-suppliers';

interface SupplierFieldProps {
  buildId: number;
  label: string;
  name: string;
  /** The chosen supplier's id ('' for none). */
  supplierId: string;
  /** `sponsor` is the organisation standing behind a picked supplier (only a suggestion for the line). */
  onChange: (next: { supplierId: string; supplierName: string; sponsor?: { id: number; name: string } | null }) => void;
  error?: string;
  errorId?: string;
}

type Option = { kind: 'supplier'; supplier: Supplier } | { kind: 'create'; name: string };

function useDebounced(value: string, ms: number): string {
  const [debounced, setDebounced] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setDebounced(value), ms);
    return () => clearTimeout(t);
  }, [value, ms]);
  return debounced;
}

/**
 * The supplier cell: a combobox over GET /api/suppliers (the build's own first). A name that
 * matches none offers "Create supplier …". Arrow keys move, Enter picks, Escape closes; Enter
 * with the list closed belongs to the row (it saves).
 */
export function SupplierField({ buildId, label, name, supplierId, onChange, error, errorId }: SupplierFieldProps) {
  const id = useId();
  const [open, setOpen] = useState(false);
  const [active, setActive] = useState(0);
  const q = useDebounced(name.trim(), 150);
  const { data } = useSuppliers(q, buildId, open);
  const create = useCreateSupplier();
  // Only names that contain what is typed now: an answer for an older (debounced) query never offers a stale pick.
  const typed = name.trim().toLowerCase();
  const items = (data?.items ?? []).filter((s) => s.name.toLowerCase().includes(typed));
  const exact = items.some((s) => s.name.toLowerCase() === typed);
  const options: Option[] = [
    ...items.slice(0, 8).map((supplier): Option => ({ kind: 'supplier', supplier })),
    ...(name.trim() && !exact ? [{ kind: 'create', name: name.trim() } as const] : []),
  ];
  const listId = `${id}-list`;
  const shown = open && options.length > 0;

  const pick = (option: Option | undefined) => {
    if (!option) return;
    setOpen(false);
    if (option.kind === 'supplier')
      return onChange({ supplierId: String(option.supplier.id), supplierName: option.supplier.name, sponsor: option.supplier.sponsor });
    create.mutate(
      { name: option.name, website: null },
      { onSuccess: (created) => onChange({ supplierId: String(created.id), supplierName: created.name, sponsor: created.sponsor }) },
    );
  };

  const onKeyDown = (event: KeyboardEvent<HTMLInputElement>) => {
    if (event.key === 'ArrowDown') {
      event.preventDefault();
      if (!open) setOpen(true);
      else setActive((a) => Math.min(options.length - 1, a + 1));
    } else if (event.key === 'ArrowUp') {
      event.preventDefault();
      setActive((a) => Math.max(0, a - 1));
    } else if (event.key === 'Escape' && open) {
      event.preventDefault();
      event.stopPropagation();
      setOpen(false);
    } else if (event.key === 'Enter' && shown) {
      // Picking from the list is this key's job; the row must not save half-chosen.
      event.preventDefault();
      event.stopPropagation();
      pick(options[active]);
    }
  };

  return (
    <div className="relative">
      <label htmlFor={id} className="block text-[14px] font-semibold text-ink">
        {label}
      </label>
      <input
        id={id}
        role="combobox"
        aria-expanded={shown}
        aria-controls={listId}
        aria-autocomplete="list"
        aria-activedescendant={shown && options[active] ? `${id}-opt-${active}` : undefined}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? errorId : undefined}
        autoComplete="off"
        value={name}
        className={`mt-1 ${fieldClass}`}
        onChange={(e) => {
          // Typing drops the chosen record until a name is picked again.
          onChange({ supplierId: '', supplierName: e.target.value, sponsor: null });
          setOpen(true);
          setActive(0);
        }}
        onKeyDown={onKeyDown}
        onBlur={() => {
          setOpen(false);
          const match = items.find((s) => s.name.toLowerCase() === typed);
          if (!supplierId && match) onChange({ supplierId: String(match.id), supplierName: match.name, sponsor: match.sponsor });
        }}
      />
      <ul
        id={listId}
        role="listbox"
        aria-label={`${label}: suggestions`}
        className={shown ? 'absolute z-20 mt-1 max-h-64 w-full min-w-56 overflow-auto border-[1.5px] border-ink bg-card' : 'hidden'}
      >
        {shown
          ? options.map((option, i) => (
              <li
                key={option.kind === 'supplier' ? option.supplier.id : 'create'}
                id={`${id}-opt-${i}`}
                role="option"
                aria-selected={i === active}
                className={`cursor-pointer px-3 py-2 text-[15px] ${i === active ? 'bg-ink text-paper' : 'text-ink'}`}
                // mousedown, not click: it lands before the input's blur closes the list.
                onMouseDown={(e) => {
                  e.preventDefault();
                  pick(option);
                }}
              >
                {option.kind === 'supplier' ? (
                  <>
                    {option.supplier.name}
                    {option.supplier.usedInBuild ? <span className="ml-2 text-[13px] opacity-80">· used in this build</span> : null}
                  </>
                ) : (
                  <>Create supplier “{option.name}”</>
                )}
              </li>
            ))
          : null}
      </ul>
      {create.isPending ? <p className="mt-1 text-[13px] text-slate">Creating the supplier…</p> : null}
      {create.isError ? (
        <p className="mt-1 text-[13px] font-semibold text-oxide-2">The supplier was not created: {create.error.message}</p>
      ) : null}
    </div>
  );
}
