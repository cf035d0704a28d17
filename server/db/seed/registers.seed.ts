// Demo registers of Tarnbrook Aero Components: personnel certifications and the
// equipment the five demo techniques call for, with one calibration overdue and a
// near-vision exam about to lapse. Dates are relative to the seed day so the flags
// read the same whenever the demo is started. Names, models and serials are invented.
// Leaves refs['equipment:<serial>'] and refs['certification:<number>'].
import { Certification, Equipment, ReferenceNotch, TechniqueEquipment, TechniquePerformer } from '../../models';
import { appendTrail } from '../../services/trail.service';
import { isoDay, utcDayPlusMonths } from '../../../shared/domain/checklist/registers';
import type { NotchInput } from '../../../shared/schemas/equipment';
import type { SeedStep } from './seed-context';

const DAY_MS = 86_400_000;

interface DemoEquipment {
  key: string;
  kind: 'instrument' | 'probe' | 'reference-standard';
  description: string;
  model: string | null;
  serialNumber: string;
  /** Calibrated this many days before the seed day, due this many days after it (negative: overdue). */
  calibratedDaysAgo: number;
  dueInDays: number;
  status?: 'in_service' | 'quarantined' | 'retired';
  conductivityIacs?: number;
  material?: string;
  notches?: Partial<NotchInput>[];
  notes?: string;
}

const EQUIPMENT: DemoEquipment[] = [
  { key: 'et-two-channel', kind: 'instrument', description: 'Eddy current flaw detector, two-channel', model: 'K-2', serialNumber: 'FK2-10482', calibratedDaysAgo: 120, dueInDays: 245 },
  {
    key: 'et-portable',
    kind: 'instrument',
    description: 'Eddy current flaw detector, portable',
    model: 'M-40',
    serialNumber: 'FM40-00731',
    calibratedDaysAgo: 377,
    dueInDays: -12,
    notes: 'Calibration lapsed; the recall notice went to the calibration house.',
  },
  { key: 'pencil', kind: 'probe', description: 'Shielded pencil probe, 5 mm, 100–500 kHz', model: 'PX-5S', serialNumber: 'PX5S-2231', calibratedDaysAgo: 60, dueInDays: 305 },
  { key: 'rotating', kind: 'probe', description: 'Rotating bolt-hole probe, 4.8 mm', model: 'RB-48', serialNumber: 'RB48-0907', calibratedDaysAgo: 200, dueInDays: 165 },
  { key: 'encircling', kind: 'probe', description: 'Encircling coil assembly, 28 mm bore', model: 'EC-28', serialNumber: 'EC28-0115', calibratedDaysAgo: 90, dueInDays: 275 },
  { key: 'bobbin', kind: 'probe', description: 'Internal bobbin probe, 15.5 mm, differential', model: 'BB-155', serialNumber: 'BB155-0412', calibratedDaysAgo: 340, dueInDays: 25 },
  { key: 'spot', kind: 'probe', description: 'Unshielded spot probe, 12.7 mm, 1–10 kHz', model: 'SP-127', serialNumber: 'SP127-0058', calibratedDaysAgo: 30, dueInDays: 335 },
  {
    key: 'pencil-old',
    kind: 'probe',
    description: 'Shielded pencil probe, 5 mm (cable damaged)',
    model: 'PX-5S',
    serialNumber: 'PX5S-1876',
    calibratedDaysAgo: 400,
    dueInDays: -35,
    status: 'quarantined',
    notes: 'Intermittent signal at the connector; tagged out of use pending repair.',
  },
  {
    key: 'ref-bead',
    kind: 'reference-standard',
    description: 'Bead-seat reference block',
    model: null,
    serialNumber: 'TAC-RS-004',
    calibratedDaysAgo: 150,
    dueInDays: 580,
    conductivityIacs: 40,
    material: '2014-T6 forging offcut',
    notches: [
      { label: 'N1', orientation: 'transverse', depthMm: 0.5, lengthMm: 3, edgeDistanceMm: 1.5 },
      { label: 'N2', orientation: 'longitudinal', depthMm: 0.5, lengthMm: 3 },
    ],
  },
  {
    key: 'ref-hole',
    kind: 'reference-standard',
    description: 'Fastener-hole reference block, 4.8 mm bores',
    model: null,
    serialNumber: 'TAC-RS-011',
    calibratedDaysAgo: 300,
    dueInDays: 430,
    conductivityIacs: 31,
    material: '7075-T6 plate',
    notches: [{ label: 'Corner notch', orientation: 'axial', depthMm: 0.5, lengthMm: 0.76, edgeDistanceMm: 0.5 }],
  },
  {
    key: 'ref-bar',
    kind: 'reference-standard',
    description: 'Bar reference, 25 mm',
    model: null,
    serialNumber: 'TAC-RS-017',
    calibratedDaysAgo: 500,
    dueInDays: 230,
    conductivityIacs: 30,
    material: '2024-T351 bar',
    notches: [{ label: 'Axial EDM', orientation: 'axial', depthMm: 0.3, lengthMm: 25 }],
  },
  {
    key: 'ref-tube',
    kind: 'reference-standard',
    description: 'Tube reference, 19.05 mm OD',
    model: null,
    serialNumber: 'TAC-RS-023',
    calibratedDaysAgo: 250,
    dueInDays: 480,
    conductivityIacs: 28,
    material: '70/30 brass tube',
    notches: [
      { label: 'A', orientation: 'axial', depthMm: 0.5, lengthMm: 10 },
      { label: 'C', orientation: 'circumferential', depthMm: 0.5, lengthMm: 10 },
    ],
  },
  {
    key: 'ref-lap',
    kind: 'reference-standard',
    description: 'Lap-joint reference, two layers',
    model: null,
    serialNumber: 'TAC-RS-031',
    calibratedDaysAgo: 90,
    dueInDays: 640,
    conductivityIacs: 30,
    material: '2024-T3 clad sheet',
    notches: [{ label: 'Second layer', orientation: 'transverse', depthMm: 1.0, lengthMm: 5 }],
  },
];

