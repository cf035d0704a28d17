// What the workflow services need to know per record kind: its model, CASL
// subject, trail type, how to load it with what the role rules read, the
// server facts its events need, and which events need a signature.
import { subject } from '@casl/ability';
import { Op, type Transaction } from 'sequelize';
import { recordMachines, type RecordKind } from '../../../machines';
import type { AppAbility, SubjectName } from '../../../shared/abilities';
import { Audit, CorrectiveAction, Finding } from '../../models';
import { countCurrentEvidence } from '../evidence-count';
import { undecidedCounts } from '../impact-scope';
import { restoreRecordSnapshot, allowedEventsFor } from '../../../machines';

export type WorkflowRow = Audit | Finding | CorrectiveAction;

export const SUBJECTS: Record<RecordKind, SubjectName> = { audit: 'Audit', finding: 'Finding', action: 'CorrectiveAction' };
export const LABELS: Record<RecordKind, string> = { audit: 'audit', finding: 'finding', action: 'corrective action' };

export const SETTLED_FINDING_STATES = ['closed', 'withdrawn'] as const;

/** Loads the record for a transition, locked until the transaction ends, or null. */
export async function loadForUpdate(kind: RecordKind, id: number, transaction: Transaction): Promise<WorkflowRow | null> {
  const options = { transaction, lock: transaction.LOCK.UPDATE };
  if (kind === 'audit') return Audit.findByPk(id, options);
  if (kind === 'finding') return Finding.findByPk(id, options);
  return CorrectiveAction.findByPk(id, options);
}

/** Related ids the role rules read (who owns the finding's action, who wrote the action's finding). */
export interface RelatedIds {
  actionOwnerId?: number | null;
  findingAuthorId?: number | null;
  findingAreaId?: number | null;
}

export async function relatedIdsFor(kind: RecordKind, row: WorkflowRow, transaction?: Transaction): Promise<RelatedIds> {
  if (kind === 'finding') {
    const action = await CorrectiveAction.findOne({ where: { findingId: row.id }, attributes: ['ownerId'], transaction });
    return { actionOwnerId: action?.ownerId ?? null };
  }
  if (kind === 'action') {
    const finding = await Finding.findByPk((row as CorrectiveAction).findingId, { attributes: ['authorId', 'areaId'], transaction });
    return { findingAuthorId: finding?.authorId ?? null, findingAreaId: finding?.areaId ?? null };
  }
  return {};
}

/** The plain object CASL conditions are checked against. */
export function subjectFor(kind: RecordKind, row: WorkflowRow, related: RelatedIds) {
  const plain: Record<string, unknown> = { ...(row.get({ plain: true }) as Record<string, unknown>), ...related };
  delete plain.snapshot;
  return subject(SUBJECTS[kind], plain);
}

export type FactsFor = { audit: { openFindingCount: number }; finding: { undecidedInspectionCount: number }; action: { evidenceCount: number } };

/** Counts open findings per audit in one query. */
export async function openFindingCounts(auditIds: number[], transaction?: Transaction): Promise<Map<number, number>> {
  const counts = new Map<number, number>(auditIds.map((id) => [id, 0]));
  if (!auditIds.length) return counts;
  const rows = (await Finding.count({
    where: { auditId: { [Op.in]: auditIds }, state: { [Op.notIn]: [...SETTLED_FINDING_STATES] } },
    group: ['auditId'],
    transaction,
  })) as unknown as Array<{ auditId: number; count: number }>;
  for (const row of rows) counts.set(Number(row.auditId), Number(row.count));
  return counts;
}

/** The containment facts of findings already loaded (no query for those not in containment). */
export async function findingFacts(findings: Finding[], now: Date, transaction?: Transaction): Promise<Map<number, FactsFor['finding']>> {
  const counts = await undecidedCounts(findings, now, transaction);
  return new Map(findings.map((finding) => [finding.id, { undecidedInspectionCount: counts.get(finding.id) ?? 0 }]));
}

/** The server facts of many records of one kind (`now` judges the registers behind a finding's impact scope). */
export async function factsForMany(
  kind: RecordKind,
  ids: number[],
  transaction?: Transaction,
  now: Date = new Date(),
): Promise<Map<number, FactsFor[RecordKind]>> {
  if (kind === 'audit') {
    const counts = await openFindingCounts(ids, transaction);
    return new Map(ids.map((id) => [id, { openFindingCount: counts.get(id) ?? 0 }]));
  }
  if (kind === 'action') {
    const counts = await countCurrentEvidence(transaction, 'action', ids);
    return new Map(ids.map((id) => [id, { evidenceCount: counts.get(id) ?? 0 }]));
  }
  const counts = await undecidedCounts(ids, now, transaction);
  return new Map(ids.map((id) => [id, { undecidedInspectionCount: counts.get(id) ?? 0 }]));
}

/**
 * What this user may send now: the machine's allowed events (with the server's
 * facts) that the role rules allow on this record, without server-only events.
 * A snapshot that no longer restores allows nothing.
 */
export function allowedEventsForUser(
  kind: RecordKind,
  row: WorkflowRow,
  related: RelatedIds,
  facts: FactsFor[RecordKind],
  ability: AppAbility,
): string[] {
  let machineAllowed: string[];
  try {
    const snapshot = restoreRecordSnapshot(kind, row.snapshot, row.machineVersion);
    machineAllowed = allowedEventsFor(kind, snapshot as never, facts as never) as string[];
  } catch {
    return [];
  }
  const serverEvents: readonly string[] = recordMachines[kind].serverEvents;
  const target = subjectFor(kind, row, related);
  return machineAllowed.filter((type) => !serverEvents.includes(type) && ability.can(type, target));
}

export function signedMeaning(kind: RecordKind, eventType: string): string | null {
  const signed = recordMachines[kind].signedEvents as Record<string, string>;
  return signed[eventType] ?? null;
}
