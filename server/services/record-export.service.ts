// A record as it is exported: its own view (without the per-user fields such as
// allowedEvents), its evidence list with hashes, its signatures and its whole
// trail, plus the SHA-256 of that content's canonical JSON (RFC 8785), printed
// on every page of its PDF so a paper copy can be matched to the record.
import { contentHash } from '../lib/content-hash';
import { ForbiddenError } from '@casl/ability';
import { Op } from 'sequelize';
import type { AppDeps } from '../app-deps';
import type { SessionUser } from '../../shared/types/session';
import type { AppAbility } from '../../shared/abilities';
import { ChecklistRun, TrailEntry, User } from '../models';
import { getAudit } from './audits.service';
import { getFinding } from './findings.service';
import { getFindingFamily } from './extent.service';
import { getFindingImpact } from './finding-impact.service';
import type { FindingFamilyView } from '../../shared/schemas/extent';
import type { FindingImpactView } from '../../shared/schemas/impact';
import { getAction } from './actions.service';
import { listEvidence } from './evidence.service';
import { getCertification } from './certification.service';
import { getEquipment } from './equipment.service';
import { loadTechniqueView } from './technique.service';
import { getTechniqueLinks } from './technique-links.service';
import type { TrailEntryView } from '../../shared/schemas/trail';
import type { EvidenceRecordType, EvidenceView } from '../../shared/schemas/evidence';
import type { ActionDetailView, AuditDetailView, FindingDetailView } from '../../shared/schemas/workflow';
import type { Technique } from '../../shared/schemas/technique';

export interface Exporter {
  user: SessionUser;
  ability: AppAbility;
}

/** Fields that depend on who is looking, not on the record: left out of exports and hashes. */
const PER_USER_FIELDS = ['allowedEvents', 'canRunChecklist', 'canRaiseFinding', 'canAssignAction', 'canSupersede'];

function withoutPerUserFields<T>(value: T): T {
  if (Array.isArray(value)) return value.map(withoutPerUserFields) as T;
  if (value && typeof value === 'object') {
    return Object.fromEntries(
      Object.entries(value as Record<string, unknown>)
        .filter(([key]) => !PER_USER_FIELDS.includes(key))
        .map(([key, inner]) => [key, withoutPerUserFields(inner)]),
    ) as T;
  }
  return value;
}

export async function trailOf(records: { recordType: string; recordId: number }[]): Promise<TrailEntryView[]> {
  if (records.length === 0) return [];
  const entries = await TrailEntry.findAll({
    where: { [Op.or]: records.map((r) => ({ recordType: r.recordType, recordId: String(r.recordId) })) },
    order: [['seq', 'ASC']],
  });
  const userIds = [...new Set(entries.map((e) => e.userId).filter((id): id is number => id !== null))];
  const users = userIds.length ? await User.findAll({ where: { id: userIds }, attributes: ['id', 'displayName'] }) : [];
  const names = new Map(users.map((u) => [u.id, u.displayName]));
  return entries.map((entry) => ({
    seq: Number(entry.seq),
    at: entry.at.toISOString(),
    userId: entry.userId,
    userName: entry.userId ? (names.get(entry.userId) ?? null) : null,
    recordType: entry.recordType,
    recordId: entry.recordId,
    event: entry.event,
    changes: entry.changes,
    hash: entry.hash,
  }));
}

export interface EvidenceList {
  /** False when the exporter may not see this record's evidence (the list is then empty). */
  shown: boolean;
  items: Omit<EvidenceView, 'canSupersede'>[];
}

async function evidenceOf(deps: AppDeps, exporter: Exporter, recordType: EvidenceRecordType, recordId: number): Promise<EvidenceList> {
  try {
    const list = await listEvidence(deps, exporter, { recordType, recordId, includeSuperseded: 'true' });
    return { shown: true, items: withoutPerUserFields(list.items) };
  } catch (error) {
    if (error instanceof ForbiddenError) return { shown: false, items: [] };
    throw error;
  }
}

interface ExportBase<R extends string, T> {
  recordType: R;
  recordId: number;
  record: T;
  trail: TrailEntryView[];
}

export interface AuditExport extends ExportBase<'audit', AuditDetailView> {
  evidence: EvidenceList;
  /** The technique content each checklist run evaluated (by run id): the report prints frequencies with δ. */
  runTechniques: Record<string, Technique>;
}

