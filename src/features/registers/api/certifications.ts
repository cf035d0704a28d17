import { keepPreviousData, queryOptions, useQuery, useQueryClient } from '@tanstack/react-query';
import { useMutation } from '../../../lib/single-flight-mutation';
import { api } from '../../../lib/api-client';
import type { ListResponse } from '../../../../shared/schemas/common';
import type { CertificationCreateInput, CertificationUpdateInput, CertificationView } from '../../../../shared/schemas/certification';
import type { UserView } from '../../../../shared/schemas/user';

export const certificationsQueryKey = ['certifications'] as const;

export const getCertificationsQueryOptions = (query: Record<string, string | number>) =>
  queryOptions({
    queryKey: [...certificationsQueryKey, query],
    queryFn: () => api.get<ListResponse<CertificationView>>('/certifications', query),
    placeholderData: keepPreviousData,
  });

export const useCertifications = (query: Record<string, string | number>) => useQuery(getCertificationsQueryOptions(query));

export const getPeopleQueryOptions = () =>
  queryOptions({
    queryKey: ['users', { active: 'true', pageSize: 200 }],
    queryFn: () => api.get<ListResponse<UserView>>('/users', { active: 'true', pageSize: 200, sort: 'displayName' }),
    staleTime: 60_000,
  });

export const usePeople = () => useQuery(getPeopleQueryOptions());

export function useCreateCertification() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CertificationCreateInput) => api.post<CertificationView>('/certifications', input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: certificationsQueryKey }),
  });
}

export function useUpdateCertification() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, ...input }: CertificationUpdateInput & { id: number }) => api.patch<CertificationView>(`/certifications/${id}`, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: certificationsQueryKey }),
  });
}
