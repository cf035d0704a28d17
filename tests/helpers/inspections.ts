// Fresh records for the inspection register's API tests: a technique with an
// approved, a superseded and a draft revision, and one item of each equipment
// kind, all with unique codes and serials so test files never meet.
import { randomBytes } from 'node:crypto';
import { Equipment, Technique, TechniqueRevision, type User } from '../../server/models';
import { DEMO_TECHNIQUES } from '../../shared/domain/demo-techniques';

export interface InspectionFixture {
  technique: Technique;
  superseded: TechniqueRevision;
  approved: TechniqueRevision;
  draft: TechniqueRevision;
  instrument: Equipment;
  probe: Equipment;
  standard: Equipment;
  tag: string;
}

const content = DEMO_TECHNIQUES[0];

export async function makeInspectionFixture(author: User, { approvedOn = '2026-06-01', supersededOn = '2026-03-01' } = {}): Promise<InspectionFixture> {
  const tag = randomBytes(3).toString('hex').toUpperCase();
  const technique = await Technique.create({ code: `TQ-${tag}`, title: `Inspection register test technique ${tag}`, areaId: null, createdById: author.id });
  const revision = (seq: number, letter: string, state: 'approved' | 'superseded' | 'draft', approvedAt: Date | null) =>
    TechniqueRevision.create({
      techniqueId: technique.id,
      seq,
      revision: letter,
      state,
      content: { ...content, code: technique.code, revision: letter },
      verdict: 'conforms',
      failedRules: [],
      createdById: author.id,
      updatedById: author.id,
      approvedById: approvedAt ? author.id : null,
      approvedAt,
      supersededAt: state === 'superseded' ? new Date(`${approvedOn}T08:00:00Z`) : null,
    });
  const superseded = await revision(1, 'A', 'superseded', new Date(`${supersededOn}T10:00:00Z`));
  const approved = await revision(2, 'B', 'approved', new Date(`${approvedOn}T08:00:00Z`));
  const draft = await revision(3, 'C', 'draft', null);
  const item = (kind: string, serial: string) => Equipment.create({ kind, description: `Test ${kind} ${tag}`, model: null, serialNumber: serial, calibratedOn: null, calibrationDueOn: null, conductivityIacs: null, material: null, notes: null });
  const instrument = await item('instrument', `INS-${tag}`);
  const probe = await item('probe', `PRB-${tag}`);
  const standard = await item('reference-standard', `RS-${tag}`);
  return { technique, superseded, approved, draft, instrument, probe, standard, tag };
}

export function inspectionBody(fixture: InspectionFixture, inspector: User, overrides: Record<string, unknown> = {}) {
  return {
    techniqueRevisionId: fixture.approved.id,
    performedOn: '2026-07-15',
    partNumber: `PN-${fixture.tag}`,
    serialNumber: `SN-${fixture.tag}-001`,
    workOrder: `WO-${fixture.tag}`,
    customer: 'Kühlwerk Ærø Flugdienst',
    inspectorId: inspector.id,
    result: 'accept',
    instrumentId: fixture.instrument.id,
    probeId: fixture.probe.id,
    referenceStandardId: fixture.standard.id,
    notes: null,
    ...overrides,
  };
}
