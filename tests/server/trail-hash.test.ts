import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import canonicalize from 'canonicalize';
import { canonicalEntry } from '../../server/services/trail.service';

describe('the trail entry canonical form', () => {
  it('when any entry is written, then the fast form is byte for byte RFC 8785 canonicalize of the whole entry', () => {
    const json = fc.jsonValue().map((value) => (value && typeof value === 'object' && !Array.isArray(value) ? value : { value }));
    fc.assert(
      fc.property(
        fc.record({
          seq: fc.integer({ min: 1, max: 2 ** 40 }),
          at: fc.date({ min: new Date('2000-01-01'), max: new Date('2100-01-01'), noInvalidDate: true }),
          userId: fc.option(fc.integer({ min: 1, max: 2 ** 31 }), { nil: null }),
          recordType: fc.string(),
          recordId: fc.string(),
          event: fc.string(),
          changes: fc.option(json as fc.Arbitrary<Record<string, unknown>>, { nil: null }),
        }),
        (entry) => {
          const whole = canonicalize({ ...entry, at: entry.at.toISOString(), changes: entry.changes ?? null });
          expect(canonicalEntry(entry)).toBe(whole);
        },
      ),
      { numRuns: 500 },
    );
  });
});
