import { queryOptions, useQuery, useQueryClient } from '@tanstack/react-query';
import { useMutation } from '../../../lib/single-flight-mutation';
import { api } from '../../../lib/api-client';
import type { PolicyUpdateInput, PolicyView } from '../../../../shared/schemas/technique-register';

export const policyQueryKey = ['policy'] as const;

export const getPolicyQueryOptions = () => queryOptions({ queryKey: policyQueryKey, queryFn: () => api.get<PolicyView>('/policy') });
export const usePolicy = () => useQuery(getPolicyQueryOptions());

export function useUpdatePolicy() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: PolicyUpdateInput) => api.patch<PolicyView>('/policy', input),
    onSuccess: (view) => {
      queryClient.setQueryData(policyQueryKey, view);
      // Stored verdicts follow the policy: the register's lists and checklists change with it.
      return queryClient.invalidateQueries({ queryKey: ['techniques'] });
    },
  });
}
