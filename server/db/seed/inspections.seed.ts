// Demo inspection register: for every approved or superseded technique revision,
// 20–60 invented inspections spread from its approval to the demo's now (or to
// its supersession), by the people and with the equipment the register links to
// the technique. Deterministic: a fixed-seed generator, no Math.random.
// Customers and part numbers are invented for the Tarnbrook Aero Components demo.
import { Op } from 'sequelize';
import { Equipment, Inspection, Technique, TechniqueEquipment, TechniquePerformer, TechniqueRevision } from '../../models';
import { appendTrail } from '../../services/trail.service';
import { isoDay } from '../../../shared/domain/checklist/registers';
import type { InspectionResult } from '../../../shared/schemas/inspection';
import type { SeedStep } from './seed-context';

const DAY_MS = 86_400_000;

const CUSTOMERS = [
  'Harrowgate Turbine Services',
  'Kühlwerk Ærø Flugdienst',
  'Brackwater Regional Air',
  'Fjordvik Rotorteknikk',
  'Pellmoor Freight Lines',
  'Østerdal Aviation',
  'Castellan Heat Transfer',
];

/** Invented part numbers and the serial prefix of each, per demo technique; a technique not listed gets generic ones. */
const PARTS: Record<string, { partNumber: string; serialPrefix: string; customers: number[] }[]> = {
  'TAC-ET-004': [
    { partNumber: 'TWH-2210-03', serialPrefix: 'WH', customers: [0, 2, 4] },
    { partNumber: 'TWH-2214-01', serialPrefix: 'WH', customers: [2, 5] },
  ],
  'TAC-ET-011': [
    { partNumber: 'TSP-7781-15', serialPrefix: 'SP', customers: [0, 3] },
    { partNumber: 'TFR-7702-40', serialPrefix: 'FR', customers: [1, 4, 5] },
  ],
  'TAC-ET-017': [
    { partNumber: 'BAR-2024-25', serialPrefix: 'HT', customers: [1, 6] },
    { partNumber: 'BAR-2024-32', serialPrefix: 'HT', customers: [1] },
  ],
  'TAC-ET-019': [
    { partNumber: 'BAR-2024-40', serialPrefix: 'HT', customers: [1, 6] },
    { partNumber: 'BAR-2024-40L', serialPrefix: 'HT', customers: [1, 4] },
  ],
  'TAC-ET-023': [
    { partNumber: 'HX-1905-B70', serialPrefix: 'BND', customers: [6, 3] },
    { partNumber: 'HX-1905-B72', serialPrefix: 'BND', customers: [6] },
  ],
  'TAC-ET-031': [
    { partNumber: 'TLJ-0331-L', serialPrefix: 'FS', customers: [2, 4, 5] },
    { partNumber: 'TLJ-0331-R', serialPrefix: 'FS', customers: [2, 4] },
  ],
};
/**
 * Techniques the demo story suspends, with the days before the demo's now: the
 * orientation finding's containment suspends TAC-ET-023 63 days ago, so no
 * inspection is made to it after that.
 */
const SUSPENDED_DAYS_AGO: Record<string, number> = { 'TAC-ET-023': 64 };

const GENERIC_PARTS = [{ partNumber: 'TGN-0001-00', serialPrefix: 'GN', customers: [0, 1, 2] }];

const NOTES: Record<Exclude<InspectionResult, 'accept'>, string[]> = {
  reject: [
    'Crack-like indication above the reference notch response; part rejected and tagged.',
    'Indication confirmed on rescan with the second probe; rejected to the customer.',
  ],
  indication_recorded: [
    'Non-relevant indication at the geometry change, recorded and sketched.',
    'Signal below the reject threshold; recorded for the customer’s trend review.',
    'Lift-off signal at the edge, re-scanned with the guide; recorded.',
  ],
};

/** mulberry32: a small, well-known 32-bit generator; the fixed seed keeps the demo identical on every run. */
function generator(seed: number) {
  let state = seed >>> 0;
  const next = () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return {
    next,
    int: (min: number, max: number) => min + Math.floor(next() * (max - min + 1)),
    pick: <T>(items: readonly T[]) => items[Math.floor(next() * items.length)],
  };
}

