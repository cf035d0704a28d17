import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { DemonstrationAnalysis } from '../../../../shared/domain/pod/demonstration';
import type { PodDemonstrationData, PodDemonstrationState, PodModel, PodSizeDimension } from '../../../../shared/schemas/pod';

export interface PodDemonstrationView {
  id: number;
  techniqueRevisionId: number;
  title: string;
  model: PodModel;
  sizeDimension: PodSizeDimension;
  data: PodDemonstrationData;
  analysis: DemonstrationAnalysis | null;
  engineVersion: number | null;
  analysedAt: string | null;
  state: PodDemonstrationState;
  acceptedAt: string | null;
  signature: { printedName: string; role: string; meaning: string; signedAt: string; contentHash: string } | null;
  supersededById: number | null;
  version: number;
}

export const podDemonstrationsQueryKey = ['pod-demonstrations'] as const;

export const getPodDemonstrationsQueryOptions = (techniqueRevisionId: number) =>
  queryOptions({
    queryKey: [...podDemonstrationsQueryKey, 'revision', techniqueRevisionId],
    queryFn: () => api.get<{ items: PodDemonstrationView[] }>('/pod-demonstrations', { techniqueRevisionId }),
  });

export const usePodDemonstrations = (techniqueRevisionId: number) => useQuery(getPodDemonstrationsQueryOptions(techniqueRevisionId));
