import { queryOptions, useQuery, useQueryClient } from '@tanstack/react-query';
import { useMutation } from '../../../lib/single-flight-mutation';
import { api, ApiError, getCsrfToken } from '../../../lib/api-client';
import type { ListResponse } from '../../../../shared/schemas/common';
import type { EvidenceRecordType, EvidenceView } from '../../../../shared/schemas/evidence';

export const evidenceQueryKey = (recordType: EvidenceRecordType, recordId: number) => ['evidence', recordType, recordId] as const;

export const getEvidenceQueryOptions = (recordType: EvidenceRecordType, recordId: number) =>
  queryOptions({
    queryKey: evidenceQueryKey(recordType, recordId),
    queryFn: () => api.get<ListResponse<EvidenceView>>('/evidence', { recordType, recordId }),
  });

export const useEvidence = (recordType: EvidenceRecordType, recordId: number, { enabled = true }: { enabled?: boolean } = {}) =>
  useQuery({ ...getEvidenceQueryOptions(recordType, recordId), enabled });

export const evidenceDownloadUrl = (id: number) => `/api/evidence/${id}/download`;
export const evidencePreviewUrl = (id: number) => `/api/evidence/${id}/preview`;

/**
 * One file per request through XMLHttpRequest, for its upload progress
 * (fetch has none). Same headers as the api client: the CSRF token and JSON accept.
 */
export function uploadEvidenceFile({
  recordType,
  recordId,
  file,
  onProgress,
  signal,
}: {
  recordType: EvidenceRecordType;
  recordId: number;
  file: File;
  onProgress(fraction: number): void;
  signal?: AbortSignal;
}): Promise<EvidenceView[]> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', '/api/evidence');
    xhr.setRequestHeader('Accept', 'application/json');
    const token = getCsrfToken();
    if (token) xhr.setRequestHeader('X-CSRF-Token', token);
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable) onProgress(event.loaded / event.total);
    };
    xhr.onload = () => {
      let body: unknown;
      try {
        body = xhr.responseText ? JSON.parse(xhr.responseText) : undefined;
      } catch {
        body = undefined;
      }
      if (xhr.status >= 200 && xhr.status < 300) {
        onProgress(1);
        resolve((body as ListResponse<EvidenceView>).items);
        return;
      }
      const error = (body as { error?: { code?: string; message?: string; details?: unknown } } | undefined)?.error;
      reject(new ApiError(xhr.status, error?.code ?? 'http_error', error?.message ?? `Upload failed (${xhr.status})`, error?.details));
    };
    xhr.onerror = () => reject(new ApiError(0, 'network', 'The upload did not reach the server; check your connection and try again'));
    xhr.onabort = () => reject(new ApiError(0, 'aborted', 'Upload cancelled'));
    signal?.addEventListener('abort', () => xhr.abort(), { once: true });
    // The record fields go first so the server knows them when the file arrives.
    const form = new FormData();
    form.append('recordType', recordType);
    form.append('recordId', String(recordId));
    form.append('file', file, file.name);
    xhr.send(form);
  });
}

export function useSupersedeEvidence(recordType: EvidenceRecordType, recordId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, reason, version }: { id: number; reason: string; version: number }) =>
      api.post<EvidenceView>(`/evidence/${id}/supersede`, { reason, version }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: evidenceQueryKey(recordType, recordId) }),
  });
}
