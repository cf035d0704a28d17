// Demo capability demonstrations (invented data, fixed-seed generator): TAC-ET-004 with a hit/miss
// demonstration whose a90/95 is within the 3 mm crack length it claims, and TAC-ET-011 with a
// signal-response demonstration whose a90/95 is larger than the 0.76 mm it claims, so that the
// technique's checklist fails the demonstrated-capability rule. Both accepted by the Level 3.
import { PodDemonstration, TechniqueEquipment } from '../../models';
import { appendTrail } from '../../services/trail.service';
import { recordSignature } from '../../services/signatures.service';
import { ACCEPT_MEANING } from '../../services/pod-demonstrations.service';
import { analyseDemonstration } from '../../../shared/domain/pod/demonstration';
import { POD_ENGINE_VERSION } from '../../../shared/domain/pod/types';
import type { PodDemonstrationData, PodModel } from '../../../shared/schemas/pod';
import type { SeedContext, SeedStep } from './seed-context';

function generator(seed: number) {
  let state = seed;
  const uniform = () => {
    state = (state * 16807) % 2147483647;
    return state / 2147483647;
  };
  return { uniform, gaussian: () => Math.sqrt(-2 * Math.log(uniform())) * Math.cos(2 * Math.PI * uniform()) };
}

const round = (value: number, digits: number) => Number(value.toFixed(digits));

export function hitMissData(inspectorId: number, equipmentIds: number[]): PodDemonstrationData {
  const rng = generator(4004);
  const specimens = Array.from({ length: 60 }, (_, i) => ({
    specimenId: `WB-P${String(Math.floor(i / 6) + 1).padStart(2, '0')}`,
    flawId: `WB-${String(i + 1).padStart(3, '0')}`,
    sizeMm: round(0.4 * 10 ** (i / 59), 2),
    flawType: 'fatigue crack',
  }));
  // Found with probability 1/(1 + e^(−5·ln(a/1.0 mm))): a50 = 1.0 mm, a90 ≈ 1.55 mm.
  const results = specimens.map((s) => ({ flawId: s.flawId, hit: rng.uniform() < 1 / (1 + Math.exp(-5 * Math.log(s.sizeMm))) }));
  return { link: 'logit', specimens, inspections: [{ inspectorId, performedOn: '2026-09-14', equipmentIds, results }], noise: [] };
}

export function signalData(inspectorId: number, equipmentIds: number[]): PodDemonstrationData {
  const rng = generator(1111);
  const specimens = Array.from({ length: 45 }, (_, i) => ({
    specimenId: `BR-B${String(Math.floor(i / 5) + 1).padStart(2, '0')}`,
    flawId: `BR-${String(i + 1).padStart(3, '0')}`,
    sizeMm: round(0.3 * 10 ** (i / 44), 2),
    flawType: 'EDM notch',
  }));
  // ln â = 0.2 + 1.0·ln a + N(0, 0.35²), â in divisions of the display.
  const results = specimens.map((s) => ({ flawId: s.flawId, signal: round(Math.exp(0.2 + Math.log(s.sizeMm) + 0.35 * rng.gaussian()), 3) }));
  const noise = Array.from({ length: 40 }, () => round(Math.exp(Math.log(0.35) + 0.3 * rng.gaussian()), 3));
  return {
    link: 'logit',
    signalUnits: 'display divisions',
    recordingThreshold: 0.5,
    saturation: 20,
    decisionThreshold: 1.2,
    specimens,
    inspections: [{ inspectorId, performedOn: '2026-10-05', equipmentIds, results }],
    noise,
  };
}

async function seedOne(context: SeedContext, code: string, title: string, model: PodModel, build: (inspectorId: number, equipmentIds: number[]) => PodDemonstrationData) {
  const techniqueRevisionId = context.refs[`techniqueRevision:${code}`];
  const techniqueId = context.refs[`technique:${code}`];
  if (!techniqueRevisionId || !techniqueId) return;
  const level3 = context.users.level3;
  const inspector = context.users.technician;
  const links = await TechniqueEquipment.findAll({ where: { techniqueId } });
  const data = build(inspector.id, links.map((link) => link.equipmentId).slice(0, 3));
  const analysis = analyseDemonstration(model, data);
  if (!analysis.ok) throw new Error(`demo demonstration for ${code} gave no curve: ${analysis.reason}`);
  const acceptedAt = new Date(context.now.getTime() - 20 * 86_400_000);
  await context.sequelize.transaction(async (transaction) => {
    const row = await PodDemonstration.create(
      { techniqueRevisionId, title, model, sizeDimension: 'length', data, analysis: analysis as unknown as Record<string, unknown>, engineVersion: POD_ENGINE_VERSION, analysedAt: acceptedAt, state: 'draft', createdById: level3.id },
      { transaction },
    );
    const trail = (event: string, changes: Record<string, unknown>) =>
      appendTrail(context.sequelize, transaction, { userId: level3.id, recordType: 'pod_demonstration', recordId: row.id, event, changes: { ...changes, source: 'demo data' }, at: acceptedAt });
    await trail('POD_DEMONSTRATION_RECORDED', { techniqueRevisionId, title, model, flaws: data.specimens.length });
    await trail('POD_ANALYSED', { engineVersion: POD_ENGINE_VERSION, n: analysis.n, a50Mm: analysis.a50Mm, a90Mm: analysis.a90Mm, a9095Mm: analysis.a9095Mm });
    const signature = await recordSignature(transaction, {
      recordType: 'demonstration',
      recordId: row.id,
      event: 'ACCEPT',
      signer: level3,
      role: 'level3',
      meaning: ACCEPT_MEANING,
      signedAt: acceptedAt,
      content: { demonstrationId: row.id, techniqueRevisionId, title, model, sizeDimension: 'length', data, analysis, engineVersion: POD_ENGINE_VERSION, meaning: ACCEPT_MEANING },
    });
    row.set({ state: 'accepted', acceptedById: level3.id, acceptedAt, signatureId: signature.id, version: 1 });
    await row.save({ transaction });
    await trail('POD_DEMONSTRATION_ACCEPTED', { signature: { id: signature.id, meaning: ACCEPT_MEANING, role: 'level3', contentHash: signature.contentHash } });
  });
}

export const seedPodDemonstrations: SeedStep = async (context) => {
  await seedOne(context, 'TAC-ET-004', 'Wheel bead seat fatigue cracks, 60 flaws, hit/miss', 'hit-miss', hitMissData);
  await seedOne(context, 'TAC-ET-011', 'Bore notches, 45 flaws, signal response', 'signal-response', signalData);
};
