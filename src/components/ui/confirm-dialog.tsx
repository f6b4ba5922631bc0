import { useEffect, useId, useRef, type ReactNode } from 'react';
import { Button } from './button';

interface ConfirmDialogProps {
  open: boolean;
  /** A question that names what will go: "Remove Ida Ironside from the build team?" */
  title: string;
  /** What happens, in plain words, and what stays. */
  children: ReactNode;
  confirmLabel: string;
  cancelLabel?: string;
  /** Destructive by default; 'primary' for actions that can be undone later (restore, grant). */
  tone?: 'danger' | 'primary';
  pending?: boolean;
  /** Why the action was refused, shown inside the dialog so the reader keeps the context. */
  error?: ReactNode;
  onConfirm: () => void;
  onClose: () => void;
}

/**
 * A modal confirmation on the native <dialog>: the browser traps focus, makes the page behind
 * inert, closes on Escape and returns focus to the button that opened it.
 */
export function ConfirmDialog({
  open,
  title,
  children,
  confirmLabel,
  cancelLabel = 'Cancel',
  tone = 'danger',
  pending = false,
  error,
  onConfirm,
  onClose,
}: ConfirmDialogProps) {
  const ref = useRef<HTMLDialogElement>(null);
  const cancelRef = useRef<HTMLButtonElement>(null);
  const titleId = useId();
  const bodyId = useId();

  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) {
      if (typeof dialog.showModal === 'function') dialog.showModal();
      else dialog.setAttribute('open', '');
      // The safe choice gets the focus, so a stray Enter does not delete anything.
      cancelRef.current?.focus();
    } else if (!open && dialog.open) {
      if (typeof dialog.close === 'function') dialog.close();
      else dialog.removeAttribute('open');
    }
  }, [open]);

  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      aria-describedby={bodyId}
      onCancel={(event) => {
        // Escape: let React state decide, so the dialog never closes behind its back.
        event.preventDefault();
        if (!pending) onClose();
      }}
      className="m-auto w-[min(30rem,calc(100vw-2rem))] border-[1.5px] border-ink bg-card p-0 text-ink backdrop:bg-ink/60"
    >
      {open ? (
        <div className="px-5 pt-5 pb-5">
          <h2 id={titleId} className="font-serif text-xl leading-snug font-bold">
            {title}
          </h2>
          <div id={bodyId} className="mt-3 space-y-2 text-ink-2">
            {children}
          </div>
          {error ? (
            <div role="alert" className="mt-4 border border-l-4 border-rule border-l-oxide-2 bg-paper px-3 py-2 text-ink">
              {error}
            </div>
          ) : null}
          <div className="mt-5 flex flex-wrap justify-end gap-3">
            <Button ref={cancelRef} variant="secondary" onClick={onClose} disabled={pending}>
              {cancelLabel}
            </Button>
            <Button variant={tone} onClick={onConfirm} disabled={pending} aria-busy={pending || undefined}>
              {pending ? 'Working…' : confirmLabel}
            </Button>
          </div>
        </div>
      ) : null}
    </dialog>
  );
}
