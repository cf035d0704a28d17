// The policy settings the registers read: the organisation's stored value when it
// changed one (policy_settings rows), else the default from shared/domain/policy.ts.
import { QueryTypes, type Sequelize } from 'sequelize';
import { DEFAULT_POLICY } from '../../shared/domain/policy';

export interface RegisterPolicy {
  nearVisionExamMonths: number;
  certificateValidityYears: number;
}

export async function loadRegisterPolicy(sequelize: Sequelize): Promise<RegisterPolicy> {
  const rows = await sequelize.query<{ key: string; value: number }>(
    "SELECT `key`, value FROM policy_settings WHERE `key` IN ('nearVisionExamMonths', 'certificateValidityYears')",
    { type: QueryTypes.SELECT },
  );
  const stored = new Map(rows.map((row) => [row.key, Number(row.value)]));
  return {
    nearVisionExamMonths: stored.get('nearVisionExamMonths') ?? DEFAULT_POLICY.nearVisionExamMonths,
    certificateValidityYears: stored.get('certificateValidityYears') ?? DEFAULT_POLICY.certificateValidityYears,
  };
}
