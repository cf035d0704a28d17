import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { RecordTrailView, TrailVerificationView } from '../../../../shared/schemas/trail';

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
    queryFn: () => api.get<RecordTrailView>('/trail', { record }),
    // A record number (F-2026-0015), a technique code or type:id (finding:12).
    enabled: record.trim().length > 0,
  });

export const useRecordTrail = (record: string) => useQuery(getRecordTrailQueryOptions(record));