export const seedInspections: SeedStep = async (context) => {
  const { sequelize, now } = context;
  const { level3, technician } = context.users;
  if (!level3 || !technician) throw new Error('the inspections seed needs the people seed first (level3, technician)');
  const random = generator(20261201);
  const today = isoDay(now);

  await sequelize.transaction(async (transaction) => {
    const revisions = await TechniqueRevision.findAll({
      where: { approvedAt: { [Op.ne]: null } },
      include: [{ model: Technique, as: 'technique', attributes: ['id', 'code'] }],
      order: [['techniqueId', 'ASC'], ['seq', 'ASC']],
      transaction,
    });
    if (revisions.length === 0) throw new Error('the inspections seed needs the techniques seed first');
    const equipment = await Equipment.findAll({ attributes: ['id', 'kind', 'status'], order: [['id', 'ASC']], transaction });
    const links = await TechniqueEquipment.findAll({ transaction });
    const performers = await TechniquePerformer.findAll({ transaction });
    const inspectorKeys = new Set([level3.id, technician.id]);
    let workOrder = 4100;

    for (const revision of revisions) {
      const code = revision.technique!.code;
      const linked = new Set(links.filter((link) => link.techniqueId === revision.techniqueId).map((link) => link.equipmentId));
      const itemOf = (kind: string) =>
        equipment.find((item) => item.kind === kind && linked.has(item.id)) ?? equipment.find((item) => item.kind === kind && item.status === 'in_service') ?? null;
      const [instrument, probe, standard] = [itemOf('instrument'), itemOf('probe'), itemOf('reference-standard')];
      const people = performers.filter((p) => p.techniqueId === revision.techniqueId && inspectorKeys.has(p.userId)).map((p) => p.userId);
      const inspectors = people.length ? people : [technician.id, level3.id];
      const parts = PARTS[code] ?? GENERIC_PARTS;

      const firstDay = Date.parse(`${isoDay(revision.approvedAt!)}T00:00:00Z`);
      const suspendedDay = SUSPENDED_DAYS_AGO[code] === undefined ? today : isoDay(new Date(now.getTime() - SUSPENDED_DAYS_AGO[code] * DAY_MS));
      const lastOpenDay = revision.supersededAt ? isoDay(revision.supersededAt) : today;
      const lastDay = Date.parse(`${lastOpenDay < suspendedDay ? lastOpenDay : suspendedDay}T00:00:00Z`);
      const span = Math.max(0, Math.round((lastDay - firstDay) / DAY_MS));
      const count = random.int(20, 60);
      const days = Array.from({ length: count }, () => random.int(0, span)).sort((a, b) => a - b);

      for (const offset of days) {
        const performedOn = isoDay(new Date(firstDay + offset * DAY_MS));
        const part = random.pick(parts);
        const roll = random.next();
        const result: InspectionResult = roll < 0.84 ? 'accept' : roll < 0.93 ? 'indication_recorded' : 'reject';
        if (random.next() < 0.35 || workOrder === 4100) workOrder += 1;
        // Recorded at the end of the working day it was performed (never after the demo's now).
        const recordedAt = new Date(Math.min(Date.parse(`${performedOn}T16:30:00Z`) + random.int(0, 90) * 60_000, now.getTime()));
        const input = {
          techniqueRevisionId: revision.id,
          techniqueId: revision.techniqueId,
          performedOn,
          partNumber: part.partNumber,
          serialNumber: `${part.serialPrefix}-${String(random.int(10_000, 99_999))}`,
          workOrder: `WO-26-${workOrder}`,
          customer: CUSTOMERS[random.pick(part.customers)],
          inspectorId: random.pick(inspectors),
          result,
          instrumentId: instrument?.id ?? null,
          probeId: probe?.id ?? null,
          referenceStandardId: standard?.id ?? null,
          notes: result === 'accept' ? null : random.pick(NOTES[result]),
        };
        const created = await Inspection.create(
          { ...input, createdById: input.inspectorId, createdAt: recordedAt, updatedAt: recordedAt },
          { transaction, silent: true },
        );
        await appendTrail(sequelize, transaction, {
          userId: input.inspectorId,
          recordType: 'inspection',
          recordId: created.id,
          event: 'INSPECTION_RECORDED',
          changes: { ...input, source: 'demo data' },
          at: recordedAt,
        });
      }
    }
  });
};
