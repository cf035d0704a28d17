import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { DashboardView } from '../../../../shared/schemas/dashboard';
import type { ListResponse } from '../../../../shared/schemas/common';
import type { AreaView } from '../../../../shared/schemas/area';

export interface DashboardFilters {
  from?: string;
  to?: string;
  areaId?: string;
}

export const getDashboardQueryOptions = (filters: DashboardFilters) =>
  queryOptions({
    queryKey: ['dashboard', filters],
    queryFn: () => api.get<DashboardView>('/dashboard', { ...filters }),
    placeholderData: keepPreviousData,
  });

export const useDashboard = (filters: DashboardFilters) => useQuery(getDashboardQueryOptions(filters));

export const useDashboardAreas = () =>
  useQuery({ queryKey: ['areas'], queryFn: () => api.get<ListResponse<AreaView>>('/areas'), staleTime: 5 * 60_000 });
