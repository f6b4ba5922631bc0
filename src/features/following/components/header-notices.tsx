import { NavLink } from 'react-router';
import { useNotifications } from '../api/queries';

const linkClass = ({ isActive }: { isActive: boolean }) =>
  `inline-flex min-h-11 items-center gap-1.5 border-b-2 font-condensed text-[15px] font-medium tracking-[0.08em] uppercase no-underline ${isActive ? 'border-brass text-paper' : 'border-transparent text-rule hover:text-paper'}`;

function Count({ n, label }: { n: number; label: string }) {
  if (!n) return null;
  return (
    <span className="inline-block min-w-5 bg-oxide px-1 text-center font-mono text-[12px] leading-5 text-paper">
      {n > 99 ? '99+' : n}
      <span className="sr-only"> {label}</span>
    </span>
  );
}

/** The header's Inbox (build teams, with open posts) and Notifications (with the unread count) links. */
export function HeaderNotices({ onTeam }: { onTeam: boolean }) {
  const { data } = useNotifications();
  return (
    <>
      {onTeam ? (
        <NavLink to="/inbox" className={linkClass}>
          Inbox <Count n={data?.openPostCount ?? 0} label="open posts" />
        </NavLink>
      ) : null}
      <NavLink to="/notifications" className={linkClass}>
        <span className="sr-only sm:not-sr-only">Notifications</span>
        <span aria-hidden="true" className="sm:hidden">
          ◉
        </span>
        <Count n={data?.unreadCount ?? 0} label="unread" />
      </NavLink>
    </>
  );
}
