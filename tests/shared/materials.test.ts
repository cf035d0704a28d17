import { describe, expect, it } from 'vitest';
import { MATERIALS } from '../../shared/domain/materials';
import { MaterialSchema } from '../../shared/schemas/technique';

describe('materials library', () => {
  it('holds the conductivity table of docs/domain.md', () => {
    // %IACS from a published ET programmed-instruction text (Ti-6Al-4V from memory), as docs/domain.md lists them.
    const table: Record<string, number> = {
      'copper-annealed': 100,
      'aluminium-pure': 61,
      'aluminium-6061-t6': 42,
      'aluminium-7075-t6': 32,
      'aluminium-2024-t3': 30,
      'brass-70-30': 28,
      'titanium-cp': 3.1,
      'stainless-304': 2.5,
      'alloy-600': 1.7,
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

describe('library names', () => {
  // Trade names of nickel alloys are trademarks: the library uses the generic name and UNS number.
  it('when the library is listed, then no name is a trademarked alloy name', () => {
    for (const entry of MATERIALS) expect(entry.name).not.toMatch(/inconel|incoloy|hastelloy|monel|nimonic|waspaloy|haynes|udimet/i);
    expect(MATERIALS.find((entry) => entry.id === 'alloy-600')?.name).toBe('Alloy 600 (UNS N06600)');
  });
});
