import { useEffect, useState } from 'react';
import { Form, Link, NavLink, Outlet, useLocation, useSearchParams } from 'react-router';
import { useSession } from '../features/accounts/api/get-session';
import { AccountMenu, type AccountMenuItem } from '../features/accounts/components/account-menu';
import { accountPaths } from '../features/accounts/paths';
import { adminPaths } from '../features/admin/paths';
import { HeaderNotices } from '../features/following/components/header-notices';
import { sponsorPaths } from '../features/sponsors/paths';
import { workbenchPaths } from '../features/workbench/paths';
import { Notice } from '../components/ui/notice';
import { StateMessage } from '../components/ui/state-message';
import { paths } from '../shared/paths';
import type { Account } from '../shared/schemas/accounts';

export interface NavItem {
  label: string;
  to: string;
  /** Match the path exactly, so the front page is not "active" on every page below it. */
  end?: boolean;
}

/** The header navigation; later screens add their entries here. */
export const navItems: readonly NavItem[] = [
  { label: 'Latest', to: paths.home(), end: true },
  { label: 'Builds', to: paths.builds() },
  { label: 'Workshop', to: paths.workshop() },
];

export const PRODUCT_NAME = 'Rivet & Reel';

/** The round brass ring with an oxide centre: our own mark, purely decorative. */
function Mark() {
  return (
    <svg viewBox="0 0 26 26" width="26" height="26" aria-hidden="true" focusable="false" className="shrink-0">
      <circle cx="13" cy="13" r="11.5" fill="none" stroke="#A8823F" strokeWidth="2" />
      <circle cx="13" cy="13" r="6.5" fill="#A3412A" />
      <circle cx="13" cy="13" r="1.6" fill="#1E1B18" />
    </svg>
  );
}

function navClass({ isActive }: { isActive: boolean }): string {
  const state = isActive ? 'border-brass text-paper' : 'border-transparent text-rule hover:text-paper';
  return `inline-block border-b-2 py-1 font-condensed text-[15px] font-medium tracking-[0.08em] uppercase no-underline ${state}`;
}

/**
 * The account menu's entries: only what this person may use (the server enforces every guard
 * again). Later screens add theirs here: Inbox, Sponsor summary, Moderation queue.
 */
export function accountMenuItems(account: Account): AccountMenuItem[] {
  const items: AccountMenuItem[] = [
    { label: 'Workbench', to: workbenchPaths.home() },
    { label: 'Following', to: '/following' },
    { label: 'Notifications', to: '/notifications' },
  ];
  if (account.builds.length) items.splice(1, 0, { label: 'Inbox', to: '/inbox' });
  items.push({ label: 'Account settings', to: accountPaths.settings() }, { label: 'Notice settings', to: '/account/notices' });
  if (account.builds.some((b) => b.role === 'owner')) items.push({ label: 'Build teams', to: accountPaths.builds() });
  // A member of several organisations gets one summary entry each, named.
  for (const s of account.sponsors)
    items.push({
      label: account.sponsors.length > 1 ? `Sponsor summary: ${s.sponsorName}` : 'Sponsor summary',
      to: sponsorPaths.summary(s.sponsorSlug),
    });
  if (account.isAdmin)
    items.push(
      { label: 'Accounts', to: adminPaths.accounts() },
      { label: 'Suppliers', to: adminPaths.suppliers() },
      { label: 'Sponsor organisations', to: adminPaths.sponsors() },
      { label: 'Moderation queue', to: '/moderation' },
    );
  return items;
}

/** "Sign in" for visitors, the account menu for the signed-in; a same-size blank while unknown. */
function AccountArea() {
  const { data, isError } = useSession();
  const { pathname, search } = useLocation();
  if (data?.account)
    return (
      <>
        <HeaderNotices onTeam={data.account.builds.length > 0} />
        <AccountMenu account={data.account} items={accountMenuItems(data.account)} />
      </>
    );
  if (!data && !isError) return <span aria-hidden="true" className="inline-block h-11 w-11" />;
  // On the sign-in pages, keep the return path they already carry instead of pointing back at them.
  const here = `${pathname}${search}`;
  const returnTo = pathname.startsWith('/sign-in') ? (new URLSearchParams(search).get('returnTo') ?? '/') : here;
  return (
    <Link
      to={accountPaths.signIn(returnTo)}
      className="inline-flex min-h-11 items-center border-[1.5px] border-rule px-3 font-condensed text-[15px] font-semibold tracking-[0.08em] text-paper uppercase no-underline hover:border-paper"
    >
      Sign in
    </Link>
  );
}

