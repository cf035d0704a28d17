// The organisation's policy: every setting's default (shared/domain/policy.ts)
// merged with the values an admin stored. Other services read it through
// loadOrganisationPolicy(); an edit refreshes every stored checklist verdict in
// the same transaction, so the register's verdict column never goes stale.
import type { Sequelize, Transaction } from 'sequelize';
import { DEFAULT_POLICY, POLICY_SETTINGS, PolicySchema, mergePolicy, type Policy, type PolicyKey } from '../../shared/domain/policy';
import type { PolicyUpdateInput, PolicyView } from '../../shared/schemas/technique-register';
import { PolicyHead, PolicySetting, User } from '../models';
import { AppError, staleVersion } from '../lib/app-error';
import { zodIssuesToDetails } from '../middlewares/error-handler';
import { appendTrail } from './trail.service';
import { refreshStoredVerdicts } from './technique-evaluation';

const KNOWN_KEYS = new Set<string>(POLICY_SETTINGS.map((setting) => setting.key));

/** The stored values (only keys the product still knows), by key. */
async function storedValues(transaction?: Transaction): Promise<Map<PolicyKey, PolicySetting>> {
  const rows = await PolicySetting.findAll({
    include: [{ model: User, as: 'updatedBy', attributes: ['id', 'displayName'] }],
    transaction,
  });
  return new Map(rows.filter((row) => KNOWN_KEYS.has(row.key)).map((row) => [row.key, row]));
}

/** Defaults merged with the organisation's stored values. */
export async function loadOrganisationPolicy(transaction?: Transaction): Promise<Policy> {
  const stored = await storedValues(transaction);
  const override: Partial<Policy> = {};
  for (const [key, row] of stored) override[key] = Number(row.value);
  return { ...mergePolicy(DEFAULT_POLICY, override) };
}

type WithUpdatedBy = { updatedBy?: User | null };

export async function getPolicyView(transaction?: Transaction): Promise<PolicyView> {
  const stored = await storedValues(transaction);
  const head = await PolicyHead.findByPk(1, {
    include: [{ model: User, as: 'updatedBy', attributes: ['id', 'displayName'] }],
    transaction,
  });
  const policy = await loadOrganisationPolicy(transaction);
  const person = (user: User | null | undefined) => (user ? { id: user.id, name: user.displayName } : null);
  return {
    version: head?.version ?? 0,
    updatedAt: head && head.version > 0 ? head.updatedAt.toISOString() : null,
    updatedBy: person((head as (PolicyHead & WithUpdatedBy) | null)?.updatedBy),
    policy,
    settings: POLICY_SETTINGS.map((setting) => {
      const row = stored.get(setting.key) as (PolicySetting & WithUpdatedBy) | undefined;
      return {
        ...setting,
        value: policy[setting.key],
        isDefault: !row,
        updatedAt: row ? row.updatedAt.toISOString() : null,
        updatedBy: person(row?.updatedBy),
      };
    }),
  };
}

export async function updatePolicy(sequelize: Sequelize, actorId: number, input: PolicyUpdateInput): Promise<PolicyView> {
  await sequelize.transaction(async (transaction) => {
    const head = await PolicyHead.findByPk(1, { transaction, lock: transaction.LOCK.UPDATE });
    if (!head) throw new Error('policy_heads row is missing: run the migrations');
    if (head.version !== input.version) throw staleVersion();

    const before = await loadOrganisationPolicy(transaction);
    const after: Policy = { ...before };
    const changes: Record<string, { before: number; after: number; default: number }> = {};
    for (const [key, value] of Object.entries(input.values) as [PolicyKey, number | null | undefined][]) {
      if (value === undefined) continue;
      after[key] = value ?? DEFAULT_POLICY[key];
    }
    // Settings that only make sense together (the f/f_g window) are checked on the whole policy.
    const whole = PolicySchema.safeParse(after);
    if (!whole.success) {
      throw new AppError('Some body fields are not valid', {
        status: 400,
        code: 'invalid_input',
        details: zodIssuesToDetails(whole.error).map((issue) => ({ ...issue, path: `values.${issue.path}` })),
      });
    }

    for (const [key, value] of Object.entries(input.values) as [PolicyKey, number | null | undefined][]) {
      if (value === undefined) continue;
      const existing = await PolicySetting.findByPk(key, { transaction });
      if (value === null || value === DEFAULT_POLICY[key]) {
        // Back to the default: no stored row, so a later change of the default applies.
        if (existing) await existing.destroy({ transaction });
      } else if (existing) {
        if (Number(existing.value) !== value) await existing.update({ value, updatedById: actorId }, { transaction });
      } else {
        await PolicySetting.create({ key, value, updatedById: actorId }, { transaction });
      }
      if (before[key] !== after[key]) changes[key] = { before: before[key], after: after[key], default: DEFAULT_POLICY[key] };
    }
    if (Object.keys(changes).length === 0) return;

    head.updatedById = actorId;
    head.changed('updatedAt', true); // saves (and bumps the version) even when the same admin edits again
    await head.save({ transaction });
    const refreshed = await refreshStoredVerdicts(after, transaction);
    await appendTrail(sequelize, transaction, {
      userId: actorId,
      recordType: 'policy',
      recordId: 'organisation',
      event: 'POLICY_UPDATED',
      changes: { ...changes, verdictsChanged: refreshed },
    });
  });
  return getPolicyView();
}
