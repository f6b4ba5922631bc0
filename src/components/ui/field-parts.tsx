import type { ReactNode } from 'react';

/** The ids a field's hint and error take, and the aria-describedby that ties them to the control. */
export function fieldIds(id: string, hint: ReactNode, error: string | undefined) {
  const hintId = `${id}-hint`;
  const errorId = `${id}-error`;
  const describedBy = [hint ? hintId : null, error ? errorId : null].filter(Boolean).join(' ') || undefined;
  return { hintId, errorId, describedBy };
}

export function FieldHint({ id, children }: { id: string; children: ReactNode }) {
  return (
    <p id={id} className="mt-0.5 text-[15px] text-slate">
      {children}
    </p>
  );
}

export function FieldError({ id, message }: { id: string; message: string }) {
  return (
    <p id={id} className="mt-1 text-[15px] font-semibold text-oxide-2">
      {sentence(message)}
    </p>
  );
}

/** Schema messages are written lower-case ("needs a title"); on screen they start a sentence. */
export function sentence(message: string): string {
  return message.charAt(0).toUpperCase() + message.slice(1);
}