/** Which equipment and people each demo technique uses. */
const TECHNIQUE_LINKS: Record<string, { equipment: string[]; performers: string[] }> = {
  'TAC-ET-004': { equipment: ['et-two-channel', 'pencil', 'ref-bead'], performers: ['level3', 'technician'] },
  'TAC-ET-011': { equipment: ['et-two-channel', 'rotating', 'ref-hole'], performers: ['technician'] },
  'TAC-ET-017': { equipment: ['et-portable', 'encircling', 'ref-bar'], performers: ['technician'] },
  'TAC-ET-023': { equipment: ['et-portable', 'bobbin', 'ref-tube'], performers: ['level3'] },
  'TAC-ET-031': { equipment: ['et-two-channel', 'spot', 'ref-lap'], performers: ['level3', 'technician'] },
  'TAC-ET-019': { equipment: ['et-portable', 'encircling', 'ref-bar'], performers: ['technician'] },
};

export const seedRegisters: SeedStep = async (context) => {
  const { sequelize, now } = context;
  const day = (offsetDays: number) => isoDay(new Date(now.getTime() + offsetDays * DAY_MS));
  const monthsAgo = (months: number, plusDays = 0) => {
    const dayNumber = utcDayPlusMonths(now, -months) + plusDays;
    return isoDay(new Date(dayNumber * DAY_MS));
  };

  const certifications = [
    // The Level 3: approves techniques; ISO 9712, central certification.
    { user: 'level3', method: 'ET', level: 3, scheme: 'ISO 9712', certificateNumber: 'TRB-ET3-0142', issuedOn: day(-700), expiresOn: day(-700 + 5 * 365), nearVisionExamOn: monthsAgo(4), colourVisionCheckedOn: day(-700), sectors: 'aerospace,metal manufacturing' },
    { user: 'level3', method: 'UT', level: 2, scheme: 'ISO 9712', certificateNumber: 'TRB-UT2-0388', issuedOn: day(-1700), expiresOn: day(50), nearVisionExamOn: monthsAgo(4), colourVisionCheckedOn: day(-1700), sectors: 'aerospace' },
    // The second Level 3: approves what the first one writes (nobody approves their own revision).
    { user: 'level3b', method: 'ET', level: 3, scheme: 'ISO 9712', certificateNumber: 'TRB-ET3-0217', issuedOn: day(-420), expiresOn: day(-420 + 5 * 365), nearVisionExamOn: monthsAgo(2), colourVisionCheckedOn: day(-420), sectors: 'aerospace' },
    // The technician: ET Level 2 under the employer's aerospace scheme; the near-vision exam lapses in about ten days.
    { user: 'technician', method: 'ET', level: 2, scheme: 'EN 4179', certificateNumber: 'TAC-WP-ET2-017', issuedOn: day(-400), expiresOn: day(-400 + 5 * 365), nearVisionExamOn: monthsAgo(12, 10), colourVisionCheckedOn: day(-400), sectors: 'aerospace' },
    { user: 'technician', method: 'PT', level: 2, scheme: 'written practice', certificateNumber: 'TAC-WP-PT2-009', issuedOn: day(-1850), expiresOn: day(-24), nearVisionExamOn: monthsAgo(12, 10), colourVisionCheckedOn: day(-1850), sectors: 'aerospace' },
  ];

  await sequelize.transaction(async (transaction) => {
    for (const c of certifications) {
      const userId = context.users[c.user].id;
      const created = await Certification.create(
        {
          userId,
          method: c.method,
          level: c.level,
          scheme: c.scheme,
          certificateNumber: c.certificateNumber,
          issuedOn: c.issuedOn,
          expiresOn: c.expiresOn,
          nearVisionExamOn: c.nearVisionExamOn,
          colourVisionCheckedOn: c.colourVisionCheckedOn,
          sectors: c.sectors,
          notes: null,
        },
        { transaction },
      );
      context.refs[`certification:${c.certificateNumber}`] = created.id;
      await appendTrail(sequelize, transaction, {
        userId: null,
        recordType: 'certification',
        recordId: created.id,
        event: 'CERTIFICATION_CREATED',
        changes: { userId, method: c.method, level: c.level, certificateNumber: c.certificateNumber, source: 'demo data' },
      });
    }

    const ids: Record<string, number> = {};
    for (const item of EQUIPMENT) {
      const created = await Equipment.create(
        {
          kind: item.kind,
          description: item.description,
          model: item.model,
          serialNumber: item.serialNumber,
          calibratedOn: day(-item.calibratedDaysAgo),
          calibrationDueOn: day(item.dueInDays),
          status: item.status ?? 'in_service',
          conductivityIacs: item.conductivityIacs ?? null,
          material: item.material ?? null,
          notes: item.notes ?? null,
        },
        { transaction },
      );
      ids[item.key] = created.id;
      context.refs[`equipment:${item.serialNumber}`] = created.id;
      await ReferenceNotch.bulkCreate(
        (item.notches ?? []).map((notch, position) => ({
          equipmentId: created.id,
          position,
          label: notch.label ?? null,
          orientation: notch.orientation!,
          angleDeg: notch.angleDeg ?? null,
          depthMm: notch.depthMm!,
          lengthMm: notch.lengthMm!,
          edgeDistanceMm: notch.edgeDistanceMm ?? null,
        })),
        { transaction },
      );
      await appendTrail(sequelize, transaction, {
        userId: null,
        recordType: 'equipment',
        recordId: created.id,
        event: 'EQUIPMENT_CREATED',
        changes: { kind: item.kind, serialNumber: item.serialNumber, source: 'demo data' },
      });
    }

    for (const [code, links] of Object.entries(TECHNIQUE_LINKS)) {
      const techniqueId = context.refs[`technique:${code}`];
      if (!techniqueId) continue; // the technique step did not seed this one
      await TechniqueEquipment.bulkCreate(links.equipment.map((key) => ({ techniqueId, equipmentId: ids[key] })), { transaction });
      await TechniquePerformer.bulkCreate(links.performers.map((key) => ({ techniqueId, userId: context.users[key].id })), { transaction });
      await appendTrail(sequelize, transaction, {
        userId: null,
        recordType: 'technique',
        recordId: techniqueId,
        event: 'TECHNIQUE_REGISTER_LINKS_SET',
        changes: { equipmentIds: links.equipment.map((key) => ids[key]), performerIds: links.performers.map((key) => context.users[key].id), source: 'demo data' },
      });
    }
  });
};
