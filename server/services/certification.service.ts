// Personnel certifications: list (paged, sorted, filtered by flag in SQL), read,
// create and edit. Every change is a trail entry in the same transaction.
import { Op, type Order, type WhereOptions } from 'sequelize';
import type { AppDeps } from '../app-deps';
import { Certification, User } from '../models';
import { appendTrail } from './trail.service';
import { loadRegisterPolicy } from './register-policy';
import { presentCertification } from '../presenters/certification.presenter';
import { AppError, notFound, staleVersion } from '../lib/app-error';
import { parseSort, type ListResponse } from '../../shared/schemas/common';
import type {
  CertificationCreateInput,
  CertificationListQuery,
  CertificationUpdateInput,
  CertificationView,
} from '../../shared/schemas/certification';
import { CERTIFICATE_WARNING_DAYS, VISION_WARNING_DAYS } from '../../shared/registers/flags';
import { isoDay } from '../../shared/domain/checklist/registers';

const SORTABLE = ['personName', 'method', 'level', 'scheme', 'certificateNumber', 'issuedOn', 'expiresOn', 'nearVisionExamOn'] as const;

const personInclude = { model: User, as: 'person', attributes: ['id', 'displayName', 'email'] };

const addDays = (day: string, days: number) => isoDay(new Date(Date.parse(`${day}T00:00:00Z`) + days * 86_400_000));

function invalid(path: string, message: string) {
  return new AppError('Some body fields are not valid', { status: 400, code: 'invalid_input', details: [{ path, message }] });
}

/** SQL conditions for the flag filters; the same day arithmetic as shared/registers/flags.ts. */
function flagWhere(flag: CertificationListQuery['flag'], today: string, visionMonths: number, sequelize: AppDeps['sequelize']): WhereOptions | null {
  const months = Number(visionMonths);
  const visionDue = sequelize.literal(`DATE_ADD(near_vision_exam_on, INTERVAL ${months} MONTH)`);
  const visionOverdue = {
    [Op.or]: [{ nearVisionExamOn: null }, sequelize.where(visionDue, Op.lt, today)],
  };
  const expired = { expiresOn: { [Op.lt]: today } };
  const expiring = { expiresOn: { [Op.between]: [today, addDays(today, CERTIFICATE_WARNING_DAYS[0])] } };
  switch (flag) {
    case 'expired':
      return expired;
    case 'expiring':
      return expiring;
    case 'vision-overdue':
      return visionOverdue;
    case 'attention':
      return {
        [Op.or]: [
          { expiresOn: { [Op.lte]: addDays(today, CERTIFICATE_WARNING_DAYS[0]) } },
          { nearVisionExamOn: null },
          sequelize.where(visionDue, Op.lte, addDays(today, VISION_WARNING_DAYS)),
        ],
      };
    default:
      return null;
  }
}

export async function listCertifications(deps: AppDeps, query: CertificationListQuery): Promise<ListResponse<CertificationView>> {
  const now = deps.clock.now();
  const today = isoDay(now);
  const policy = await loadRegisterPolicy(deps.sequelize);
  const and: WhereOptions[] = [];
  if (query.q) {
    const like = `%${query.q}%`;
    and.push({
      [Op.or]: [{ certificateNumber: { [Op.like]: like } }, { '$person.display_name$': { [Op.like]: like } }, { sectors: { [Op.like]: like } }],
    });
  }
  if (query.method) and.push({ method: query.method });
  if (query.level) and.push({ level: query.level });
  if (query.scheme) and.push({ scheme: query.scheme });
  if (query.userId) and.push({ userId: query.userId });
  and.push({ active: query.active ? query.active === 'true' : true });
  const flag = flagWhere(query.flag, today, policy.nearVisionExamMonths, deps.sequelize);
  if (flag) and.push(flag);
  const sort = parseSort(query.sort, SORTABLE, 'expiresOn');
  const order: Order =
    sort.field === 'personName'
      ? [[{ model: User, as: 'person' }, 'displayName', sort.direction], ['id', 'ASC']]
      : [[sort.field, sort.direction], ['id', 'ASC']];
  const { rows, count } = await Certification.findAndCountAll({
    where: { [Op.and]: and },
    include: [personInclude],
    order,
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
  });
  return { items: rows.map((row) => presentCertification(row, now, policy.nearVisionExamMonths)), total: count };
}

export async function getCertification(deps: AppDeps, id: number): Promise<CertificationView> {
  const certification = await Certification.findByPk(id, { include: [personInclude] });
  if (!certification) throw notFound('Certification');
  const policy = await loadRegisterPolicy(deps.sequelize);
  return presentCertification(certification, deps.clock.now(), policy.nearVisionExamMonths);
}

async function requireActivePerson(userId: number) {
  const person = await User.findByPk(userId, { attributes: ['id', 'active'] });
  if (!person) throw invalid('userId', 'no such person');
  if (!person.active) throw invalid('userId', 'this person is deactivated');
}

export async function createCertification(deps: AppDeps, actorId: number, input: CertificationCreateInput): Promise<CertificationView> {
  await requireActivePerson(input.userId);
  const id = await deps.sequelize.transaction(async (transaction) => {
    const created = await Certification.create({ ...input, sectors: input.sectors.join(',') }, { transaction });
    await appendTrail(deps.sequelize, transaction, {
      userId: actorId,
      recordType: 'certification',
      recordId: created.id,
      event: 'CERTIFICATION_CREATED',
      changes: { ...input },
    });
    return created.id;
  });
  return getCertification(deps, id);
}

type Editable = Exclude<keyof CertificationUpdateInput, 'version'>;

export async function updateCertification(deps: AppDeps, actorId: number, id: number, input: CertificationUpdateInput): Promise<CertificationView> {
  await deps.sequelize.transaction(async (transaction) => {
    const certification = await Certification.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
    if (!certification) throw notFound('Certification');
    if (certification.version !== input.version) throw staleVersion();
    const changes: Record<string, { before: unknown; after: unknown }> = {};
    for (const key of Object.keys(input) as (keyof CertificationUpdateInput)[]) {
      if (key === 'version' || input[key] === undefined) continue;
      const field = key as Editable;
      const after = field === 'sectors' ? (input.sectors ?? []).join(',') : input[field];
      const before = certification.get(field);
      if (before === after) continue;
      changes[field] = { before, after };
      certification.set(field, after as never);
    }
    if (certification.expiresOn <= certification.issuedOn) throw invalid('expiresOn', 'the expiry date must be after the issue date');
    if (Object.keys(changes).length === 0) return;
    await certification.save({ transaction });
    await appendTrail(deps.sequelize, transaction, {
      userId: actorId,
      recordType: 'certification',
      recordId: id,
      event: changes.active && input.active === false ? 'CERTIFICATION_WITHDRAWN' : 'CERTIFICATION_UPDATED',
      changes,
    });
  });
  return getCertification(deps, id);
}
