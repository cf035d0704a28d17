import { readdirSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseTechnique } from '../../shared/domain/checklist/index';
import { DEMO_SISTER_TECHNIQUE, DEMO_TECHNIQUES } from '../../shared/domain/demo-techniques';

// Every technique file written before the coil-mode, notch-location and saturation fields still loads:
// the new fields are optional, and a notch without a location sits on the inspected surface.
const fixturesUrl = new URL('./fixtures/', import.meta.url);
const files = readdirSync(fixturesUrl).filter((name) => name.endsWith('.json'));

describe('technique files written for the earlier engine', () => {
  it('has fixtures to load', () => {
    expect(files.length).toBeGreaterThan(0);
  });

  it.each(files)('%s still loads, its notches on the inspected surface', (name) => {
    const parsed = parseTechnique(JSON.parse(readFileSync(new URL(name, fixturesUrl), 'utf8')));
    expect(parsed.success, parsed.success ? '' : JSON.stringify(parsed.issues)).toBe(true);
    if (!parsed.success) return;
    for (const notch of parsed.data.reference.notches) expect(notch.location).toBe('surface');
    for (const coil of parsed.data.coils) expect(coil.pairAxisDeg).toBeUndefined();
    expect(parsed.data.material.incrementalPermeability).toBeUndefined();
  });

  it('loads every demo technique', () => {
    for (const technique of [...DEMO_TECHNIQUES, DEMO_SISTER_TECHNIQUE]) expect(parseTechnique(technique).success, technique.code).toBe(true);
  });
});
