import type { ReactNode } from 'react';

export type NoticeKind = 'success' | 'error' | 'info';

const kindClass: Record<NoticeKind, string> = {
  success: 'border-l-gauge bg-gauge-soft',
  error: 'border-l-oxide-2 bg-card',
  info: 'border-l-ink-2 bg-card',
};

/** A short inline message after an action: saved, sent, refused. Errors interrupt; the rest are polite. */
export function Notice({ kind, children, className = '' }: { kind: NoticeKind; children: ReactNode; className?: string }) {
  return (
    <div
      role={kind === 'error' ? 'alert' : 'status'}
      className={`border border-l-4 border-rule px-4 py-3 text-ink ${kindClass[kind]} ${className}`}
    >
      {children}
    </div>
  );
}
