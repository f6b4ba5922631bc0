import { useEffect, useId, useRef, useState, type FormEvent } from 'react';
import { Button } from '../../../../components/ui/button';
import { fieldClass } from '../../../../components/ui/text-field';
import { readLinkHref } from '../../model/link-href';

interface LinkDialogProps {
  open: boolean;
  /** The link under the cursor, when there is one. */
  initialHref: string;
  onSet: (href: string) => void;
  onRemove: () => void;
  onClose: () => void;
}

/** Adds or changes a link on the selected text: a modal on the native <dialog> (focus trap, Escape). */
export function LinkDialog({ open, initialHref, onSet, onRemove, onClose }: LinkDialogProps) {
  const ref = useRef<HTMLDialogElement>(null);
  const inputRef = useRef<HTMLInputElement>(null);
  const [href, setHref] = useState(initialHref);
  const [error, setError] = useState<string | null>(null);
  const id = useId();

  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) {
      setHref(initialHref);
      setError(null);
      if (typeof dialog.showModal === 'function') dialog.showModal();
      else dialog.setAttribute('open', '');
      inputRef.current?.focus();
    } else if (!open && dialog.open) {
      if (typeof dialog.close === 'function') dialog.close();
      else dialog.removeAttribute('open');
    }
  }, [open, initialHref]);

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const result = readLinkHref(href);
    if (!result.ok) return setError(result.message);
    onSet(result.href);
  };

  return (
    <dialog
      ref={ref}
      aria-labelledby={`${id}-title`}
      onCancel={(event) => {
        event.preventDefault();
        onClose();
      }}
      className="m-auto w-[min(30rem,calc(100vw-2rem))] border-[1.5px] border-ink bg-card p-0 text-ink backdrop:bg-ink/60"
    >
      {open ? (
        <form noValidate onSubmit={submit} className="p-5">
          <h2 id={`${id}-title`} className="font-serif text-xl font-bold">
            {initialHref ? 'Change the link' : 'Add a link'}
          </h2>
          <label htmlFor={`${id}-href`} className="mt-4 block font-semibold">
            Address
          </label>
          <p id={`${id}-hint`} className="mt-0.5 text-[15px] text-slate">
            A web address (https://…) or an e-mail address (mailto:…).
          </p>
          <input
            id={`${id}-href`}
            ref={inputRef}
            type="url"
            inputMode="url"
            spellCheck={false}
            autoComplete="off"
            value={href}
            aria-invalid={error ? true : undefined}
            aria-describedby={`${id}-hint${error ? ` ${id}-error` : ''}`}
            className={`${fieldClass} mt-1.5`}
            onChange={(e) => setHref(e.target.value)}
          />
          {error ? (
            <p id={`${id}-error`} className="mt-1 text-[15px] font-semibold text-oxide-2">
              {error}
            </p>
          ) : null}
          <div className="mt-5 flex flex-wrap justify-end gap-3">
            <Button variant="secondary" onClick={onClose}>
              Cancel
            </Button>
            {initialHref ? (
              <Button variant="secondary" onClick={onRemove}>
                Remove the link
              </Button>
            ) : null}
            <Button type="submit">{initialHref ? 'Change link' : 'Add link'}</Button>
          </div>
        </form>
      ) : null}
    </dialog>
  );
}
