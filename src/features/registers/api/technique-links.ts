import { queryOptions, useQuery, useQueryClient } from '@tanstack/react-query';
import { useMutation } from '../../../lib/single-flight-mutation';
import { api, apiRequest } from '../../../lib/api-client';
import type { ListResponse } from '../../../../shared/schemas/common';
import type { TechniqueLinksInput, TechniqueLinksView } from '../../../../shared/schemas/equipment';
import type { TechniqueListItem } from '../../../../shared/schemas/technique-register';

export const getTechniqueListQueryOptions = () =>
  queryOptions({
    queryKey: ['techniques', { pageSize: 200, sort: 'code' }],
    queryFn: () => api.get<ListResponse<TechniqueListItem>>('/techniques', { pageSize: 200, sort: 'code' }),
    staleTime: 60_000,
  });

export const useTechniqueList = () => useQuery(getTechniqueListQueryOptions());

export const techniqueLinksQueryKey = (techniqueId: number) => ['technique-register-links', techniqueId] as const;

export const useTechniqueLinks = (techniqueId: number | null) =>
  useQuery({
    queryKey: techniqueLinksQueryKey(techniqueId ?? 0),
    queryFn: () => api.get<TechniqueLinksView>(`/techniques/${techniqueId}/register-links`),
    enabled: techniqueId !== null,
  });

export function useSetTechniqueLinks(techniqueId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: TechniqueLinksInput) => apiRequest<TechniqueLinksView>('PUT', `/techniques/${techniqueId}/register-links`, input),
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: techniqueLinksQueryKey(techniqueId) });
      // The technique's checklist reads these links.
      void queryClient.invalidateQueries({ queryKey: ['techniques'] });
    },
  });
}
