// The materials library: seeded from shared/domain/materials.ts, extended and
// corrected by the admin. Every change is a trail entry in the same transaction.
import { Op, type Sequelize } from 'sequelize';
import type { MaterialCreateInput, MaterialUpdateInput, MaterialView } from '../../shared/schemas/technique-register';
import { Material } from '../models';
import { AppError, notFound, staleVersion } from '../lib/app-error';
import { appendTrail } from './trail.service';

export function presentMaterial(material: Material): MaterialView {
  return {
    id: material.id,
    libraryKey: material.libraryKey,
    name: material.name,
    conductivityIacs: Number(material.conductivityIacs),
    relativePermeability: Number(material.relativePermeability),
    source: material.source,
    version: material.version,
  };
}

export async function listMaterials(q?: string) {
  const materials = await Material.findAll({
    where: q ? { name: { [Op.like]: `%${q}%` } } : {},
    order: [['conductivityIacs', 'DESC'], ['name', 'ASC']],
  });
  return { items: materials.map(presentMaterial), total: materials.length };
}

async function refuseDuplicateName(name: string, exceptId?: number) {
  const existing = await Material.findOne({ where: { name } });
  if (existing && existing.id !== exceptId) {
    throw new AppError(`A material named "${name}" is already in the library`, {
      status: 409,
      code: 'duplicate',
      details: [{ path: 'name', message: 'this name is already used' }],
    });
  }
}

export async function createMaterial(sequelize: Sequelize, actorId: number, input: MaterialCreateInput): Promise<MaterialView> {
  await refuseDuplicateName(input.name);
  const material = await sequelize.transaction(async (transaction) => {
    const created = await Material.create({ ...input, libraryKey: null }, { transaction });
    await appendTrail(sequelize, transaction, { userId: actorId, recordType: 'material', recordId: created.id, event: 'MATERIAL_CREATED', changes: input });
    return created;
  });
  return presentMaterial(material);
}

export async function updateMaterial(sequelize: Sequelize, actorId: number, id: number, input: MaterialUpdateInput): Promise<MaterialView> {
  if (input.name) await refuseDuplicateName(input.name, id);
  const material = await sequelize.transaction(async (transaction) => {
    const row = await Material.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
    if (!row) throw notFound('Material');
    if (row.version !== input.version) throw staleVersion();
    const changes: Record<string, { before: unknown; after: unknown }> = {};
    for (const key of ['name', 'conductivityIacs', 'relativePermeability', 'source'] as const) {
      const value = input[key];
      if (value === undefined || row[key] === value) continue;
      changes[key] = { before: row[key], after: value };
      row.set(key, value);
    }
    if (Object.keys(changes).length === 0) return row;
    await row.save({ transaction });
    await appendTrail(sequelize, transaction, { userId: actorId, recordType: 'material', recordId: id, event: 'MATERIAL_UPDATED', changes });
    return row;
  });
  return presentMaterial(material);
}
