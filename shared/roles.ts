// The six roles of a Whorl organisation. Ids are used in code, labels on screen.
export const ROLES = [
  'auditor',
  'quality_manager',
  'accountable_manager',
  'level3',
  'technician',
  'admin',
] as const;

export type Role = (typeof ROLES)[number];

export { ROLE_LABELS } from './labels/roles';
