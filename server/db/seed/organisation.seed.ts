// The demo organisation's name, as its reports print it.
import { setOrganisationName } from '../../services/organisation.service';
import type { SeedStep } from './seed-context';

export const DEMO_ORGANISATION_NAME = 'Tarnbrook Aero Components';

export const seedOrganisation: SeedStep = async ({ sequelize, now }) => {
  await setOrganisationName(sequelize, DEMO_ORGANISATION_NAME, now);
};
