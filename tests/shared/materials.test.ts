import { describe, expect, it } from 'vitest';
import { MATERIALS } from '../../shared/domain/materials';
import { MaterialSchema } from '../../shared/schemas/technique';

describe('materials library', () => {
  it('holds the conductivity table of DOMAIN.md', () => {
    // %IACS from a published ET programmed-instruction text (Ti-6Al-4V from memory), as DOMAIN.md lists them.
    const table: Record<string, number> = {
      'copper-annealed': 100,
      'aluminium-pure': 61,
      'aluminium-6061-t6': 42,
      'aluminium-7075-t6': 32,
      'aluminium-2024-t3': 30,
      'brass-70-30': 28,
      'titanium-cp': 3.1,
      'stainless-304': 2.5,
      'nickel-alloy-600': 1.7,
      'titanium-6al-4v': 1.0,
      'carbon-steel': 10,
    };
    expect(Object.fromEntries(MATERIALS.map((material) => [material.id, material.conductivityIacs]))).toEqual(table);
  });

  it('tags every source and marks only carbon steel ferromagnetic', () => {
    for (const material of MATERIALS) {
      expect(material.source).toMatch(/^\[(pub|trade|mem)\]/);
      expect(MaterialSchema.safeParse({ name: material.name, conductivityIacs: material.conductivityIacs, relativePermeability: material.relativePermeability }).success).toBe(true);
    }
    expect(MATERIALS.filter((material) => material.relativePermeability > 1).map((material) => material.id)).toEqual(['carbon-steel']);
    expect(MATERIALS.find((material) => material.id === 'titanium-6al-4v')?.source).toMatch(/^\[mem\]/);
  });
});
