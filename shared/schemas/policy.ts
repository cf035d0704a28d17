// Policy schemas, where the server looks for request schemas. The settings, their
// defaults and their sources live with the engine in shared/domain/policy.ts.
export { PolicySchema, PolicyOverrideSchema, POLICY_SETTINGS, DEFAULT_POLICY, mergePolicy } from '../domain/policy';
export type { Policy, PolicyOverride, PolicyKey, PolicySetting } from '../domain/policy';
