import { Link, NavLink, Outlet } from 'react-router';
import { paths } from '../shared/paths';

export interface NavItem {
  label: string;
  to: string;
  /** Match the path exactly, so the front page is not "active" on every page below it. */
  end?: boolean;
}

/** The header navigation; later screens add their entries here. */
export const navItems: readonly NavItem[] = [{ label: 'Latest episodes', to: paths.home(), end: true }];

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

/** Off-screen until focused, so keyboard readers can jump past the header. */
export function SkipLink() {
  return (
    <a href="#main" className="fixed top-2 left-2 z-50 -translate-y-[200%] bg-ink px-4 py-2 font-semibold text-paper focus:translate-y-0">
      Skip to content
    </a>
  );
}

export function SiteHeader() {
  return (
    <header className="on-ink bg-ink text-paper">
      <div className="page-wrap flex flex-wrap items-center gap-x-7 gap-y-1 py-3">
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
      </div>
    </header>
  );
}

export function SiteFooter() {
  return (
    <footer className="mt-16 border-t border-rule bg-paper-2">
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
        <Outlet />
      </main>
      <SiteFooter />
    </div>
  );
}
