// The checks an inspection must pass beyond its zod schema, shared by the form
// (one record) and the CSV import (a whole file): the facts are loaded by the
// caller, so a file of 5 000 rows needs a handful of queries, not 5 000.
import { Op, type Transaction } from 'sequelize';
import { Equipment, TechniqueRevision, User } from '../models';
import { isoDay } from '../../shared/domain/checklist/registers';
import type { InspectionInput } from '../../shared/schemas/inspection';

export interface RevisionFact {
  id: number;
  techniqueId: number;
  approvedAt: Date | null;
}

export interface InspectionFacts {
  revisions: Map<number, RevisionFact>;
  activeUsers: Set<number>;
  equipmentKinds: Map<number, string>;
}

export interface FieldError {
  path: keyof InspectionInput;
  message: string;
}

const EQUIPMENT_FIELDS = [
  ['instrumentId', 'instrument', 'an instrument'],
  ['probeId', 'probe', 'a probe'],
  ['referenceStandardId', 'reference-standard', 'a reference standard'],
] as const;

/** Loads what `inspectionRuleErrors` needs for the given inputs. */
export async function loadInspectionFacts(inputs: Pick<InspectionInput, 'techniqueRevisionId' | 'inspectorId' | 'instrumentId' | 'probeId' | 'referenceStandardId'>[], transaction?: Transaction): Promise<InspectionFacts> {
  const revisionIds = [...new Set(inputs.map((input) => input.techniqueRevisionId))];
  const userIds = [...new Set(inputs.map((input) => input.inspectorId))];
  const equipmentIds = [...new Set(inputs.flatMap((input) => [input.instrumentId, input.probeId, input.referenceStandardId]).filter((id): id is number => id !== null))];
  const [revisions, users, equipment] = await Promise.all([
    revisionIds.length ? TechniqueRevision.findAll({ attributes: ['id', 'techniqueId', 'approvedAt'], where: { id: revisionIds }, transaction }) : [],
    userIds.length ? User.findAll({ attributes: ['id'], where: { id: userIds, active: true }, transaction }) : [],
    equipmentIds.length ? Equipment.findAll({ attributes: ['id', 'kind'], where: { id: { [Op.in]: equipmentIds } }, transaction }) : [],
  ]);
  return {
    revisions: new Map(revisions.map((r) => [r.id, { id: r.id, techniqueId: r.techniqueId, approvedAt: r.approvedAt }])),
    activeUsers: new Set(users.map((u) => u.id)),
    equipmentKinds: new Map(equipment.map((e) => [e.id, e.kind])),
  };
}

/**
 * An inspection is recorded against a revision that was approved (in force or
 * since superseded, never a draft), on a day from its approval to today, by an
 * active user, with equipment of the kind each slot names.
 */
export function inspectionRuleErrors(input: InspectionInput, facts: InspectionFacts, now: Date): FieldError[] {
  const errors: FieldError[] = [];
  const revision = facts.revisions.get(input.techniqueRevisionId);
  if (!revision) {
    errors.push({ path: 'techniqueRevisionId', message: 'no such technique revision' });
  } else if (!revision.approvedAt) {
    errors.push({ path: 'techniqueRevisionId', message: 'this revision is a draft: inspections are recorded only against approved revisions' });
  } else if (input.performedOn < isoDay(revision.approvedAt)) {
    errors.push({ path: 'performedOn', message: `the date is before the revision was approved (${isoDay(revision.approvedAt)})` });
  }
  const today = isoDay(now);
  const parsed = Date.parse(`${input.performedOn}T00:00:00Z`);
  if (Number.isNaN(parsed) || isoDay(new Date(parsed)) !== input.performedOn) errors.push({ path: 'performedOn', message: 'no such calendar day' });
  else if (input.performedOn > today) errors.push({ path: 'performedOn', message: `the date is in the future (today is ${today})` });
  if (!facts.activeUsers.has(input.inspectorId)) errors.push({ path: 'inspectorId', message: 'the inspector must be an active user' });
  for (const [field, kind, label] of EQUIPMENT_FIELDS) {
    const id = input[field];
    if (id === null) continue;
    const found = facts.equipmentKinds.get(id);
    if (!found) errors.push({ path: field, message: 'no such item in the equipment register' });
    else if (found !== kind) errors.push({ path: field, message: `this item is not ${label} (it is registered as ${found.replace('-', ' ')})` });
  }
  return errors;
}
