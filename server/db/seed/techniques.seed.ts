// Demo register: the materials library and the seven invented techniques of
// Tarnbrook Aero Components, approved by the demo Level 3 (some fail checks on
// purpose), plus one revision in draft. Ids go to refs for the later steps:
// refs['technique:TAC-ET-023'], refs['techniqueRevision:TAC-ET-023'] (the approved one),
// refs['material:<library id>'].
import { MATERIALS } from '../../../shared/domain/materials';
import { DEMO_SECOND_LAYER_TECHNIQUE, DEMO_SISTER_TECHNIQUE, DEMO_TECHNIQUES, DEMO_TECHNIQUE_NOTES } from '../../../shared/domain/demo-techniques';
import { DEFAULT_POLICY } from '../../../shared/domain/policy';
import { nextRevision } from '../../../shared/domain/revision-letters';
import type { Technique as TechniqueContent } from '../../../shared/schemas/technique';
import { Material, Technique, TechniqueRevision } from '../../models';
import { appendTrail } from '../../services/trail.service';
import { evaluateContent, summariseVerdict } from '../../services/technique-evaluation';
import type { SeedStep } from './seed-context';

const DAY_MS = 86_400_000;

/** The draft under way in the demo: the bead-seat scan gains a lower second frequency. */
function draftOf(content: TechniqueContent): TechniqueContent {
  const revision = nextRevision(content.revision);
  return {
    ...content,
    revision,
    coils: content.coils.map((coil) => ({ ...coil, frequenciesHz: [...coil.frequenciesHz, 100_000] })),
  };
}

export const seedTechniques: SeedStep = async (context) => {
  const { sequelize, now } = context;
  const level3 = context.users.level3;
  if (!level3) throw new Error('the techniques seed needs the people seed first (level3)');

  await sequelize.transaction(async (transaction) => {
    for (const entry of MATERIALS) {
      const material = await Material.create(
        {
          libraryKey: entry.id,
          name: entry.name,
          conductivityIacs: entry.conductivityIacs,
          relativePermeability: entry.relativePermeability,
          source: entry.source,
        },
        { transaction },
      );
      context.refs[`material:${entry.id}`] = material.id;
      await appendTrail(sequelize, transaction, {
        userId: null,
        recordType: 'material',
        recordId: material.id,
        event: 'MATERIAL_CREATED',
        changes: { name: entry.name, conductivityIacs: entry.conductivityIacs, relativePermeability: entry.relativePermeability, source: 'demo data' },
      });
    }

    const areaIdByName = new Map(Object.values(context.areas).map((area) => [area.name, area.id]));
    // The sister bar technique comes last: approved 45 days ago, after the receiving audit ran its checklists.
    // The thick-skin second-layer technique was approved first, long before the field-based checks.
    const approvalDaysAgo = (index: number) => (index < 0 ? 200 : 120 - index * 15);
    for (const [index, content] of [[-1, DEMO_SECOND_LAYER_TECHNIQUE] as const, ...[...DEMO_TECHNIQUES, DEMO_SISTER_TECHNIQUE].entries()]) {
      const note = DEMO_TECHNIQUE_NOTES[content.code];
      const approvedAt = new Date(now.getTime() - approvalDaysAgo(index) * DAY_MS);
      const technique = await Technique.create(
        { code: content.code, title: content.title, areaId: areaIdByName.get(note?.area ?? '') ?? null, createdById: level3.id },
        { transaction },
      );
      const stored = summariseVerdict(evaluateContent(content, DEFAULT_POLICY));
      const revision = await TechniqueRevision.create(
        {
          techniqueId: technique.id,
          seq: 1,
          revision: content.revision,
          state: 'approved',
          content,
          ...stored,
          createdById: level3.id,
          updatedById: level3.id,
          approvedById: level3.id,
          approvedAt,
          supersededAt: null,
        },
        { transaction },
      );
      context.refs[`technique:${content.code}`] = technique.id;
      context.refs[`techniqueRevision:${content.code}`] = revision.id;
      await appendTrail(sequelize, transaction, {
        userId: level3.id,
        recordType: 'technique',
        recordId: technique.id,
        event: 'TECHNIQUE_CREATED',
        changes: { code: content.code, title: content.title, revision: content.revision, source: 'demo data' },
        at: new Date(approvedAt.getTime() - 2 * DAY_MS),
      });
      await appendTrail(sequelize, transaction, {
        userId: level3.id,
        recordType: 'technique',
        recordId: technique.id,
        event: 'REVISION_APPROVED',
        changes: { revision: content.revision, state: { before: 'draft', after: 'approved' }, verdict: stored.verdict, failedRules: stored.failedRules },
        at: approvedAt,
      });

      if (content.code === 'TAC-ET-004') {
        const draft = draftOf(content);
        const draftRevision = await TechniqueRevision.create(
          {
            techniqueId: technique.id,
            seq: 2,
            revision: draft.revision,
            state: 'draft',
            content: draft,
            ...summariseVerdict(evaluateContent(draft, DEFAULT_POLICY)),
            createdById: level3.id,
            updatedById: level3.id,
            approvedById: null,
            approvedAt: null,
            supersededAt: null,
          },
          { transaction },
        );
        context.refs[`techniqueDraft:${content.code}`] = draftRevision.id;
        await appendTrail(sequelize, transaction, {
          userId: level3.id,
          recordType: 'technique',
          recordId: technique.id,
          event: 'REVISION_CREATED',
          changes: { revision: draft.revision, copiedFrom: content.revision, source: 'demo data' },
          at: new Date(now.getTime() - 3 * DAY_MS),
        });
      }
    }
  });
};
