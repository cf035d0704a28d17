// The due-date policy of findings: the organisation's stored setting when it
// changed one (policy_settings), else the default in shared/domain/policy.ts
// (major: action 30 days, containment 1 day; minor: 90 days — common practice,
// no single source).
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { DEFAULT_POLICY } from '../../shared/domain/policy';

export interface FindingDuePolicy {
  findingDueDaysMajor: number;
  findingContainmentDays: number;
  findingDueDaysMinor: number;
}

const KEYS = ['findingDueDaysMajor', 'findingContainmentDays', 'findingDueDaysMinor'] as const;

export async function loadFindingDuePolicy(sequelize: Sequelize, transaction?: Transaction): Promise<FindingDuePolicy> {
  const rows = await sequelize.query<{ key: string; value: number }>(
    `SELECT \`key\`, value FROM policy_settings WHERE \`key\` IN (${KEYS.map(() => '?').join(', ')})`,
    { replacements: [...KEYS], type: QueryTypes.SELECT, transaction },
  );
  const stored = new Map(rows.map((row) => [row.key, Number(row.value)]));
  return {
    findingDueDaysMajor: stored.get('findingDueDaysMajor') ?? DEFAULT_POLICY.findingDueDaysMajor,
    findingContainmentDays: stored.get('findingContainmentDays') ?? DEFAULT_POLICY.findingContainmentDays,
    findingDueDaysMinor: stored.get('findingDueDaysMinor') ?? DEFAULT_POLICY.findingDueDaysMinor,
  };
}

/** An ISO calendar date `days` after `from` (UTC). */
export function addDays(from: Date, days: number): string {
  const date = new Date(Date.UTC(from.getUTCFullYear(), from.getUTCMonth(), from.getUTCDate()));
  date.setUTCDate(date.getUTCDate() + days);
  return date.toISOString().slice(0, 10);
}

export function isoDay(date: Date): string {
  return date.toISOString().slice(0, 10);
}

/** The organisation's policy overrides (policy_settings rows) for the checklist engine; defaults fill the rest. */
export async function loadOrganisationPolicy(sequelize: Sequelize): Promise<Record<string, number>> {
  const rows = await sequelize.query<{ key: string; value: number }>('SELECT `key`, value FROM policy_settings', {
    type: QueryTypes.SELECT,
  });
  const known = new Set(Object.keys(DEFAULT_POLICY));
  return Object.fromEntries(rows.filter((row) => known.has(row.key)).map((row) => [row.key, Number(row.value)]));
}
