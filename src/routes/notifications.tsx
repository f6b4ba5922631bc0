import { Link } from 'react-router';
import { Button } from '../components/ui/button';
import { PageHeading } from '../components/ui/page-heading';
import { StateMessage } from '../components/ui/state-message';
import { notificationsOptions, useNotifications } from '../features/following/api/queries';
import { NotificationsList } from '../features/following/components/notifications-list';
import { requireAccount, rethrowAsRouteError, type LoaderDeps } from './route-guards';

export function notificationsLoader(deps: LoaderDeps) {
  return async ({ request }: { request: Request }) => {
    await requireAccount(deps, request);
    await deps.queryClient.ensureQueryData(notificationsOptions(deps.api)).catch(rethrowAsRouteError);
    return null;
  };
}

export function NotificationsPage() {
  const { data, error, refetch, isFetching } = useNotifications();
  return (
    <>
      <title>Notifications — Rivet &amp; Reel</title>
      <meta name="robots" content="noindex" />
      <PageHeading label="Your account" title="Notifications">
        Which of these also come by e-mail is up to you:{' '}
        <Link to="/account/notices" className="underline underline-offset-2">
          notice settings
        </Link>
        .
      </PageHeading>
      {data ? (
        <NotificationsList data={data} />
      ) : error ? (
        <StateMessage
          kind="error"
          title="Notifications could not be loaded."
          action={
            <Button onClick={() => void refetch()} disabled={isFetching}>
              Try again
            </Button>
          }
        />
      ) : (
        <StateMessage kind="loading" title="Loading…" />
      )}
    </>
  );
}
