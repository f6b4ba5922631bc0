// @vitest-environment happy-dom
import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { QueryState } from './query-state';

afterEach(cleanup);

describe('QueryState', () => {
  it('shows the loading state while there is no error', () => {
    render(
      <QueryState
        error={null}
        isFetching
        refetch={() => {}}
        errorTitle="The ledger could not be loaded."
        loadingTitle="Loading the ledger…"
      />,
    );
    expect(screen.getByText('Loading the ledger…')).toBeTruthy();
  });

  it('with showMessage, shows the error’s message and says so while it tries again', () => {
    const refetch = vi.fn();
    const props = {
      error: new Error('A service this request needs is unavailable'),
      refetch,
      errorTitle: 'The ledger could not be loaded.',
      loadingTitle: '',
    };
    const { rerender } = render(<QueryState {...props} isFetching={false} showMessage />);
    expect(screen.getByText('A service this request needs is unavailable')).toBeTruthy();
    fireEvent.click(screen.getByRole('button', { name: 'Try again' }));
    expect(refetch).toHaveBeenCalledTimes(1);
    rerender(<QueryState {...props} isFetching showMessage />);
    expect((screen.getByRole('button', { name: 'Trying again…' }) as HTMLButtonElement).disabled).toBe(true);
  });

  it('without showMessage, keeps the message to itself', () => {
    render(
      <QueryState
        error={new Error('internal detail')}
        isFetching={false}
        refetch={() => {}}
        errorTitle="Could not load."
        loadingTitle=""
      />,
    );
    expect(screen.queryByText('internal detail')).toBeNull();
    expect(screen.getByRole('button', { name: 'Try again' })).toBeTruthy();
  });
});
