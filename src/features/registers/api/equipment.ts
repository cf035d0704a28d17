import { keepPreviousData, queryOptions, useQuery, useQueryClient } from '@tanstack/react-query';
import { useMutation } from '../../../lib/single-flight-mutation';
import { api } from '../../../lib/api-client';
import type { ListResponse } from '../../../../shared/schemas/common';
import type { EquipmentCreateInput, EquipmentUpdateInput, EquipmentView } from '../../../../shared/schemas/equipment';

export const equipmentQueryKey = ['equipment'] as const;

export const getEquipmentQueryOptions = (query: Record<string, string | number>) =>
  queryOptions({
    queryKey: [...equipmentQueryKey, query],
    queryFn: () => api.get<ListResponse<EquipmentView>>('/equipment', query),
    placeholderData: keepPreviousData,
  });

export const useEquipment = (query: Record<string, string | number>) => useQuery(getEquipmentQueryOptions(query));

export function useCreateEquipment() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: EquipmentCreateInput) => api.post<EquipmentView>('/equipment', input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: equipmentQueryKey }),
  });
}

export function useUpdateEquipment() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, ...input }: EquipmentUpdateInput & { id: number }) => api.patch<EquipmentView>(`/equipment/${id}`, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: equipmentQueryKey }),
  });
}
