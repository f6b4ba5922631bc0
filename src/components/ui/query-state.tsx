import { Button } from './button';
import { StateMessage } from './state-message';

/**
 * What a screen shows before its data is there: the error with a retry, or the loading state.
 * `showMessage` adds the error's own message and says "Trying again…" while it retries (screens
 * whose errors carry something the reader can act on: admin lists, the ledger, the sponsor summary).
 */
export function QueryState({
  error,
  isFetching,
  refetch,
  errorTitle,
  loadingTitle,
  showMessage = false,
}: {
  error: unknown;
  isFetching: boolean;
  refetch: () => unknown;
  errorTitle: string;
  loadingTitle: string;
  showMessage?: boolean;
}) {
  return error ? (
    <StateMessage
      kind="error"
      title={errorTitle}
      action={
        <Button onClick={() => void refetch()} disabled={isFetching}>
          {showMessage && isFetching ? 'Trying again…' : 'Try again'}
        </Button>
      }
    >
      {showMessage && error instanceof Error ? <p>{error.message}</p> : null}
    </StateMessage>
  ) : (
    <StateMessage kind="loading" title={loadingTitle} />
  );
}
