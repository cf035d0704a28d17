import { keepPreviousData, queryOptions, useQuery, useQueryClient } from '@tanstack/react-query';
import { useMutation } from '../../../lib/single-flight-mutation';
import { api } from '../../../lib/api-client';
import type { ListResponse } from '../../../../shared/schemas/common';
import type { TechniqueInput } from '../../../../shared/schemas/technique';
import type {
  MaterialView,
  PolicyView,
  TechniqueChecklistView,
  TechniqueListItem,
  TechniqueView,
} from '../../../../shared/schemas/technique-register';
import type { AreaView } from '../../../../shared/schemas/area';
import type { TrailEntryView } from '../../../../shared/schemas/trail';

export const techniquesQueryKey = ['techniques'] as const;

export const getTechniquesQueryOptions = (query: Record<string, string | number>) =>
  queryOptions({
    queryKey: [...techniquesQueryKey, 'list', query],
    queryFn: () => api.get<ListResponse<TechniqueListItem>>('/techniques', query),
    placeholderData: keepPreviousData,
  });
export const useTechniques = (query: Record<string, string | number>) => useQuery(getTechniquesQueryOptions(query));

export const getTechniqueQueryOptions = (id: number) =>
  queryOptions({ queryKey: [...techniquesQueryKey, 'one', id], queryFn: () => api.get<TechniqueView>(`/techniques/${id}`) });
export const useTechnique = (id: number) => useQuery(getTechniqueQueryOptions(id));

export const getTechniqueChecklistQueryOptions = (id: number, revision?: string) =>
  queryOptions({
    queryKey: [...techniquesQueryKey, 'checklist', id, revision ?? 'current'],
    queryFn: () => api.get<TechniqueChecklistView>(`/techniques/${id}/checklist`, { revision }),
  });
export const useTechniqueChecklist = (id: number, revision?: string) => useQuery(getTechniqueChecklistQueryOptions(id, revision));

export const getMaterialsQueryOptions = () =>
  queryOptions({ queryKey: ['materials'], queryFn: () => api.get<ListResponse<MaterialView>>('/materials'), staleTime: 5 * 60_000 });
export const useMaterials = () => useQuery(getMaterialsQueryOptions());

/** The organisation's policy: the live checklist evaluates with it, as the server does. */
export const getPolicyQueryOptions = () => queryOptions({ queryKey: ['policy'], queryFn: () => api.get<PolicyView>('/policy') });
export const useOrganisationPolicy = () => useQuery(getPolicyQueryOptions());

export const useAreas = () =>
  useQuery(queryOptions({ queryKey: ['areas'], queryFn: () => api.get<ListResponse<AreaView>>('/areas'), staleTime: 5 * 60_000 }));

function useInvalidateTechniques() {
  const queryClient = useQueryClient();
  return (view: TechniqueView) => {
    queryClient.setQueryData(getTechniqueQueryOptions(view.id).queryKey, view);
    return queryClient.invalidateQueries({ queryKey: techniquesQueryKey });
  };
}

export function useCreateTechnique() {
  const done = useInvalidateTechniques();
  return useMutation({
    mutationFn: (input: { technique: TechniqueInput; areaId: number | null }) => api.post<TechniqueView>('/techniques', input),
    onSuccess: done,
  });
}

export function useUpdateRevision(id: number) {
  const done = useInvalidateTechniques();
  return useMutation({
    mutationFn: ({ revision, ...body }: { revision: string; version: number; technique: TechniqueInput; areaId: number | null }) =>
      api.patch<TechniqueView>(`/techniques/${id}/revisions/${encodeURIComponent(revision)}`, body),
    onSuccess: done,
  });
}

export function useApproveRevision(id: number) {
  const done = useInvalidateTechniques();
  return useMutation({
    mutationFn: ({ revision, version }: { revision: string; version: number }) =>
      api.post<TechniqueView>(`/techniques/${id}/revisions/${encodeURIComponent(revision)}/approve`, { version }),
    onSuccess: done,
  });
}

export function useStartNewRevision(id: number) {
  const done = useInvalidateTechniques();
  return useMutation({ mutationFn: () => api.post<TechniqueView>(`/techniques/${id}/revisions`, {}), onSuccess: done });
}

/** The technique's timeline: its trail entries (creation, edits, approvals), oldest first. */
export const getTechniqueTrailQueryOptions = (id: number) =>
  queryOptions({
    queryKey: [...techniquesQueryKey, 'trail', id],
    queryFn: () => api.get<ListResponse<TrailEntryView>>('/trail', { record: `technique:${id}` }),
  });
export const useTechniqueTrail = (id: number) => useQuery(getTechniqueTrailQueryOptions(id));

export function useSaveMaterial() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, ...body }: { id?: number; version?: number; name: string; conductivityIacs: number; relativePermeability: number; source: string }) =>
      id ? api.patch<MaterialView>(`/materials/${id}`, body) : api.post<MaterialView>('/materials', body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['materials'] }),
  });
}
