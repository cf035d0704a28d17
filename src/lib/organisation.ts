// The organisation's name and time zone, read once per session, and the one
// date format of every screen (shared/format/dates), in that zone.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from './api-client';
import { DEFAULT_TIME_ZONE, formatDate, formatDateTime, formatSignatureTime } from '../../shared/format/dates';

export interface OrganisationView {
  name: string;
  timeZone: string;
}

export const getOrganisationQueryOptions = () =>
  queryOptions({
    queryKey: ['organisation'],
    queryFn: () => api.get<OrganisationView>('/organisation'),
    staleTime: Infinity,
  });

export const useOrganisation = () => useQuery(getOrganisationQueryOptions());

/** Date formatters in the organisation's zone (UTC until it has loaded). */
export function useFormatDates() {
  const timeZone = useOrganisation().data?.timeZone ?? DEFAULT_TIME_ZONE;
  return {
    timeZone,
    date: (value: Date | string | null | undefined) => formatDate(value, timeZone),
    dateTime: (value: Date | string | null | undefined) => formatDateTime(value, timeZone),
    signature: (value: Date | string | null | undefined) => formatSignatureTime(value, timeZone),
  };
}
