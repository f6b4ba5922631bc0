import { Link } from 'react-router';
import { Button } from '../../../components/ui/button';
import { DateText } from '../../../components/ui/date-text';
import { StateMessage } from '../../../components/ui/state-message';
import type { NotificationsResponse } from '../../../shared/schemas/following';
import { useMarkRead } from '../api/mutations';

/** The person's notifications, unread ones marked; opening one marks it read. */
export function NotificationsList({ data }: { data: NotificationsResponse }) {
  const mark = useMarkRead();
  if (!data.items.length)
    return (
      <StateMessage kind="empty" title="No notifications yet.">
        <p>New episodes of what you follow, replies to your posts and changes to their state show here.</p>
      </StateMessage>
    );
  return (
    <>
      <div className="mb-3 flex items-center justify-between gap-3">
        <p className="text-ink-2">{data.unreadCount ? `${data.unreadCount} unread` : 'All read'}</p>
        <Button variant="secondary" disabled={!data.unreadCount || mark.isPending} onClick={() => mark.mutate('all')}>
          Mark all read
        </Button>
      </div>
      <ul className="divide-y divide-rule border-y border-rule">
        {data.items.map((n) => (
          <li key={n.id} className={`flex gap-3 py-3 ${n.read ? '' : 'border-l-4 border-l-oxide pl-3'}`}>
            <div className="min-w-0 flex-1">
              <Link
                to={n.path}
                onClick={() => (n.read ? undefined : mark.mutate([n.id]))}
                className={n.read ? 'text-ink-2' : 'font-semibold'}
              >
                {n.text}
              </Link>
              <p className="text-[14px] text-slate">
                <DateText iso={n.createdAt} />
                {n.read ? null : (
                  <span className="ml-2 font-condensed text-xs font-semibold tracking-[0.12em] text-oxide-2 uppercase">Unread</span>
                )}
              </p>
            </div>
          </li>
        ))}
      </ul>
    </>
  );
}
