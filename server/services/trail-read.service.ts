// Reading the trail as people search it: a record number ("F-2026-0015",
// "CA-2026-0003"), a technique code ("TAC-ET-031") or "type:id", and the
// entries presented in words with the names of the records they mention.
import { QueryTypes, type Sequelize } from 'sequelize';
import { TrailEntry, User } from '../models';
import type { AppDeps } from '../app-deps';
import type { PresentedTrailEntryView, RecordTrailView, TrailEntryView } from '../../shared/schemas/trail';
import { recordTypeLabel } from '../../shared/labels';
import { presentTrailEntry, referencedIds, type RefKind, type TrailNames } from '../presenters/trail.presenter';
import { loadOrganisation } from './organisation.service';

export interface RecordRef {
  type: string;
  id: string;
  label: string;
}

const TYPE_ID = /^([a-z_-]+):([A-Za-z0-9_-]+)$/;
const FINDING_NUMBER = /^F-\d{4}-\d{1,6}$/i;
const ACTION_NUMBER = /^CA-\d{4}-\d{1,6}$/i;

async function firstRow<T extends object>(sequelize: Sequelize, sql: string, replacements: Record<string, unknown>): Promise<T | undefined> {
  const rows = await sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT });
  return rows[0];
}

/** Finds the record a person typed: null when nothing matches. */
export async function resolveRecordQuery(sequelize: Sequelize, text: string): Promise<RecordRef | null> {
  const query = text.trim();
  const typed = TYPE_ID.exec(query);
  if (typed) {
    const [, type, id] = typed;
    const names = await loadNames(sequelize, new Map([[type as RefKind, new Set([id])]]));
    const name = names.get(type as RefKind)?.get(id);
    return { type, id, label: `${recordTypeLabel(type)} ${name ?? id}` };
  }
  if (FINDING_NUMBER.test(query)) {
    const row = await firstRow<{ id: number; number: string }>(sequelize, 'SELECT id, number FROM findings WHERE number = :number', { number: query.toUpperCase() });
    return row ? { type: 'finding', id: String(row.id), label: `Finding ${row.number}` } : null;
  }
  if (ACTION_NUMBER.test(query)) {
    const row = await firstRow<{ id: number; number: string }>(sequelize, 'SELECT id, number FROM corrective_actions WHERE number = :number', { number: query.toUpperCase() });
    return row ? { type: 'action', id: String(row.id), label: `Corrective action ${row.number}` } : null;
  }
  const technique = await firstRow<{ id: number; code: string }>(sequelize, 'SELECT id, code FROM techniques WHERE code = :code', { code: query });
  if (technique) return { type: 'technique', id: String(technique.id), label: `Technique ${technique.code}` };
  return null;
}

const NAME_QUERIES: Record<RefKind, string> = {
  user: 'SELECT id, display_name AS name FROM users WHERE id IN (:ids)',
  area: 'SELECT id, name FROM areas WHERE id IN (:ids)',
  technique: 'SELECT id, code AS name FROM techniques WHERE id IN (:ids)',
  revision:
    "SELECT r.id, CONCAT(t.code, ' rev ', r.revision) AS name FROM technique_revisions r JOIN techniques t ON t.id = r.technique_id WHERE r.id IN (:ids)",
  audit: 'SELECT id, title AS name FROM audits WHERE id IN (:ids)',
  finding: 'SELECT id, number AS name FROM findings WHERE id IN (:ids)',
  action: 'SELECT id, number AS name FROM corrective_actions WHERE id IN (:ids)',
  equipment: "SELECT id, CONCAT(description, ' (s/n ', serial_number, ')') AS name FROM equipment WHERE id IN (:ids)",
  inspection: "SELECT id, CONCAT(part_number, ' s/n ', serial_number, ', work order ', work_order) AS name FROM inspections WHERE id IN (:ids)",
};

/** One query per kind of record referenced. */
export async function loadNames(sequelize: Sequelize, wanted: Map<RefKind, Set<string>>): Promise<TrailNames> {
  const names: TrailNames = new Map();
  await Promise.all(
    [...wanted].map(async ([kind, ids]) => {
      const sql = NAME_QUERIES[kind];
      const numeric = [...ids].filter((id) => /^\d+$/.test(id)).map(Number);
      if (!sql || !numeric.length) return;
      const rows = await sequelize.query<{ id: number; name: string }>(sql, { replacements: { ids: numeric }, type: QueryTypes.SELECT });
      names.set(kind, new Map(rows.map((row) => [String(row.id), row.name])));
    }),
  );
  return names;
}

/** Presents entries already read (the record export's trail, for instance). */
export async function presentTrail(deps: Pick<AppDeps, 'sequelize' | 'config'>, entries: TrailEntryView[]): Promise<PresentedTrailEntryView[]> {
  const [names, organisation] = await Promise.all([loadNames(deps.sequelize, referencedIds(entries)), loadOrganisation(deps)]);
  return entries.map((entry) => presentTrailEntry(entry, names, organisation.timeZone));
}

/** The trail of the record a person searched for, oldest first, in words. */
export async function readRecordTrail(
  deps: Pick<AppDeps, 'sequelize' | 'config'>,
  text: string,
  limit: number,
  /** Refuses (throws) when the reader may not see this record's timeline. */
  assertMayRead: (record: { type: string; id: string }) => Promise<void>,
): Promise<RecordTrailView> {
  const record = await resolveRecordQuery(deps.sequelize, text);
  if (!record) return { record: null, items: [], total: 0 };
  await assertMayRead(record);
  const entries = await TrailEntry.findAll({ where: { recordType: record.type, recordId: record.id }, order: [['seq', 'ASC']], limit });
  const userIds = [...new Set(entries.map((entry) => entry.userId).filter((id): id is number => id !== null))];
  const users = userIds.length ? await User.findAll({ where: { id: userIds }, attributes: ['id', 'displayName'] }) : [];
  const userNames = new Map(users.map((user) => [user.id, user.displayName]));
  const views: TrailEntryView[] = entries.map((entry) => ({
    seq: Number(entry.seq),
    at: entry.at.toISOString(),
    userId: entry.userId,
    userName: entry.userId ? (userNames.get(entry.userId) ?? null) : null,
    recordType: entry.recordType,
    recordId: entry.recordId,
    event: entry.event,
    changes: entry.changes,
    hash: entry.hash,
  }));
  const items = await presentTrail(deps, views);
  return { record, items, total: items.length };
}
