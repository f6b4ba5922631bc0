import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ApiClient } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import { build } from '../../../shared/schemas/builds';
import { editorKeys } from './keys';

/** The episode's build: its systems (with the safety-critical flags) and the video link pattern. */
export function editorBuildOptions(api: ApiClient, buildId: number) {
  return queryOptions({
    queryKey: editorKeys.build(buildId),
    queryFn: ({ signal }) => api.get(`/api/builds/${buildId}`, build, signal),
  });
}

export function useEditorBuild(buildId: number | undefined) {
  const api = useApi();
  return useQuery({ ...editorBuildOptions(api, buildId ?? 0), enabled: buildId !== undefined });
}
