import { keepPreviousData, queryOptions, useQuery, useQueryClient } from '@tanstack/react-query';
import { useMutation } from '../../../lib/single-flight-mutation';
import { api, ApiError, getCsrfToken } from '../../../lib/api-client';
import type { ListResponse } from '../../../../shared/schemas/common';
import type {
  InspectionImportPreview,
  InspectionImportResult,
  InspectionInput,
  InspectionOptionsView,
  InspectionUpdateInput,
  InspectionView,
} from '../../../../shared/schemas/inspection';

export const inspectionsQueryKey = ['inspections'] as const;

export const getInspectionsQueryOptions = (query: Record<string, string | number>) =>
  queryOptions({
    queryKey: [...inspectionsQueryKey, 'list', query],
    queryFn: () => api.get<ListResponse<InspectionView>>('/inspections', query),
    placeholderData: keepPreviousData,
  });

export const useInspections = (query: Record<string, string | number>) => useQuery(getInspectionsQueryOptions(query));

export const getInspectionOptionsQueryOptions = () =>
  queryOptions({
    queryKey: [...inspectionsQueryKey, 'options'],
    queryFn: () => api.get<InspectionOptionsView>('/inspections/options'),
    staleTime: 60_000,
  });

export const useInspectionOptions = () => useQuery(getInspectionOptionsQueryOptions());

export function useCreateInspection() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: InspectionInput) => api.post<InspectionView>('/inspections', input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: inspectionsQueryKey }),
  });
}

export function useUpdateInspection() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, ...input }: InspectionUpdateInput & { id: number }) => api.patch<InspectionView>(`/inspections/${id}`, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: inspectionsQueryKey }),
  });
}

/** Multipart upload of the CSV file (the JSON client cannot send files); the CSRF header as on every change. */
async function uploadCsv<T>(path: string, file: File): Promise<T> {
  const form = new FormData();
  form.append('file', file, file.name);
  const headers: Record<string, string> = { Accept: 'application/json' };
  const token = getCsrfToken();
  if (token) headers['X-CSRF-Token'] = token;
  let response: Response;
  try {
    response = await fetch(`/api${path}`, { method: 'POST', headers, body: form, credentials: 'same-origin' });
  } catch {
    throw new ApiError(0, 'network', 'The file did not reach the server; check your connection and try again');
  }
  const text = await response.text();
  let body: unknown;
  try {
    body = text ? JSON.parse(text) : undefined;
  } catch {
    body = undefined;
  }
  if (!response.ok) {
    const error = (body as { error?: { code?: string; message?: string; details?: unknown } } | undefined)?.error;
    throw new ApiError(response.status, error?.code ?? 'http_error', error?.message ?? `Upload failed (${response.status})`, error?.details);
  }
  return body as T;
}

export const usePreviewInspectionImport = () =>
  useMutation({ mutationFn: (file: File) => uploadCsv<InspectionImportPreview>('/inspections/import/preview', file) });

export function useImportInspections() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (file: File) => uploadCsv<InspectionImportResult>('/inspections/import', file),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: inspectionsQueryKey }),
  });
}
