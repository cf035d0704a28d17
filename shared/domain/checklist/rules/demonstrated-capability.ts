// Rule: demonstrated capability. The physics rules argue that a technique can reach and see a
// flaw; a probability-of-detection demonstration shows that it does. For each expected flaw the
// latest accepted demonstration's a90/95 in the flaw's matching dimension (length or depth) must not
// exceed the size the technique claims. Runs only when the server passes demonstration facts.
import { z } from 'zod';
import { isoDay, utcDay, utcDayPlusMonths } from '../registers';
import type { Rule, RuleResult } from '../types';

/** An accepted demonstration of the revision, as the server reads it (`acceptedDemonstrationFacts`). */
export const DemonstrationFactSchema = z
  .object({
    id: z.number().int().positive(),
    title: z.string().min(1).max(160),
    sizeDimension: z.enum(['length', 'depth']),
    /** Upper 95 % bound on a90 in mm; null when the data did not bound it. */
    a9095Mm: z.number().positive().finite().nullable(),
    /** ISO date-time the demonstration was accepted. */
    acceptedAt: z.iso.datetime(),
  })
  .strict();
export const DemonstrationFactsSchema = z.array(DemonstrationFactSchema).max(100);
export type DemonstrationFact = z.infer<typeof DemonstrationFactSchema>;

const BASIS =
  '[pub] MIL-HDBK-1823A (2009): a90/95 from a POD demonstration; [trade] customers commonly ask for a90/95 no larger than the size claimed; required or not, and validity, per policy (Whorl product defaults)';

export const demonstratedCapability: Rule = ({ technique, policy, demonstrations, now }, results) => {
  if (!demonstrations) return;
  const required = policy.demonstrationRequired >= 1;
  const missingStatus: RuleResult['status'] = policy.missingDemonstrationFails >= 1 ? 'fail' : 'warn';
  const today = utcDay(now);
  const latest = (dimension: 'length' | 'depth') =>
    demonstrations.filter((d) => d.sizeDimension === dimension).sort((a, b) => b.acceptedAt.localeCompare(a.acceptedAt))[0];
  const isCurrent = (fact: DemonstrationFact) => utcDayPlusMonths(new Date(fact.acceptedAt), policy.demonstrationValidityMonths) >= today;
  const dimensions = (['length', 'depth'] as const).filter((dimension) => latest(dimension));

  for (const flaw of technique.flaws) {
    if (dimensions.length === 0) {
      if (required)
        results.push({
          rule: 'demonstrated-capability',
          status: missingStatus,
          flaw: flaw.id,
          message: `No accepted capability demonstration covers flaw ${flaw.id}; policy requires one. Record a demonstration, analyse it and have a Level 3 accept it.`,
          values: { claimedMm: null, dimension: null, a9095Mm: null, demonstrationId: null, expired: false },
          basis: BASIS,
        });
      continue;
    }
    for (const dimension of dimensions) {
      const claimedMm = dimension === 'length' ? flaw.lengthMm : flaw.depthMm;
      const fact = latest(dimension)!;
      if (!isCurrent(fact)) {
        results.push({
          rule: 'demonstrated-capability',
          status: required ? missingStatus : 'warn',
          flaw: flaw.id,
          message: `The latest accepted demonstration of flaw ${dimension}, “${fact.title}”, accepted on ${isoDay(new Date(fact.acceptedAt))}, is older than the ${policy.demonstrationValidityMonths} months policy allows: demonstrate flaw ${flaw.id} (${dimension} ${claimedMm} mm) again.`,
          values: { claimedMm, dimension, a9095Mm: fact.a9095Mm, demonstrationId: fact.id, expired: true },
          basis: BASIS,
        });
        continue;
      }
      const values = { claimedMm, dimension, a9095Mm: fact.a9095Mm, demonstrationId: fact.id, expired: false };
      if (fact.a9095Mm === null) {
        results.push({
          rule: 'demonstrated-capability',
          status: 'fail',
          flaw: flaw.id,
          message: `The demonstration “${fact.title}” does not bound a90/95 from above, so it cannot support flaw ${flaw.id} (${dimension} ${claimedMm} mm). Add flaws near the claimed size and analyse again.`,
          values,
          basis: BASIS,
        });
        continue;
      }
      const shown = Number(fact.a9095Mm.toFixed(3));
      const meets = fact.a9095Mm <= claimedMm;
      results.push({
        rule: 'demonstrated-capability',
        status: meets ? 'pass' : 'fail',
        flaw: flaw.id,
        message: meets
          ? `Demonstrated: a90/95 = ${shown} mm in ${dimension} (“${fact.title}”) is within the claimed ${claimedMm} mm for flaw ${flaw.id}.`
          : `Not demonstrated: a90/95 = ${shown} mm in ${dimension} (“${fact.title}”) is larger than the ${claimedMm} mm the technique claims for flaw ${flaw.id}. Claim a larger flaw, or improve the technique and demonstrate it again.`,
        values,
        basis: BASIS,
      });
    }
  }
};
