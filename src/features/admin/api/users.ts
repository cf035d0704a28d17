import { keepPreviousData, queryOptions, useQuery, useQueryClient } from '@tanstack/react-query';
import { useMutation } from '../../../lib/single-flight-mutation';
import { api } from '../../../lib/api-client';
import type { ListResponse } from '../../../../shared/schemas/common';
import type { UserCreateInput, UserUpdateInput, UserView } from '../../../../shared/schemas/user';
import type { AreaView } from '../../../../shared/schemas/area';

export const usersQueryKey = ['users'] as const;

export const getUsersQueryOptions = (query: Record<string, string | number>) =>
  queryOptions({
    queryKey: [...usersQueryKey, query],
    queryFn: () => api.get<ListResponse<UserView>>('/users', query),
    placeholderData: keepPreviousData,
  });

export const useUsers = (query: Record<string, string | number>) => useQuery(getUsersQueryOptions(query));

export const getAreasQueryOptions = () =>
  queryOptions({ queryKey: ['areas'], queryFn: () => api.get<ListResponse<AreaView>>('/areas'), staleTime: 5 * 60_000 });

export const useAreas = () => useQuery(getAreasQueryOptions());

export function useCreateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: UserCreateInput) => api.post<UserView>('/users', input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: usersQueryKey }),
  });
}

export function useUpdateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, ...input }: UserUpdateInput & { id: number }) => api.patch<UserView>(`/users/${id}`, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: usersQueryKey }),
  });
}

export function useUnlockUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => api.post<UserView>(`/users/${id}/unlock`),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: usersQueryKey }),
  });
}
