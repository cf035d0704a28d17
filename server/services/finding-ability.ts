import { subject } from '@casl/ability';
import type { AppAbility, AppAction } from '../../shared/abilities';
import type { Finding } from '../models';
import { forbidden } from '../lib/app-error';

/** The role rule on the loaded finding (its snapshot left out); 403 with `message` when it says no. */
export function assertFindingAbility(ability: AppAbility, action: AppAction, finding: Finding, message: string): void {
  const plain = finding.get({ plain: true }) as Record<string, unknown>;
  delete plain.snapshot;
  if (!ability.can(action, subject('Finding', plain))) throw forbidden(message);
}
