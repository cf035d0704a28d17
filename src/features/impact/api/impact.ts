// Extent of condition and impact worksheets: queries and mutations. Every
// mutation refreshes the impact views and calls `onChange` so the page can
// refresh the finding itself (its allowed events depend on the decisions).
import { queryOptions, useQuery, useQueryClient } from '@tanstack/react-query';
import { useMutation } from '../../../lib/single-flight-mutation';
import { api } from '../../../lib/api-client';
import type { ExtentRunView, FindingFamilyView } from '../../../../shared/schemas/extent';
import type { ContainmentDecisionKind, EquipmentImpactView, FindingImpactView } from '../../../../shared/schemas/impact';
import type { FindingClass } from '../../../../machines/finding.machine';

export const impactKeys = {
  all: ['impact'] as const,
  family: (findingId: number) => ['impact', 'family', findingId] as const,
  finding: (findingId: number) => ['impact', 'finding', findingId] as const,
  equipment: (equipmentId: number, since: string | null) => ['impact', 'equipment', equipmentId, since] as const,
};

export const getFindingFamilyQueryOptions = (findingId: number) =>
  queryOptions({ queryKey: impactKeys.family(findingId), queryFn: () => api.get<FindingFamilyView>(`/findings/${findingId}/extent`) });
export const useFindingFamily = (findingId: number) => useQuery(getFindingFamilyQueryOptions(findingId));

export const getFindingImpactQueryOptions = (findingId: number) =>
  queryOptions({ queryKey: impactKeys.finding(findingId), queryFn: () => api.get<FindingImpactView>(`/findings/${findingId}/impact`) });
export const useFindingImpact = (findingId: number) => useQuery(getFindingImpactQueryOptions(findingId));

export const getEquipmentImpactQueryOptions = (equipmentId: number, since: string | null) =>
  queryOptions({
    queryKey: impactKeys.equipment(equipmentId, since),
    queryFn: () => api.get<EquipmentImpactView>(`/equipment/${equipmentId}/impact`, since ? { since } : undefined),
  });
export const useEquipmentImpact = (equipmentId: number, since: string | null) => useQuery(getEquipmentImpactQueryOptions(equipmentId, since));

function useRefresh(onChange?: () => void) {
  const queryClient = useQueryClient();
  return async () => {
    await queryClient.invalidateQueries({ queryKey: impactKeys.all });
    onChange?.();
  };
}

export function useRunExtent(findingId: number, onChange?: () => void) {
  const refresh = useRefresh(onChange);
  return useMutation({ mutationFn: () => api.post<ExtentRunView>(`/findings/${findingId}/extent-runs`), onSuccess: refresh });
}

export function useRaiseExtentFindings(findingId: number, onChange?: () => void) {
  const refresh = useRefresh(onChange);
  return useMutation({
    mutationFn: (input: { runId: number; revisionIds: number[]; proposedClass: FindingClass | null }) =>
      api.post<{ created: Array<{ id: number; number: string }> }>(`/findings/${findingId}/extent-findings`, input),
    onSuccess: refresh,
  });
}

export function useSetImpactScope(findingId: number, onChange?: () => void) {
  const refresh = useRefresh(onChange);
  return useMutation({
    mutationFn: (input: { since: string | null; version: number }) => api.patch<FindingImpactView>(`/findings/${findingId}/impact-scope`, input),
    onSuccess: refresh,
  });
}

export function useDecideContainment(findingId: number, onChange?: () => void) {
  const refresh = useRefresh(onChange);
  return useMutation({
    mutationFn: (input: { inspectionIds: number[]; decision: ContainmentDecisionKind; reason: string }) =>
      api.post<FindingImpactView>(`/findings/${findingId}/containment-decisions`, input),
    onSuccess: refresh,
  });
}