export interface FindingExport extends ExportBase<'finding', FindingDetailView> {
  action: ActionDetailView | null;
  evidence: { finding: EvidenceList; action: EvidenceList | null };
  /** The extent of condition: the finding it extends, the findings raised from it, the latest run. */
  extent: FindingFamilyView;
  /** The impact worksheet: past inspections in doubt and the containment decision for each. */
  impact: FindingImpactView;
}

export interface ExportEnvelope<T> {
  format: 'whorl-record-export';
  formatVersion: 1;
  exportedAt: string;
  exportedBy: { id: number; displayName: string };
  /** SHA-256 of the canonical JSON of `content`. */
  sha256: string;
  content: T;
}

function envelope<T>(deps: AppDeps, exporter: Exporter, content: T): ExportEnvelope<T> {
  return {
    format: 'whorl-record-export',
    formatVersion: 1,
    exportedAt: deps.clock.now().toISOString(),
    exportedBy: { id: exporter.user.id, displayName: exporter.user.displayName },
    sha256: contentHash(content),
    content,
  };
}

export async function exportAudit(deps: AppDeps, exporter: Exporter, id: number): Promise<ExportEnvelope<AuditExport>> {
  const audit = withoutPerUserFields(await getAudit(exporter.user, exporter.ability, id));
  const [trail, evidence, runs] = await Promise.all([
    trailOf([{ recordType: 'audit', recordId: id }]),
    evidenceOf(deps, exporter, 'audit', id),
    ChecklistRun.findAll({ where: { auditId: id }, attributes: ['id', 'technique'] }),
  ]);
  const runTechniques = Object.fromEntries(runs.map((run) => [String(run.id), run.technique]));
  return envelope(deps, exporter, { recordType: 'audit', recordId: id, record: audit, evidence, runTechniques, trail });
}

export async function exportFinding(deps: AppDeps, exporter: Exporter, id: number): Promise<ExportEnvelope<FindingExport>> {
  const finding = withoutPerUserFields(await getFinding(deps, exporter.ability, id));
  const action = finding.action ? withoutPerUserFields(await getAction(deps, exporter.ability, finding.action.id)) : null;
  const [trail, findingEvidence, actionEvidence, extent, impact] = await Promise.all([
    trailOf([{ recordType: 'finding', recordId: id }, ...(action ? [{ recordType: 'action', recordId: action.id }] : [])]),
    evidenceOf(deps, exporter, 'finding', id),
    action ? evidenceOf(deps, exporter, 'action', action.id) : Promise.resolve(null),
    getFindingFamily(id),
    getFindingImpact(deps, id),
  ]);
  return envelope(deps, exporter, {
    recordType: 'finding',
    recordId: id,
    record: finding,
    action,
    evidence: { finding: findingEvidence, action: actionEvidence },
    extent,
    impact,
    trail,
  });
}

export async function exportAction(deps: AppDeps, exporter: Exporter, id: number) {
  const action = withoutPerUserFields(await getAction(deps, exporter.ability, id));
  const [trail, evidence] = await Promise.all([trailOf([{ recordType: 'action', recordId: id }]), evidenceOf(deps, exporter, 'action', id)]);
  return envelope(deps, exporter, { recordType: 'action' as const, recordId: id, record: action, evidence, trail });
}

export async function exportCertification(deps: AppDeps, exporter: Exporter, id: number) {
  const certification = await getCertification(deps, id);
  const [trail, evidence] = await Promise.all([trailOf([{ recordType: 'certification', recordId: id }]), evidenceOf(deps, exporter, 'certification', id)]);
  return envelope(deps, exporter, { recordType: 'certification' as const, recordId: id, record: certification, evidence, trail });
}

export async function exportEquipment(deps: AppDeps, exporter: Exporter, id: number) {
  const item = await getEquipment(deps, id);
  const trail = await trailOf([{ recordType: 'equipment', recordId: id }]);
  return envelope(deps, exporter, { recordType: 'equipment' as const, recordId: id, record: item, trail });
}

export async function exportTechnique(deps: AppDeps, exporter: Exporter, id: number) {
  const technique = withoutPerUserFields(await loadTechniqueView(exporter.ability, id));
  const [links, trail, evidence] = await Promise.all([
    getTechniqueLinks(deps, id),
    trailOf([{ recordType: 'technique', recordId: id }]),
    evidenceOf(deps, exporter, 'technique', id),
  ]);
  return envelope(deps, exporter, { recordType: 'technique' as const, recordId: id, record: technique, registerLinks: links, evidence, trail });
}