/** A one-off message carried in navigation state ("You joined the build team"); read in an effect so hydration stays exact. */
function FlashNotice() {
  const location = useLocation();
  const [notice, setNotice] = useState<string | null>(null);
  useEffect(() => {
    const state: unknown = location.state;
    const text = state && typeof state === 'object' && 'notice' in state && typeof state.notice === 'string' ? state.notice : null;
    setNotice(text);
    // Shown once: drop it from the history entry so a reload (or coming back) does not repeat it.
    // React Router keeps its own state under `usr`; the router's in-memory location is left alone.
    if (text && typeof window !== 'undefined') {
      const entry: unknown = window.history.state;
      if (entry && typeof entry === 'object') window.history.replaceState({ ...entry, usr: null }, '');
    }
  }, [location.key, location.state]);
  if (!notice) return null;
  return (
    <Notice kind="success" className="mb-6 max-w-measure">
      {notice}
    </Notice>
  );
}

/** Off-screen until focused, so keyboard readers can jump past the header. */
export function SkipLink() {
  return (
    <a href="#main" className="fixed top-2 left-2 z-50 -translate-y-[200%] bg-ink px-4 py-2 font-semibold text-paper focus:translate-y-0">
      Skip to content
    </a>
  );
}

/** The header's search box: a plain GET form, so it works before (and without) JavaScript. */
function HeaderSearch() {
  const { pathname } = useLocation();
  const [sp] = useSearchParams();
  const current = pathname === '/search' ? (sp.get('q') ?? '') : '';
  return (
    <Form method="get" action="/search" role="search" key={current} className="flex">
      <label htmlFor="site-search" className="sr-only">
        Search builds, episodes and chapters
      </label>
      <input
        id="site-search"
        name="q"
        type="search"
        defaultValue={current}
        maxLength={200}
        placeholder="Search builds, chapters…"
        className="min-h-10 w-40 min-w-0 border border-ink-2 bg-[#2E2A26] px-3 text-[15px] text-paper placeholder:text-rule sm:w-56"
      />
      <button
        type="submit"
        className="min-h-10 border border-l-0 border-ink-2 px-2.5 font-condensed text-[14px] font-semibold tracking-[0.08em] text-paper uppercase hover:bg-ink-2"
      >
        Search
      </button>
    </Form>
  );
}

export function SiteHeader() {
  return (
    <header className="on-ink bg-ink text-paper print:hidden">
      <div className="page-wrap flex flex-wrap items-center gap-x-7 gap-y-1 py-2">
        <Link
          to={paths.home()}
          className="flex items-center gap-2.5 py-1 font-serif text-xl leading-none font-bold text-paper no-underline"
        >
          <Mark />
          {PRODUCT_NAME}
        </Link>
        <nav aria-label="Main">
          <ul className="flex flex-wrap gap-x-5 gap-y-1">
            {navItems.map((item) => (
              <li key={item.to}>
                <NavLink to={item.to} end={item.end} className={navClass}>
                  {item.label}
                </NavLink>
              </li>
            ))}
          </ul>
        </nav>
        <div className="ml-auto flex flex-wrap items-center justify-end gap-x-3 gap-y-1">
          <HeaderSearch />
          <AccountArea />
        </div>
      </div>
    </header>
  );
}

export function SiteFooter() {
  return (
    <footer className="mt-16 border-t border-rule bg-paper-2 print:hidden">
      <div className="page-wrap py-6 text-[15px] text-ink-2">
        <p className="font-serif font-bold text-ink">{PRODUCT_NAME}</p>
        <p className="mt-1 max-w-measure">
          Restorations of old cars, motorcycles, tractors and boats, published session by session: chapters, parts, costs and torque figures
          beside every video.
        </p>
      </div>
    </footer>
  );
}

/** Page chrome around every route; kept in pieces so the error boundary can reuse them. */
export function Shell() {
  return (
    <div className="flex min-h-screen flex-col">
      <SkipLink />
      <SiteHeader />
      {/* tabIndex -1 lets the skip link move focus here, not only scroll. */}
      <main id="main" tabIndex={-1} className="page-wrap w-full flex-1 pt-8 pb-4 focus:outline-none">
        <FlashNotice />
        <Outlet />
      </main>
      <SiteFooter />
    </div>
  );
}

/** What the browser shows before the first loaders finish when there was no server render. */
export function ShellLoading() {
  return (
    <div className="page-wrap pt-8">
      <StateMessage kind="loading" title="Loading…" />
    </div>
  );
}
