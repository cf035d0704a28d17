// The demo scenario's audits, findings and actions, seeded into a database of
// their own (never the API tests' one): every state is present and the records
// agree with their trail.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes, type Sequelize } from 'sequelize';
import { createSequelize } from '../../server/db/sequelize';
import { seedSteps } from '../../server/db/seed';
import type { SeedContext } from '../../server/db/seed/seed-context';
import { loadConfig, type AppConfig } from '../../server/config/env';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { verifyTrail } from '../../server/services/trail.service';
import { AUDIT_STATES, CORRECTIVE_ACTION_STATES, FINDING_STATES } from '../../machines';
import { startTestDatabase } from '../helpers/test-database';
import { initModels } from '../../server/models';
import { configureTrail } from '../../server/services/trail-anchors';

let database: Awaited<ReturnType<typeof startTestDatabase>>;
let sequelize: Sequelize;
const storageDir = mkdtempSync(path.join(tmpdir(), 'whorl-seed-evidence-'));
beforeAll(async () => {
  database = await startTestDatabase('seed');
  sequelize = createSequelize({ url: database.instance.url, poolMax: 5 });
  initModels(sequelize);
  // The steps of seedDemo, with the application's configuration on the context so evidence goes to storage.
  const config: AppConfig = loadConfig({
    NODE_ENV: 'test', DATABASE_URL: database.instance.url, SESSION_SECRET: 'seed-test-secret-that-is-long-enough', LOG_LEVEL: 'silent', STORAGE_DIR: storageDir,
    TRAIL_ANCHOR_FILE: path.join(database.dir, 'trail-anchors.log'),
  });
  configureTrail(config);
  const context = { sequelize, now: new Date(), users: {}, areas: {}, refs: {}, config } as SeedContext;
  for (const step of seedSteps) await step(context);
}, 120_000);
afterAll(async () => {
  await sequelize?.close();
  await database?.stop();
  rmSync(storageDir, { recursive: true, force: true });
});

const statesOf = async (table: string) =>
  (await sequelize.query<{ state: string; n: number }>(`SELECT state, COUNT(*) AS n FROM ${table} GROUP BY state`, { type: QueryTypes.SELECT }))
    .reduce<Record<string, number>>((all, row) => ({ ...all, [row.state]: Number(row.n) }), {});

describe('the demo workflow seed', () => {
  it('when the demo is seeded, then audits, findings and actions exist in every state, two or more findings wait in review', async () => {
    const audits = await statesOf('audits');
    const findings = await statesOf('findings');
    const actions = await statesOf('corrective_actions');
    for (const state of AUDIT_STATES) expect(audits[state], `audit ${state}`).toBeGreaterThan(0);
    for (const state of FINDING_STATES) expect(findings[state], `finding ${state}`).toBeGreaterThan(0);
    for (const state of CORRECTIVE_ACTION_STATES) expect(actions[state], `action ${state}`).toBeGreaterThan(0);
    expect(findings.in_review).toBeGreaterThanOrEqual(2);
  });

  it('when the demo is seeded, then each record’s state column, snapshot and version agree with its trail, and the chain verifies', async () => {
    // Every trail entry of a finding that changed its row counts, and only those: raising it (version 0),
    // assigning its action, its containment decisions and extent runs leave the finding's row as it was.
    const rows = await sequelize.query<{ id: number; state: string; snapshot: string | { value: string }; version: number; transitions: number }>(
      `SELECT f.id, f.state, f.snapshot, f.version,
              (SELECT COUNT(*) FROM trail_entries t WHERE t.record_type = 'finding' AND t.record_id = f.id
                 AND t.event NOT IN ('FINDING_RAISED', 'ACTION_ASSIGNED', 'CONTAINMENT_DECIDED', 'EXTENT_RUN', 'EXTENT_FINDINGS_RAISED')) AS transitions
         FROM findings f`,
      { type: QueryTypes.SELECT },
    );
    for (const row of rows) {
      const snapshot = typeof row.snapshot === 'string' ? JSON.parse(row.snapshot) : row.snapshot;
      expect(snapshot.value).toBe(row.state);
      expect(Number(row.transitions)).toBe(row.version);
    }
    const signatures = await sequelize.query<{ n: number }>("SELECT COUNT(*) AS n FROM signatures WHERE record_type = 'finding'", { type: QueryTypes.SELECT });
    expect(Number(signatures[0].n)).toBeGreaterThan(0);
    expect((await verifyTrail(sequelize)).ok).toBe(true);
    const evidence = await sequelize.query<{ stored: number; total: number }>(
      "SELECT SUM(stored_at IS NOT NULL) AS stored, COUNT(*) AS total FROM evidence_files WHERE record_type = 'action'",
      { type: QueryTypes.SELECT },
    );
    expect(Number(evidence[0].total)).toBeGreaterThan(0);
    expect(Number(evidence[0].stored)).toBe(Number(evidence[0].total));
  });

  it('when the demo is seeded, then one accepted demonstration meets its claimed crack length and the other exceeds it', async () => {
    const rows = await sequelize.query<{ title: string; state: string; analysis: string | Record<string, unknown>; signature_id: number | null }>(
      'SELECT title, state, analysis, signature_id FROM pod_demonstrations ORDER BY id',
      { type: QueryTypes.SELECT },
    );
    expect(rows.map((row) => row.state)).toEqual(['accepted', 'accepted']);
    for (const row of rows) expect(row.signature_id).not.toBeNull();
    const a9095 = rows.map((row) => (typeof row.analysis === 'string' ? JSON.parse(row.analysis) : row.analysis).a9095Mm as number);
    // TAC-ET-004 claims 3 mm cracks; TAC-ET-011 claims 0.76 mm (the demo techniques' flaw lengths).
    expect(a9095[0]).toBeLessThan(3);
    expect(a9095[1]).toBeGreaterThan(0.76);
  });
});

