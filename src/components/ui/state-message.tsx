import type { ReactNode } from 'react';

export type StateKind = 'empty' | 'error' | 'loading';

const kindClass: Record<StateKind, string> = {
  empty: 'border-rule',
  error: 'border-rule border-l-4 border-l-oxide-2',
  loading: 'border-rule border-dashed',
};

interface StateMessageProps {
  kind: StateKind;
  title: string;
  children?: ReactNode;
  /** A button or link that gets the reader out of this state (retry, go to page 1). */
  action?: ReactNode;
}

/** One look for the empty, error and loading states of every screen. */
export function StateMessage({ kind, title, children, action }: StateMessageProps) {
  // Errors interrupt (alert); loading is announced politely; an empty list is just content.
  const role = kind === 'error' ? 'alert' : kind === 'loading' ? 'status' : undefined;
  return (
    <div role={role} className={`border bg-card px-5 py-6 ${kindClass[kind]}`}>
      <p className="font-serif text-lg font-bold text-ink">{title}</p>
      {children ? <div className="mt-2 max-w-measure text-ink-2">{children}</div> : null}
      {action ? <div className="mt-4 flex flex-wrap gap-3">{action}</div> : null}
    </div>
  );
}
