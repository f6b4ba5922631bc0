import { Link } from 'react-router';
import { PageHeading } from '../components/ui/page-heading';
import { QueryState } from '../components/ui/query-state';
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
      ) : (
        <QueryState
          error={error}
          isFetching={isFetching}
          refetch={refetch}
          errorTitle="Notifications could not be loaded."
          loadingTitle="Loading…"
        />
      )}
    </>
  );
}
