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

export const ROLE_LABELS: Record<Role, string> = {
  auditor: 'Auditor',
  quality_manager: 'Quality manager',
  accountable_manager: 'Accountable manager',
  level3: 'ET Level 3',
  technician: 'Technician',
  admin: 'Administrator',
};
