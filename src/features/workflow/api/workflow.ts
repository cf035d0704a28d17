// Queries and mutations of the workflow records. Every mutation returns the
// record as the server now sees it and invalidates the lists it may change.
import { keepPreviousData, queryOptions, useQuery, useQueryClient } from '@tanstack/react-query';
import { useMutation } from '../../../lib/single-flight-mutation';
import { api } from '../../../lib/api-client';
import type { ListResponse } from '../../../../shared/schemas/common';
import type {
  ActionDetailView,
  ActionView,
  AuditCreateInput,
  AuditDetailView,
  AuditView,
  ChecklistRunView,
  FindingDetailView,
  FindingView,
  HomeView,
} from '../../../../shared/schemas/workflow';
import type { RecordTrailView } from '../../../../shared/schemas/trail';
import type { AreaView } from '../../../../shared/schemas/area';
import type { UserView } from '../../../../shared/schemas/user';

export type RecordPath = 'audits' | 'findings' | 'actions';
type Query = Record<string, string | number>;

export const workflowKeys = {
  all: ['workflow'] as const,
  list: (path: RecordPath, query: Query) => ['workflow', path, 'list', query] as const,
  record: (path: RecordPath, id: number) => ['workflow', path, id] as const,
  trail: (type: string, id: number) => ['workflow', 'trail', type, id] as const,
  home: ['workflow', 'home'] as const,
};

const listOptions = <T,>(path: RecordPath, query: Query) =>
  queryOptions({ queryKey: workflowKeys.list(path, query), queryFn: () => api.get<ListResponse<T>>(`/${path}`, query), placeholderData: keepPreviousData });

export const getAuditsQueryOptions = (query: Query) => listOptions<AuditView>('audits', query);
export const getFindingsQueryOptions = (query: Query) => listOptions<FindingView>('findings', query);
export const getActionsQueryOptions = (query: Query) => listOptions<ActionView>('actions', query);
export const useAudits = (query: Query) => useQuery(getAuditsQueryOptions(query));
export const useFindings = (query: Query) => useQuery(getFindingsQueryOptions(query));
export const useActions = (query: Query) => useQuery(getActionsQueryOptions(query));

export const getAuditQueryOptions = (id: number) =>
  queryOptions({ queryKey: workflowKeys.record('audits', id), queryFn: () => api.get<AuditDetailView>(`/audits/${id}`) });
export const getFindingQueryOptions = (id: number) =>
  queryOptions({ queryKey: workflowKeys.record('findings', id), queryFn: () => api.get<FindingDetailView>(`/findings/${id}`) });
export const getActionQueryOptions = (id: number) =>
  queryOptions({ queryKey: workflowKeys.record('actions', id), queryFn: () => api.get<ActionDetailView>(`/actions/${id}`) });
export const useAudit = (id: number) => useQuery(getAuditQueryOptions(id));
export const useFinding = (id: number) => useQuery(getFindingQueryOptions(id));
export const useAction = (id: number) => useQuery(getActionQueryOptions(id));

export const getRecordTrailQueryOptions = (type: 'audit' | 'finding' | 'action', id: number) =>
  queryOptions({
    queryKey: workflowKeys.trail(type, id),
    queryFn: () => api.get<RecordTrailView>('/trail', { record: `${type}:${id}` }),
  });
export const useRecordTrail = (type: 'audit' | 'finding' | 'action', id: number) => useQuery(getRecordTrailQueryOptions(type, id));

export const getHomeQueryOptions = () => queryOptions({ queryKey: workflowKeys.home, queryFn: () => api.get<HomeView>('/home') });
export const useHome = () => useQuery(getHomeQueryOptions());

export const useAreaOptions = () =>
  useQuery({ queryKey: ['areas'], queryFn: () => api.get<ListResponse<AreaView>>('/areas'), staleTime: 5 * 60_000 });

/** Active people holding a role (for owner and lead-auditor pickers). */
export const usePeopleWithRole = (role: string) =>
  useQuery({
    queryKey: ['users', { role, active: 'true', pageSize: 200 }],
    queryFn: () => api.get<ListResponse<UserView>>('/users', { role, active: 'true', pageSize: 200, sort: 'displayName' }),
    staleTime: 60_000,
  });

interface TechniqueListRow {
  id: number;
  code: string;
  title: string;
  /** The latest revision and its state; `approvedRevision` is the one in force when the latest is not it. */
  revision: string;
  state: string;
  approvedRevision: string | null;
  areaName: string | null;
}

/** The revision in force of a register row: the latest when approved, else the approved one behind a draft; none when only drafts exist. */
export function revisionInForce(row: Pick<TechniqueListRow, 'revision' | 'state' | 'approvedRevision'>): string | null {
  if (row.state === 'approved') return row.revision;
  return row.approvedRevision;
}

/** Techniques an audit may cover: those with an approved revision in force, each with that revision. */
export const useTechniqueOptions = () =>
  useQuery({
    queryKey: ['techniques', { pageSize: 200 }],
    queryFn: () => api.get<ListResponse<TechniqueListRow>>('/techniques', { pageSize: 200, sort: 'code' }),
    staleTime: 60_000,
    select: (data) => ({
      ...data,
      items: data.items.flatMap((row) => {
        const inForce = revisionInForce(row);
        return inForce ? [{ ...row, revision: inForce }] : [];
      }),
    }),
  });

function useInvalidateWorkflow() {
  const queryClient = useQueryClient();
  return () => queryClient.invalidateQueries({ queryKey: workflowKeys.all });
}

/** POST /api/<records>/:id/events with { type, version, ...payload }. */
export function useRecordEvent(path: RecordPath, id: number) {
  const invalidate = useInvalidateWorkflow();
  return useMutation({
    mutationFn: (event: { type: string; version: number; [key: string]: unknown }) => api.post<unknown>(`/${path}/${id}/events`, event),
    onSettled: invalidate,
  });
}

export function useCreateAudit() {
  const invalidate = useInvalidateWorkflow();
  return useMutation({ mutationFn: (input: AuditCreateInput) => api.post<AuditDetailView>('/audits', input), onSuccess: invalidate });
}

export function useRunChecklist(auditId: number) {
  const invalidate = useInvalidateWorkflow();
  return useMutation({
    mutationFn: (techniqueCode: string) => api.post<ChecklistRunView>(`/audits/${auditId}/checklist-runs`, { techniqueCode }),
    onSuccess: invalidate,
  });
}

export function useUpdateChecklistNotes(auditId: number) {
  const invalidate = useInvalidateWorkflow();
  return useMutation({
    mutationFn: ({ runId, version, notes }: { runId: number; version: number; notes: Record<string, string> }) =>
      api.patch<ChecklistRunView>(`/audits/${auditId}/checklist-runs/${runId}`, { version, notes }),
    onSuccess: invalidate,
  });
}

export function useRaiseFinding(auditId: number) {
  const invalidate = useInvalidateWorkflow();
  return useMutation({
    mutationFn: (body: Record<string, unknown>) => api.post<FindingDetailView>(`/audits/${auditId}/findings`, body),
    onSuccess: invalidate,
  });
}

export function useAssignAction() {
  const invalidate = useInvalidateWorkflow();
  return useMutation({
    mutationFn: (body: { findingId: number; ownerId: number; dueDate: string }) => api.post<ActionDetailView>('/actions', body),
    onSuccess: invalidate,
  });
}
