import { z } from 'zod';
import { IsoDateSchema } from './common';

export const DashboardQuerySchema = z
  .object({
    from: IsoDateSchema.optional(),
    to: IsoDateSchema.optional(),
    areaId: z.coerce.number().int().positive().optional(),
  })
  .strict()
  .refine((q) => !q.from || !q.to || q.from <= q.to, { message: 'the start date must not be after the end date', path: ['from'] });

export type DashboardQuery = z.infer<typeof DashboardQuerySchema>;

export const AGE_BANDS = ['0–30 days', '31–60 days', '61–90 days', 'over 90 days'] as const;
export type AgeBand = (typeof AGE_BANDS)[number];
/** Open findings without a class yet (raised or in review). */
export const UNCLASSIFIED = 'unclassified';

export interface DashboardView {
  range: { from: string; to: string; areaId: number | null; today: string };
  totals: { openFindings: number; overdueActions: number; closedFindings: number; checklistRuns: number };
  /** Open findings (raised in the range) by class and age band (age from raising to today). */
  openFindingsByClassAge: { class: string; band: AgeBand; count: number }[];
  /** Corrective actions by the month of their due date. */
  actionsByMonth: { month: string; due: number; closedOnTime: number; closedLate: number; overdue: number; openNotDue: number }[];
  /** Findings closed in the range: mean days from raising to closure, by class. */
  meanDaysToClose: { class: string; closed: number; meanDays: number }[];
  /** Checklist rules that failed in audit checklist runs in the range. */
  failingRules: { rule: string; techniques: number; runs: number; failures: number }[];
  /** The number of distinct techniques audited in the range (the denominator of failingRules.techniques). */
  techniquesAudited: number;
  /** Findings raised in the range, by area. */
  findingsByArea: { areaId: number; areaName: string; open: number; closed: number; withdrawn: number }[];
}
