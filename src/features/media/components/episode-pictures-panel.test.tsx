// @vitest-environment happy-dom
// Two gallery uploads that finish one after the other: the second upload's callback was made in an
// earlier render, before the first save settled. It must build on what was saved, not on the list
// that render saw (it used to save [second] over [first] and drop the first picture).
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, fireEvent, render, screen, waitFor } from '@testing-library/react';
import type { ComponentProps } from 'react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { createApiClient } from '../../../lib/api-client';
import { ApiProvider } from '../../../lib/api-context';
import type { MediaItem } from '../../../shared/schemas/media';
import { EpisodePicturesPanel } from './episode-pictures-panel';
import type { PhotoPicker } from './photo-picker';

type PickerProps = ComponentProps<typeof PhotoPicker>;
const pickers: PickerProps[] = [];
vi.mock('./photo-picker', () => ({
  PhotoPicker: (props: PickerProps) => {
    pickers.push(props);
    return null;
  },
}));

afterEach(cleanup);

const photo = (id: number): MediaItem => ({
  id,
  kind: 'photo',
  contentType: 'image/jpeg',
  sizeBytes: 1000,
  width: 1000,
  height: 750,
  altText: null,
  status: 'processing',
  src: `/media/${id}`,
  srcset: '',
  placeholder: null,
  createdAt: '2026-12-03T10:00:00.000Z',
});

describe('the episode pictures panel', () => {
  it('keeps both pictures when two uploads finish one after the other', async () => {
    const saved: number[][] = [];
    let gallery: number[] = [];
    const json = (body: unknown) => new Response(JSON.stringify(body), { status: 200, headers: { 'content-type': 'application/json' } });
    const fetch = vi.fn(async (url: string | URL | Request, init?: RequestInit) => {
      const path = String(url);
      if (path.endsWith('/api/csrf-token')) return json({ token: 't' });
      if (init?.method === 'PUT') {
        gallery = (JSON.parse(String(init.body)) as { gallery: number[] }).gallery;
        saved.push(gallery);
      }
      return json({ cover: null, gallery: gallery.map(photo) });
    }) as unknown as typeof globalThis.fetch;
    const queryClient = new QueryClient({ defaultOptions: { queries: { retry: false } } });
    render(
      <QueryClientProvider client={queryClient}>
        <ApiProvider client={createApiClient({ fetch })}>
          <EpisodePicturesPanel episodeId={41} buildId={7} />
        </ApiProvider>
      </QueryClientProvider>,
    );
    fireEvent.click(await screen.findByRole('button', { name: 'Add pictures to the gallery' }));
    await waitFor(() => expect(pickers.length).toBeGreaterThan(0));
    // Both uploads started from this render of the picker.
    const { onPick } = pickers.at(-1)!;

    onPick(photo(5));
    await waitFor(() => expect(saved).toEqual([[5]]));
    await waitFor(() => expect(screen.getByLabelText('Describe gallery picture 1')).toBeTruthy());

    onPick(photo(4));
    await waitFor(() => expect(saved).toEqual([[5], [5, 4]]));
    expect(await screen.findByLabelText('Describe gallery picture 2')).toBeTruthy();
  });
});
