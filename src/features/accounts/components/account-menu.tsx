import { useEffect, useId, useRef, useState, type KeyboardEvent } from 'react';
import { Link } from 'react-router';
import type { Account } from '../../../shared/schemas/accounts';
import { useSignOut } from '../api/sign-out';
import { Avatar } from './avatar';

export interface AccountMenuItem {
  label: string;
  to: string;
}

const itemClass =
  'block w-full px-4 py-2.5 text-left font-condensed text-[15px] font-semibold tracking-[0.08em] text-ink uppercase no-underline hover:bg-paper-2 focus-visible:bg-paper-2';

/**
 * The signed-in person's menu in the header: a disclosure button with their picture and name, over
 * a list of links the app composes (each screen adds its own) and Sign out. Escape, a click
 * outside or moving focus away closes it; arrow keys move between the entries.
 */
export function AccountMenu({ account, items }: { account: Account; items: readonly AccountMenuItem[] }) {
  const [open, setOpen] = useState(false);
  const rootRef = useRef<HTMLDivElement>(null);
  const buttonRef = useRef<HTMLButtonElement>(null);
  const listId = useId();
  const signOut = useSignOut();

  useEffect(() => {
    if (!open) return;
    const onPointerDown = (event: PointerEvent) => {
      if (event.target instanceof Node && !rootRef.current?.contains(event.target)) setOpen(false);
    };
    document.addEventListener('pointerdown', onPointerDown);
    return () => document.removeEventListener('pointerdown', onPointerDown);
  }, [open]);

  const entries = () => Array.from(rootRef.current?.querySelectorAll<HTMLElement>('[data-menu-entry]') ?? []);

  const focusEntry = (index: number) => {
    const all = entries();
    all[(index + all.length) % all.length]?.focus();
  };

  const onKeyDown = (event: KeyboardEvent<HTMLDivElement>) => {
    if (event.key === 'Escape' && open) {
      event.preventDefault();
      setOpen(false);
      buttonRef.current?.focus();
      return;
    }
    if (event.key !== 'ArrowDown' && event.key !== 'ArrowUp') return;
    event.preventDefault();
    const down = event.key === 'ArrowDown';
    if (!open) {
      setOpen(true);
      // The list renders on the next commit; focus once it is there.
      requestAnimationFrame(() => focusEntry(down ? 0 : -1));
      return;
    }
    const current = entries().indexOf(document.activeElement as HTMLElement);
    focusEntry(current === -1 ? (down ? 0 : -1) : current + (down ? 1 : -1));
  };

  return (
    <div
      ref={rootRef}
      className="relative"
      onKeyDown={onKeyDown}
      onBlur={(event) => {
        if (open && !(event.relatedTarget instanceof Node && event.currentTarget.contains(event.relatedTarget))) setOpen(false);
      }}
    >
      <button
        ref={buttonRef}
        type="button"
        aria-expanded={open}
        aria-controls={listId}
        onClick={() => setOpen((o) => !o)}
        className="flex min-h-11 items-center gap-2 px-1 text-paper"
      >
        <Avatar name={account.displayName} url={account.avatarUrl} />
        {/* The name is the button's label; on a phone it is read out but not shown. */}
        <span className="sr-only max-w-[12rem] truncate font-condensed text-[15px] font-medium tracking-[0.08em] uppercase sm:not-sr-only">
          {account.displayName}
        </span>
        <span aria-hidden="true" className="text-xs text-rule">
          {open ? '▴' : '▾'}
        </span>
      </button>
      <div
        id={listId}
        hidden={!open}
        className="absolute top-full right-0 z-40 mt-1 w-60 max-w-[calc(100vw-2rem)] border-[1.5px] border-ink bg-card py-1 text-ink shadow-lg"
      >
        <p className="border-b border-rule px-4 pt-1.5 pb-2 text-[15px] text-slate">
          Signed in as <span className="font-semibold text-ink">@{account.handle}</span>
        </p>
        <ul>
          {items.map((item) => (
            <li key={item.to}>
              <Link to={item.to} data-menu-entry="" className={itemClass} onClick={() => setOpen(false)}>
                {item.label}
              </Link>
            </li>
          ))}
          <li className="mt-1 border-t border-rule pt-1">
            <button type="button" data-menu-entry="" className={itemClass} disabled={signOut.isPending} onClick={() => signOut.mutate()}>
              {signOut.isPending ? 'Signing out…' : 'Sign out'}
            </button>
          </li>
        </ul>
        {signOut.isError ? (
          <p role="alert" className="px-4 pt-1 pb-2 text-[15px] text-oxide-2">
            Could not sign out: {signOut.error.message}
          </p>
        ) : null}
      </div>
    </div>
  );
}
