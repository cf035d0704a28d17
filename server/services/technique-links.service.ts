// Which equipment and which people a technique uses, and the register facts the
// checklist's `personnel` and `equipment` rules are judged on (docs/domain-rules.md, "People and equipment").
import { Op, QueryTypes, type Transaction } from 'sequelize';
import type { AppDeps } from '../app-deps';
import { Certification, Equipment, ReferenceNotch, TechniqueEquipment, TechniquePerformer, User } from '../models';
import { appendTrail } from './trail.service';
import { presentEquipment } from '../presenters/equipment.presenter';
import { AppError, notFound } from '../lib/app-error';
import type { TechniqueLinksInput, TechniqueLinksView } from '../../shared/schemas/equipment';
import type { EquipmentFact, PersonFact, RegisterFactsInput } from '../../shared/domain/checklist';

const STATUS_WORDS: Record<string, string> = { quarantined: 'quarantined', retired: 'retired' };

/** A person as the engine sees them: their active certifications and latest near-vision exam. */
export async function personFacts(userIds: number[], transaction?: Transaction): Promise<Map<number, PersonFact>> {
  const result = new Map<number, PersonFact>();
  if (userIds.length === 0) return result;
  const people = await User.findAll({ where: { id: userIds }, attributes: ['id', 'displayName'], transaction });
  const certifications = await Certification.findAll({ where: { userId: userIds, active: true }, order: [['id', 'ASC']], transaction });
  for (const person of people) {
    const own = certifications.filter((c) => c.userId === person.id);
    const exams = own.map((c) => c.nearVisionExamOn).filter((day): day is string => Boolean(day)).sort();
    result.set(person.id, {
      id: person.id,
      name: person.displayName,
      certifications: own.map((c) => ({
        method: c.method,
        level: c.level as 1 | 2 | 3,
        scheme: c.scheme,
        certificateNumber: c.certificateNumber,
        issuedOn: new Date(`${c.issuedOn}T00:00:00Z`),
        expiresOn: new Date(`${c.expiresOn}T00:00:00Z`),
      })),
      nearVisionExamOn: exams.length ? new Date(`${exams[exams.length - 1]}T00:00:00Z`) : null,
    });
  }
  return result;
}

function equipmentFact(item: Equipment): EquipmentFact {
  const status = STATUS_WORDS[item.status];
  return {
    id: item.id,
    kind: item.kind as EquipmentFact['kind'],
    description: status ? `${item.description} [${status}: out of use]` : item.description,
    serialNumber: item.serialNumber,
    // The engine's fact has no status field: an item out of use must fail the check, so it goes
    // in without a valid calibration (the engine then fails it and the description says why).
    calibrationDueOn: status ? null : item.calibrationDueOn ? new Date(`${item.calibrationDueOn}T00:00:00Z`) : null,
  };
}

export interface FactsRequest {
  techniqueId: number;
  approvedById: number | null;
  approvedAt: Date | null;
  transaction?: Transaction;
}

/** The register facts for one technique: approver, performers and linked equipment. */
export async function buildRegisterFacts({ techniqueId, approvedById, approvedAt, transaction }: FactsRequest): Promise<RegisterFactsInput> {
  const [equipmentLinks, performerLinks] = await Promise.all([
    TechniqueEquipment.findAll({ where: { techniqueId }, transaction }),
    TechniquePerformer.findAll({ where: { techniqueId }, transaction }),
  ]);
  const performerIds = performerLinks.map((link) => link.userId);
  const people = await personFacts([...new Set([...performerIds, ...(approvedById ? [approvedById] : [])])], transaction);
  const items = equipmentLinks.length
    ? await Equipment.findAll({ where: { id: equipmentLinks.map((link) => link.equipmentId) }, order: [['kind', 'ASC'], ['id', 'ASC']], transaction })
    : [];
  return {
    approver: approvedById ? (people.get(approvedById) ?? null) : null,
    ...(approvedAt ? { approvedOn: approvedAt } : {}),
    performers: performerIds.map((id) => people.get(id)).filter((p): p is PersonFact => Boolean(p)),
    equipment: items.map(equipmentFact),
  };
}

