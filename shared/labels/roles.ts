import type { Role } from '../roles';

export const ROLE_LABELS: Record<Role, string> = {
  auditor: 'Auditor',
  quality_manager: 'Quality manager',
  accountable_manager: 'Accountable manager',
  level3: 'ET Level 3',
  technician: 'Technician',
  admin: 'Administrator',
};

export const roleLabel = (role: string) => (ROLE_LABELS as Record<string, string>)[role] ?? role.replace(/_/g, ' ');
