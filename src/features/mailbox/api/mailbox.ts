import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { ListResponse } from '../../../../shared/schemas/common';
import type { CaughtMailSummary, CaughtMailView } from '../../../../shared/schemas/mailbox';

export type MailboxList = ListResponse<CaughtMailSummary> & {
  catching: boolean;
  outbox: { pending: number; retrying: number; lastError: string | null };
};

export const getMailboxQueryOptions = (query: Record<string, string | number>) =>
  queryOptions({
    queryKey: ['mailbox', query],
    queryFn: () => api.get<MailboxList>('/mailbox', query),
    placeholderData: keepPreviousData,
    // New reminders arrive on their own; look again now and then.
    refetchInterval: 15_000,
  });

export const useMailbox = (query: Record<string, string | number>) => useQuery(getMailboxQueryOptions(query));

export const getCaughtMailQueryOptions = (id: number) =>
  queryOptions({ queryKey: ['mailbox', 'message', id], queryFn: () => api.get<CaughtMailView>(`/mailbox/${id}`) });

export const useCaughtMail = (id: number | null) => useQuery({ ...getCaughtMailQueryOptions(id ?? 0), enabled: id !== null });
