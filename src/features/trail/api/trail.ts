import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { TrailEntryView, TrailVerificationView } from '../../../../shared/schemas/trail';
import type { ListResponse } from '../../../../shared/schemas/common';

export const getTrailVerificationQueryOptions = () =>
  queryOptions({
    queryKey: ['trail', 'verify'],
    queryFn: () => api.get<TrailVerificationView>('/trail/verify'),
    // Recomputing the chain is deliberate work: only when asked.
    enabled: false,
    staleTime: Infinity,
  });

export const useTrailVerification = () => useQuery(getTrailVerificationQueryOptions());

export const getRecordTrailQueryOptions = (record: string) =>
  queryOptions({
    queryKey: ['trail', 'record', record],
    queryFn: () => api.get<ListResponse<TrailEntryView>>('/trail', { record }),
    enabled: /^[a-z_-]+:[A-Za-z0-9_-]+$/.test(record),
  });

export const useRecordTrail = (record: string) => useQuery(getRecordTrailQueryOptions(record));
