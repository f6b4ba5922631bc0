import { Button } from './button';
import { StateMessage } from './state-message';

/** What a screen shows before its data is there: the error with a retry, or the loading state. */
export function QueryState({
  error,
  isFetching,
  refetch,
  errorTitle,
  loadingTitle,
}: {
  error: unknown;
  isFetching: boolean;
  refetch: () => unknown;
  errorTitle: string;
  loadingTitle: string;
}) {
  return error ? (
    <StateMessage
      kind="error"
      title={errorTitle}
      action={
        <Button onClick={() => void refetch()} disabled={isFetching}>
          Try again
        </Button>
      }
    />
  ) : (
    <StateMessage kind="loading" title={loadingTitle} />
  );
}
