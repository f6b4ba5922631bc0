import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { ApiClient } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import {
  buildCover,
  buildPhotosResponse,
  episodePictures,
  mediaItem,
  type EpisodePictures,
  type EpisodePicturesUpdate,
} from '../../../shared/schemas/media';

/** Query keys of the media feature; every variable a fetcher uses is in its key. */
export const mediaKeys = {
  all: ['media'] as const,
  photos: (buildId: number, page: number) => [...mediaKeys.all, 'photos', buildId, page] as const,
  episodePictures: (episodeId: number) => [...mediaKeys.all, 'episode-pictures', episodeId] as const,
  buildCover: (buildId: number) => [...mediaKeys.all, 'build-cover', buildId] as const,
};

export const PHOTOS_PER_PAGE = 24;

export const buildPhotosOptions = (api: ApiClient, buildId: number, page: number) =>
  queryOptions({
    queryKey: mediaKeys.photos(buildId, page),
    queryFn: ({ signal }) => api.get(`/api/builds/${buildId}/photos?page=${page}&perPage=${PHOTOS_PER_PAGE}`, buildPhotosResponse, signal),
  });

export const episodePicturesOptions = (api: ApiClient, episodeId: number) =>
  queryOptions({
    queryKey: mediaKeys.episodePictures(episodeId),
    queryFn: ({ signal }) => api.get(`/api/episodes/${episodeId}/pictures`, episodePictures, signal),
    refetchInterval: (q) => whileProcessing(q.state.data),
  });

/** While a photo's sizes are being made, look again shortly so "processing" turns into the picture. */
const whileProcessing = (data: EpisodePictures | undefined) =>
  [data?.cover, ...(data?.gallery ?? [])].some((m) => m?.status === 'processing') ? 2_000 : false;

export const buildCoverOptions = (api: ApiClient, buildId: number) =>
  queryOptions({
    queryKey: mediaKeys.buildCover(buildId),
    queryFn: ({ signal }) => api.get(`/api/builds/${buildId}/cover`, buildCover, signal),
  });

export function useBuildPhotos(buildId: number, page: number, enabled = true) {
  return useQuery({ ...buildPhotosOptions(useApi(), buildId, page), enabled });
}

export function useEpisodePictures(episodeId: number) {
  const queryClient = useQueryClient();
  const options = episodePicturesOptions(useApi(), episodeId);
  return useQuery({
    ...options,
    // No polling while a change is being saved: an answer read before the save landed would put
    // the older list back, and the next change would be built on it.
    refetchInterval: (q) =>
      queryClient.isMutating({ mutationKey: mediaKeys.episodePictures(episodeId) }) ? false : whileProcessing(q.state.data),
  });
}

export function useBuildCover(buildId: number) {
  return useQuery(buildCoverOptions(useApi(), buildId));
}

export function useSetEpisodePictures(episodeId: number) {
  const api = useApi();
  const queryClient = useQueryClient();
  return useMutation({
    // One save at a time, in order: each body builds on the one before (several uploads finishing
    // together), and two PUTs racing could let the older list arrive last and drop a picture.
    scope: { id: `episode-pictures-${episodeId}` },
    mutationKey: mediaKeys.episodePictures(episodeId),
    // A read already on its way may have been answered before this save: drop it.
    onMutate: () => queryClient.cancelQueries({ queryKey: mediaKeys.episodePictures(episodeId) }),
    mutationFn: (body: EpisodePicturesUpdate) => api.put(`/api/episodes/${episodeId}/pictures`, body, episodePictures),
    onSuccess: (data) => queryClient.setQueryData(mediaKeys.episodePictures(episodeId), data),
  });
}

export function useSetBuildCover(buildId: number) {
  const api = useApi();
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (coverMediaId: number | null) => api.put(`/api/builds/${buildId}/cover`, { coverMediaId }, buildCover),
    onSuccess: (data) => queryClient.setQueryData(mediaKeys.buildCover(buildId), data),
  });
}

/** Saves a photo's description; every list showing the photo reads it again. */
export function useDescribePhoto() {
  const api = useApi();
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, altText }: { id: number; altText: string }) => api.patch(`/api/media/${id}`, { altText }, mediaItem),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: mediaKeys.all }),
  });
}
