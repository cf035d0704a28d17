import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ZodError } from 'zod';
import { evaluateParsedTechnique, evaluateTechnique, parseTechnique, RULE_IDS, safeEvaluateTechnique } from '../../../shared/domain/checklist/index';
import { standardDepthMm } from '../../../shared/domain/physics';
import { DELETE, pathsOf, replaceAt, validTechniqueArbitrary } from './arbitraries';

const positive = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });
const STATUSES = ['pass', 'fail', 'warn', 'not_applicable'];

describe('physics properties', () => {
  it('δ falls as frequency, conductivity or permeability rises', () => {
    // δ = 1/√(π f μ0 μr σ) is strictly decreasing in f, σ and μr.
    fc.assert(
      fc.property(positive(1, 1e7), positive(0.1, 110), positive(1, 1000), positive(1.001, 100), (f, iacs, mu, factor) => {
        const delta = standardDepthMm(f, iacs, mu);
        expect(standardDepthMm(f * factor, iacs, mu)).toBeLessThan(delta);
        expect(standardDepthMm(f, iacs * factor, mu)).toBeLessThan(delta);
        expect(standardDepthMm(f, iacs, mu * factor)).toBeLessThan(delta);
      }),
    );
  });
});

// Each generated technique meets the coil field models cold (new geometry, new layers): allow for it.
describe('engine properties', { timeout: 600_000 }, () => {
  it('accepts every generated technique and evaluates it without throwing, with a consistent verdict', () => {
    fc.assert(
      fc.property(validTechniqueArbitrary, (input) => {
        const parsed = parseTechnique(input);
        if (!parsed.success) throw new Error(`generator produced an invalid technique: ${JSON.stringify(parsed.issues)}`);
        const output = evaluateParsedTechnique(parsed.data);
        for (const result of output.results) {
          expect(STATUSES).toContain(result.status);
          expect(RULE_IDS).toContain(result.rule);
          expect(result.message.length).toBeGreaterThan(10);
          expect(result.message).not.toMatch(/NaN|undefined|Infinity/);
          expect(result.basis.length).toBeGreaterThan(5);
        }
        const fails = output.results.some((result) => result.status === 'fail');
        expect(output.verdict).toBe(fails ? 'does-not-conform' : 'conforms');
        const reported = new Set(output.results.map((result) => result.rule));
        for (const rule of RULE_IDS) if (rule !== 'personnel' && rule !== 'equipment' && rule !== 'demonstrated-capability') expect(reported.has(rule)).toBe(true);
      }),
      { numRuns: 300 },
    );
  });

  it('never passes a technique with a laminar flaw', () => {
    fc.assert(
      fc.property(validTechniqueArbitrary, positive(0.01, 1), (input, depthFraction) => {
        const lamination = {
          id: 'lamination',
          orientation: 'laminar' as const,
          location: 'subsurface' as const,
          depthMm: depthFraction * Math.min(...input.flaws.map((flaw) => flaw.depthMm)),
          lengthMm: 10,
        };
        const output = evaluateTechnique({ ...input, flaws: [...input.flaws, lamination] });
        expect(output.verdict).toBe('does-not-conform');
        expect(output.results.find((result) => result.rule === 'orientation-coverage' && result.flaw === 'lamination')?.status).toBe('fail');
      }),
      { numRuns: 200 },
    );
  });

  it('never throws past the validator on arbitrary input', () => {
    fc.assert(
      fc.property(fc.anything({ withNullPrototype: true, withBigInt: true, withDate: true, withMap: true, withSet: true }), (input) => {
        const result = safeEvaluateTechnique(input);
        expect(result.success).toBe(false);
        expect(() => evaluateTechnique(input)).toThrow(ZodError);
      }),
      { numRuns: 500 },
    );
  });

  it('never throws past the validator on a valid technique with one field broken or removed', () => {
    const replacement = fc.oneof(
      fc.constant(DELETE),
      fc.constant(null),
      fc.constant(undefined),
      fc.constant(Number.NaN),
      fc.constant(-1),
      fc.constant(0),
      fc.constant(1e308),
      fc.constant(''),
      fc.constant([]),
      fc.constant({}),
      fc.string(),
      fc.double(),
      fc.anything(),
    );
    fc.assert(
      fc.property(validTechniqueArbitrary, fc.nat(), replacement, (input, pick, value) => {
        const paths = pathsOf(input);
        const mutated = replaceAt(input, paths[pick % paths.length], value);
        const result = safeEvaluateTechnique(mutated);
        if (result.success) {
          expect(STATUSES).toContain(result.output.results[0].status);
        } else {
          expect(result.issues.length).toBeGreaterThan(0);
          for (const issue of result.issues) expect(issue.message.length).toBeGreaterThan(0);
        }
        try {
          evaluateTechnique(mutated);
        } catch (error) {
          expect(error).toBeInstanceOf(ZodError);
        }
      }),
      { numRuns: 1000 },
    );
  });

  it('never throws on arbitrary options', () => {
    fc.assert(
      fc.property(validTechniqueArbitrary, fc.anything(), fc.anything(), (input, policy, registers) => {
        const result = safeEvaluateTechnique(input, { policy, registers });
        expect(typeof result.success).toBe('boolean');
      }),
      { numRuns: 200 },
    );
  });
});
