// @vitest-environment happy-dom
import { cleanup, fireEvent, render, screen, waitFor } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import { makePartsWrapper } from '../../testing/fake-parts-api';
import { LedgerImport } from './ledger-import';

type Answer = { status: number; body: unknown };

function setup(answer: (body: { csv: string; dryRun: boolean }) => Answer) {
  const posts: Array<{ csv: string; dryRun: boolean }> = [];
  const fetch: typeof globalThis.fetch = async (input, init) => {
    if (String(input) === '/api/csrf-token') return Response.json({ token: 'csrf' });
    const body = JSON.parse(String(init?.body)) as { csv: string; dryRun: boolean };
    posts.push(body);
    const a = answer(body);
    return Response.json(a.body, { status: a.status });
  };
  const Wrapper = makePartsWrapper(fetch);
  render(
    <Wrapper>
      <LedgerImport buildId={7} />
    </Wrapper>,
  );
  return posts;
}

function choose(text: string) {
  const file = new File([text], 'ledger.csv', { type: 'text/csv' });
  fireEvent.change(screen.getByLabelText('CSV file to import'), { target: { files: [file] } });
}

const okRows = [
  { row: 1, errors: {}, description: 'Seal kit', episode: 4 },
  { row: 2, errors: {}, description: 'Brake hose', episode: 4 },
];

afterEach(() => cleanup());

describe('LedgerImport', () => {
  it('previews every row before saving, then imports them all', async () => {
    const posts = setup((b) =>
      b.dryRun ? { status: 200, body: { saved: false, imported: 0, rows: okRows } } : { status: 201, body: { saved: true, imported: 2 } },
    );
    choose('episode,kind\n4,part');
    await screen.findByText('Check of ledger.csv');
    expect(posts).toEqual([{ csv: 'episode,kind\n4,part', dryRun: true }]);
    expect(screen.getByText('Brake hose')).toBeTruthy();
    fireEvent.click(screen.getByRole('button', { name: 'Import 2 lines' }));
    await screen.findByText('Imported 2 lines.');
    expect(posts.at(-1)).toEqual({ csv: 'episode,kind\n4,part', dryRun: false });
  });

  it('lists the problems by column, offers no import, and Cancel saves nothing', async () => {
    const posts = setup(() => ({
      status: 200,
      body: {
        saved: false,
        imported: 0,
        rows: [okRows[0], { row: 2, errors: { unit_price: 'needs an amount' }, description: 'Hose', episode: 9 }],
      },
    }));
    choose('x');
    await screen.findByText('unit_price');
    expect(screen.getByText(/needs an amount/)).toBeTruthy();
    expect(screen.queryByRole('button', { name: /^Import/ })).toBeNull();
    fireEvent.click(screen.getByRole('button', { name: 'Cancel' }));
    await waitFor(() => expect(screen.getByLabelText('CSV file to import')).toBeTruthy());
    expect(posts.every((p) => p.dryRun)).toBe(true);
  });

  it('shows the rows of a refused import (422): nothing was saved', async () => {
    let dry = 0;
    setup((b) => {
      if (b.dryRun) {
        dry += 1;
        const rows =
          dry === 1
            ? okRows
            : [okRows[0], { row: 2, errors: { episode: 'not an episode number of this build' }, description: 'Brake hose', episode: 9 }];
        return { status: 200, body: { saved: false, imported: 0, rows } };
      }
      return {
        status: 422,
        body: { error: { code: 'csv_rows_invalid', message: 'Some rows have problems; nothing was saved' }, saved: false, rows: [] },
      };
    });
    choose('x');
    fireEvent.click(await screen.findByRole('button', { name: 'Import 2 lines' }));
    await screen.findByText(/Nothing was saved: some rows have problems/);
    expect(screen.getByText(/not an episode number of this build/)).toBeTruthy();
  });
});
