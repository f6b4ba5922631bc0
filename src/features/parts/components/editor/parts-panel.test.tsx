// @vitest-environment happy-dom
import { act, cleanup, fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import { DEFAULT_SYSTEMS } from '../../../../shared/schemas/builds';
import { createFakePartsServer, makePartsWrapper } from '../../testing/fake-parts-api';
import { PartsPanel } from './parts-panel';

const ctx = {
  buildId: 7,
  buildCurrency: 'EUR',
  systems: DEFAULT_SYSTEMS,
  chapters: [
    { startSeconds: 0, title: 'Up on stands' },
    { startSeconds: 90, title: 'Drums off' },
  ],
  openItems: [{ id: 3, title: 'Fit new shoes' }],
};

function setup() {
  const server = createFakePartsServer();
  const Wrapper = makePartsWrapper(server.fetch);
  render(
    <Wrapper>
      <PartsPanel episodeId={41} ctx={ctx} />
    </Wrapper>,
  );
  return server;
}

const newRow = () => within(screen.getByRole('form', { name: 'New part line' }));
const type = (label: string, value: string) => fireEvent.change(newRow().getByLabelText(label), { target: { value } });
const enterIn = (label: string) => fireEvent.keyDown(newRow().getByLabelText(label), { key: 'Enter' });
const totalCell = (label: string) => {
  const dl = screen.getByText('Spent, net').closest('dl')!;
  const dt = within(dl).getByText(label, { selector: 'dt' });
  return dt.nextElementSibling!.textContent;
};

afterEach(() => cleanup());

describe('PartsPanel', () => {
  it('adds a line with Enter, keeps the chapter and system for the next, and the totals follow while typing', async () => {
    const server = setup();
    await screen.findByText(/No part lines yet/);
    // Cells come in reading order, so Tab walks description → kind → … → price.
    const labels = Array.from(screen.getByRole('form', { name: 'New part line' }).querySelectorAll<HTMLInputElement>('input, select')).map(
      (el) => el.labels?.[0]?.textContent,
    );
    expect(labels.slice(0, 4)).toEqual(['Description', 'Kind', 'Part number', 'Supplier']);
    expect(labels.indexOf('Quantity')).toBeLessThan(labels.indexOf('Unit price'));

    type('Description', 'Brake fluid, 500 ml');
    type('System', 'brakes');
    type('Chapter', '90');
    type('Quantity', '2');
    type('Unit price', '6.90');
    type('Tax %', '20');
    // Not saved yet, already counted.
    expect(totalCell('Spent')).toBe('€13.80');
    expect(totalCell('Tax')).toBe('€2.30');
    enterIn('Unit price');

    await waitFor(() => expect(server.calls('POST')).toHaveLength(1));
    expect(server.calls('POST')[0]!.body).toMatchObject({
      description: 'Brake fluid, 500 ml',
      systemKey: 'brakes',
      atSeconds: 90,
      quantity: '2',
      unitPriceMinor: 690,
      taxRateBp: 2000,
      taxIncluded: true,
      currency: 'EUR',
    });
    await screen.findByText('Brake fluid, 500 ml');
    await waitFor(() => expect((newRow().getByLabelText('Description') as HTMLInputElement).value).toBe(''));
    expect(document.activeElement).toBe(newRow().getByLabelText('Description'));
    expect((newRow().getByLabelText('Chapter') as HTMLSelectElement).value).toBe('90');
    expect(totalCell('Spent')).toBe('€13.80');
  });

  it('shows the schema’s and the server’s messages beside the right cell', async () => {
    const server = setup();
    await screen.findByText(/No part lines yet/);
    type('Unit price', '1.234');
    enterIn('Unit price');
    expect(await screen.findByText('Needs a description')).toBeTruthy();
    expect(await screen.findByText(/A price in EUR/)).toBeTruthy();
    expect(server.calls('POST')).toHaveLength(0);

    type('Description', 'refused');
    type('Unit price', '5');
    enterIn('Description');
    const message = await screen.findByText('Too dear');
    expect(newRow().getByLabelText('Unit price').getAttribute('aria-describedby')).toBe(message.id);
  });

  it('asks for a rate only for another currency, and avoided cost only for reused or made lines', async () => {
    setup();
    await screen.findByText(/No part lines yet/);
    expect(newRow().queryByLabelText(/EUR per 1/)).toBeNull();
    type('Currency', 'GBP');
    expect(newRow().getByLabelText('EUR per 1 GBP')).toBeTruthy();
    expect(newRow().queryByLabelText('Avoided cost')).toBeNull();
    type('Source', 'reused');
    expect(newRow().getByLabelText('Avoided cost')).toBeTruthy();
    expect(newRow().queryByLabelText('Open item')).toBeNull();
    type('Status', 'on-order');
    expect(newRow().getByLabelText('Open item')).toBeTruthy();
  });

  it('edits a line in place (only what changed is sent) and undoes a delete at the same position', async () => {
    const server = setup();
    await screen.findByText(/No part lines yet/);
    for (const d of ['Seal kit', 'Brake hose', 'Bleed nipple']) {
      type('Description', d);
      type('Unit price', '10');
      enterIn('Description');
      await screen.findByText(d);
    }
    fireEvent.click(screen.getByRole('button', { name: 'Edit line 2: Brake hose' }));
    const row = within(screen.getByRole('form', { name: 'line 2' }));
    expect(document.activeElement).toBe(row.getByLabelText('Description, line 2'));
    fireEvent.change(row.getByLabelText('Quantity, line 2'), { target: { value: '3' } });
    expect(totalCell('Spent')).toBe('€50.00');
    fireEvent.keyDown(row.getByLabelText('Quantity, line 2'), { key: 'Enter' });
    await waitFor(() => expect(server.calls('PATCH')).toHaveLength(1));
    expect(server.calls('PATCH')[0]!.body).toEqual({ quantity: '3' });
    await waitFor(() => expect(screen.queryByRole('form', { name: 'line 2' })).toBeNull());

    fireEvent.click(screen.getByRole('button', { name: 'Delete line 2: Brake hose' }));
    await screen.findByText('Deleted “Brake hose”.');
    await waitFor(() => expect(screen.queryByText('Brake hose')).toBeNull());
    await act(async () => fireEvent.click(screen.getByRole('button', { name: 'Undo' })));
    await screen.findByText('Brake hose');
    const undoPost = server.calls('POST').at(-1)!;
    expect(undoPost.body).toMatchObject({ description: 'Brake hose', quantity: '3', position: 1 });
    expect(server.state.lines.map((l) => l.description)).toEqual(['Seal kit', 'Brake hose', 'Bleed nipple']);
  });

  it('picks a supplier from the list with the arrow keys and Enter, without saving the row', async () => {
    const server = setup();
    await screen.findByText(/No part lines yet/);
    const box = newRow().getByRole('combobox', { name: 'Supplier' });
    fireEvent.change(box, { target: { value: 'brack' } });
    await screen.findByRole('option', { name: /Brackenford Motor Spares/ });
    fireEvent.keyDown(box, { key: 'Enter' });
    expect((box as HTMLInputElement).value).toBe('Brackenford Motor Spares');
    expect(server.calls('POST')).toHaveLength(0);
    type('Description', 'Wheel cylinder');
    enterIn('Description');
    await waitFor(() => expect(server.calls('POST')[0]?.body).toMatchObject({ supplierId: 1 }));
  });

  it('suggests the sponsor behind a linked supplier, and credits it only when the creator accepts', async () => {
    const server = setup();
    await screen.findByText(/No part lines yet/);
    const box = newRow().getByRole('combobox', { name: 'Supplier' });
    fireEvent.change(box, { target: { value: 'quill' } });
    await screen.findByRole('option', { name: /Quillon Fasteners/ });
    fireEvent.keyDown(box, { key: 'Enter' });
    await newRow().findByText(/is backed by/);
    // Not set by itself: the sponsor cell still says None.
    expect((newRow().getByLabelText('Sponsor') as HTMLSelectElement).value).toBe('');
    fireEvent.click(newRow().getByRole('button', { name: 'Credit Quillon Works' }));
    await waitFor(() => expect((newRow().getByLabelText('Sponsor') as HTMLSelectElement).value).toBe('3'));
    expect(newRow().queryByText(/is backed by/)).toBeNull();
    type('Description', 'Caliper bolts');
    type('Support', 'discounted');
    type('Unit price', '4.00');
    type('List price (unit)', '5.50');
    enterIn('Description');
    await waitFor(() =>
      expect(server.calls('POST')[0]?.body).toMatchObject({ supplierId: 2, sponsorId: 3, supportKind: 'discounted', listPriceMinor: 550 }),
    );
  });

  it('says on the list price cell when a discounted price is not below it', async () => {
    const server = setup();
    await screen.findByText(/No part lines yet/);
    type('Description', 'Caliper bolts');
    type('Support', 'discounted');
    type('Unit price', '6.00');
    type('List price (unit)', '5.50');
    enterIn('Description');
    await newRow().findByText(/list price cannot be below the price paid/i);
    expect(server.calls('POST')).toHaveLength(0);
  });
});
