// The organisation as its reports, e-mails and screens name it: the name from
// the organisation profile (the demo seed writes Tarnbrook's), else ORG_NAME;
// the time zone every date and time is shown in (ORG_TIME_ZONE).
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import type { AppDeps } from '../app-deps';

export interface Organisation {
  name: string;
  timeZone: string;
}

export async function loadOrganisation(deps: Pick<AppDeps, 'config' | 'sequelize'>, transaction?: Transaction): Promise<Organisation> {
  const rows = await deps.sequelize.query<{ name: string }>('SELECT name FROM organisation_profile WHERE id = 1', {
    type: QueryTypes.SELECT,
    transaction,
  });
  return { name: rows[0]?.name ?? deps.config.organisation.name, timeZone: deps.config.organisation.timeZone };
}

/** Sets the organisation's name (the demo seed; an administrator screen later). */
export async function setOrganisationName(sequelize: Sequelize, name: string, now: Date, transaction?: Transaction): Promise<void> {
  await sequelize.query(
    'INSERT INTO organisation_profile (id, name, updated_at) VALUES (1, :name, :now) ON DUPLICATE KEY UPDATE name = VALUES(name), updated_at = VALUES(updated_at)',
    { replacements: { name, now }, transaction },
  );
}
