import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { ListResponse } from '../../../../shared/schemas/common';
import type { UserView } from '../../../../shared/schemas/user';
import type { DeliveryPreferenceInput, DeliveryView, NotificationView } from '../../../../shared/schemas/notifications';

export const getNotificationsQueryOptions = (query: Record<string, string | number>) =>
  queryOptions({
    queryKey: ['notifications', query],
    queryFn: () => api.get<ListResponse<NotificationView>>('/notifications', query),
    placeholderData: keepPreviousData,
    // Reminders arrive on their own and a message's delivery moves on: look again now and then.
    refetchInterval: 15_000,
  });

export const useNotifications = (query: Record<string, string | number>) => useQuery(getNotificationsQueryOptions(query));

export const getDeliveryQueryOptions = () => queryOptions({ queryKey: ['me', 'delivery'], queryFn: () => api.get<DeliveryView>('/me/delivery') });

export const useDelivery = () => useQuery(getDeliveryQueryOptions());

export function useSetDelivery() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: DeliveryPreferenceInput) => api.patch<DeliveryView>('/me/delivery', input),
    onSuccess: (delivery) => client.setQueryData(getDeliveryQueryOptions().queryKey, delivery),
  });
}

/** Outbox health for administrators: messages waiting, and the mail server's last refusal. */
export interface DeliveryHealth {
  catching: boolean;
  outbox: { pending: number; retrying: number; lastError: string | null };
}

export const getDeliveryHealthQueryOptions = () =>
  queryOptions({
    queryKey: ['mailbox', 'health'],
    queryFn: () => api.get<DeliveryHealth>('/mailbox', { pageSize: 1 }),
    refetchInterval: 15_000,
  });

export const useDeliveryHealth = (enabled: boolean) => useQuery({ ...getDeliveryHealthQueryOptions(), enabled });

/** Everyone an administrator may look up, by name. */
export const usePeople = (enabled: boolean) =>
  useQuery({
    queryKey: ['users', 'people-for-messages'],
    queryFn: () => api.get<ListResponse<UserView>>('/users', { pageSize: 200, sort: 'displayName' }),
    enabled,
  });
