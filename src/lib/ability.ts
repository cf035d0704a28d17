import { createMongoAbility } from '@casl/ability';
import { unpackRules, type PackRule } from '@casl/ability/extra';
import { useAbility as useCaslAbility } from '@casl/react';
import type { AppAbility } from '../../shared/abilities';

/** The same rules the server enforces, rebuilt from the packed rules sent at sign-in. */
export function abilityFromPackedRules(rules: unknown[]): AppAbility {
  return createMongoAbility(unpackRules(rules as PackRule<never>[]));
}

export const useAbility = () => useCaslAbility<AppAbility>();