export async function getTechniqueLinks(deps: AppDeps, techniqueId: number): Promise<TechniqueLinksView> {
  const [equipmentLinks, performerLinks] = await Promise.all([
    TechniqueEquipment.findAll({ where: { techniqueId } }),
    TechniquePerformer.findAll({ where: { techniqueId } }),
  ]);
  const items = equipmentLinks.length
    ? await Equipment.findAll({
        where: { id: equipmentLinks.map((link) => link.equipmentId) },
        include: [{ model: ReferenceNotch, as: 'notches' }],
        order: [['kind', 'ASC'], ['id', 'ASC']],
      })
    : [];
  const people = performerLinks.length
    ? await User.findAll({ where: { id: performerLinks.map((link) => link.userId) }, attributes: ['id', 'displayName'], order: [['displayName', 'ASC']] })
    : [];
  const now = deps.clock.now();
  return {
    techniqueId,
    equipment: items.map((item) => presentEquipment(item, now)),
    performers: people.map((person) => ({ id: person.id, displayName: person.displayName })),
  };
}

export async function setTechniqueLinks(deps: AppDeps, actorId: number, techniqueId: number, input: TechniqueLinksInput): Promise<TechniqueLinksView> {
  const { sequelize } = deps;
  const [technique] = await sequelize.query<{ id: number }>('SELECT id FROM techniques WHERE id = ?', {
    replacements: [techniqueId],
    type: QueryTypes.SELECT,
  });
  if (!technique) throw notFound('Technique');
  const equipmentIds = [...new Set(input.equipmentIds)];
  const performerIds = [...new Set(input.performerIds)];
  const foundEquipment = equipmentIds.length ? await Equipment.count({ where: { id: { [Op.in]: equipmentIds } } }) : 0;
  const foundPeople = performerIds.length ? await User.count({ where: { id: { [Op.in]: performerIds } } }) : 0;
  const details = [
    ...(foundEquipment !== equipmentIds.length ? [{ path: 'equipmentIds', message: 'some equipment ids do not exist' }] : []),
    ...(foundPeople !== performerIds.length ? [{ path: 'performerIds', message: 'some people do not exist' }] : []),
  ];
  if (details.length) throw new AppError('Some body fields are not valid', { status: 400, code: 'invalid_input', details });
  await sequelize.transaction(async (transaction) => {
    const before = {
      equipmentIds: (await TechniqueEquipment.findAll({ where: { techniqueId }, transaction, lock: transaction.LOCK.UPDATE })).map((l) => l.equipmentId).sort(),
      performerIds: (await TechniquePerformer.findAll({ where: { techniqueId }, transaction, lock: transaction.LOCK.UPDATE })).map((l) => l.userId).sort(),
    };
    await TechniqueEquipment.destroy({ where: { techniqueId }, transaction });
    await TechniquePerformer.destroy({ where: { techniqueId }, transaction });
    await TechniqueEquipment.bulkCreate(equipmentIds.map((equipmentId) => ({ techniqueId, equipmentId })), { transaction });
    await TechniquePerformer.bulkCreate(performerIds.map((userId) => ({ techniqueId, userId })), { transaction });
    await appendTrail(sequelize, transaction, {
      userId: actorId,
      recordType: 'technique',
      recordId: techniqueId,
      event: 'TECHNIQUE_REGISTER_LINKS_SET',
      changes: {
        equipmentIds: { before: before.equipmentIds, after: [...equipmentIds].sort() },
        performerIds: { before: before.performerIds, after: [...performerIds].sort() },
      },
    });
  });
  return getTechniqueLinks(deps, techniqueId);
}
