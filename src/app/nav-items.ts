import type { AppAbility } from '../../shared/abilities';

export interface NavItem {
  to: string;
  label: string;
  /** Hide the entry from people who may not use the section (the server refuses them anyway). */
  visible?(ability: AppAbility): boolean;
}

// One list drives the navigation; a section adds itself here and in router.tsx.
export const NAV_ITEMS: NavItem[] = [
  { to: '/', label: 'Waiting on you' },
  { to: '/dashboard', label: 'Dashboard', visible: (ability) => ability.can('read', 'Dashboard') },
  { to: '/techniques', label: 'Techniques' },
  { to: '/audits', label: 'Audits' },
  { to: '/findings', label: 'Findings' },
  { to: '/actions', label: 'Corrective actions' },
  { to: '/registers', label: 'Registers' },
  { to: '/trail', label: 'Trail', visible: (ability) => ability.can('verify', 'Trail') },
  { to: '/messages', label: 'Messages', visible: (ability) => ability.can('read', 'Notification') },
  { to: '/admin/users', label: 'People', visible: (ability) => ability.can('create', 'User') },
  { to: '/admin/policy', label: 'Policy', visible: (ability) => ability.can('update', 'Policy') },
];
