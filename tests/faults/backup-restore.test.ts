// npm run backup while the app runs, then npm run restore into a fresh instance:
// the same rows, an intact trail chain, every evidence file with its SHA-256;
// a non-empty target is refused unless --force.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { createHash, randomBytes } from 'node:crypto';
import { mkdtempSync, readFileSync, rmSync, existsSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { QueryTypes, type Sequelize } from 'sequelize';
import { startFaultDatabase, FAULT_PASSWORD, type FaultDatabase } from './helpers/fault-database';
import { ROOT, startAppProcess, stopAllAppProcesses } from './helpers/app-process';
import { ApiClient } from './helpers/http-client';
import { createSequelize } from '../../server/db/sequelize';
import { verifyTrail } from '../../server/services/trail.service';
import { DEMO_TECHNIQUES } from '../../shared/domain/demo-techniques';

let source: FaultDatabase;
let restored: FaultDatabase;
const work = mkdtempSync(path.join(os.tmpdir(), 'whorl-backup-test-'));
const sourceStorage = path.join(work, 'source-storage');
const restoredStorage = path.join(work, 'restored-storage');

beforeAll(async () => {
  [source, restored] = await Promise.all([startFaultDatabase('faultsbackupsrc'), startFaultDatabase('faultsbackupdst')]);
});

afterAll(async () => {
  await stopAllAppProcesses();
  await source?.stop();
  await restored?.stop();
  rmSync(work, { recursive: true, force: true });
});

function runScript(script: 'backup' | 'restore', args: string[], env: Record<string, string>) {
  const result = spawnSync(process.execPath, ['--import', 'tsx', path.join(ROOT, 'scripts', `${script}.ts`), ...args], {
    cwd: ROOT,
    encoding: 'utf8',
    env: { PATH: process.env.PATH, HOME: process.env.HOME, ...env },
    timeout: 120_000,
  });
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
}

async function tableCounts(sequelize: Sequelize): Promise<Record<string, number>> {
  const tables = await sequelize.query<{ name: string }>(
    "SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE() AND table_type = 'BASE TABLE' ORDER BY table_name",
    { type: QueryTypes.SELECT },
  );
  const counts: Record<string, number> = {};
  for (const { name } of tables) {
    const [row] = await sequelize.query<{ n: number }>(`SELECT COUNT(*) AS n FROM \`${name}\``, { type: QueryTypes.SELECT });
    counts[name] = Number(row.n);
  }
  return counts;
}

describe('when the database and evidence are backed up and restored into a fresh instance', () => {
  it('then counts, the trail chain and every evidence hash match, and a non-empty target is refused without --force', async () => {
    const level3 = await source.createUser(['level3'], 'level3');
    const admin = await source.createUser(['admin'], 'admin');
    const app = await startAppProcess({ databaseUrl: source.url, label: 'backup', env: { STORAGE_DIR: sourceStorage } });
    const writer = new ApiClient(app.url);
    await writer.signIn(level3.email, FAULT_PASSWORD);
    const adminClient = new ApiClient(app.url);
    await adminClient.signIn(admin.email, FAULT_PASSWORD);

    for (let i = 0; i < 5; i += 1) {
      expect((await adminClient.call('POST', '/api/areas', { code: `BK-${i}`, name: `Backup area ${i}` })).status).toBe(201);
    }
    const technique = await writer.call('POST', '/api/techniques', { technique: { ...DEMO_TECHNIQUES[0], code: 'BK-TECH-1' } });
    expect(technique.status, JSON.stringify(technique.body)).toBe(201);
    const techniqueId = (technique.body as { id: number }).id;

    const uploaded: string[] = [];
    for (let i = 0; i < 4; i += 1) {
      const content = `Calibration check ${i}\nreference standard ${randomBytes(8).toString('hex')}\n`;
      const form = new FormData();
      form.set('recordType', 'technique');
      form.set('recordId', String(techniqueId));
      form.set('file', new Blob([content], { type: 'text/plain' }), `check-${i}.txt`);
      const response = await fetch(`${app.url}/api/evidence`, {
        method: 'POST',
        headers: { cookie: writer.cookieHeader, 'x-csrf-token': writer.csrfToken },
        body: form,
      });
      expect(response.status, await response.clone().text()).toBe(201);
      uploaded.push(createHash('sha256').update(content).digest('hex'));
    }

    const backup = runScript('backup', ['--out', path.join(work, 'backups')], { DATABASE_URL: source.url, STORAGE_DIR: sourceStorage });
    expect(backup.status, backup.stderr).toBe(0);
    const archive = backup.stdout.trim().split('\n').pop()!;
    expect(existsSync(archive)).toBe(true);
    await app.stop();

    const sourceCounts = await tableCounts(source.sequelize);
    expect(sourceCounts.evidence_files).toBe(4);
    expect(sourceCounts.trail_entries).toBeGreaterThan(10);

    // The fresh target was migrated by its setup: not empty, so refused without --force.
    const refused = runScript('restore', [archive], { DATABASE_URL: restored.url, STORAGE_DIR: restoredStorage });
    expect(refused.status).toBe(2);
    expect(refused.stderr).toMatch(/not empty/);

    const restore = runScript('restore', [archive, '--force'], { DATABASE_URL: restored.url, STORAGE_DIR: restoredStorage });
    expect(restore.status, restore.stderr + restore.stdout).toBe(0);
    expect(restore.stdout).toMatch(/chain intact/);

    // Checked here independently of the script's own report.
    const target = createSequelize({ url: restored.url, poolMax: 2 });
    try {
      expect(await tableCounts(target)).toEqual(sourceCounts);
      const trail = await verifyTrail(target);
      expect(trail).toMatchObject({ ok: true, entries: sourceCounts.trail_entries });
      const [head] = await target.query<{ hash: string }>('SELECT hash FROM trail_head WHERE id = 1', { type: QueryTypes.SELECT });
      const [sourceHead] = await source.sequelize.query<{ hash: string }>('SELECT hash FROM trail_head WHERE id = 1', { type: QueryTypes.SELECT });
      expect(head.hash).toBe(sourceHead.hash);
      const rows = await target.query<{ sha256: string; storage_key: string }>('SELECT sha256, storage_key FROM evidence_files', { type: QueryTypes.SELECT });
      expect(rows.map((row) => row.sha256).sort()).toEqual([...uploaded].sort());
      for (const row of rows) {
        const bytes = readFileSync(path.join(restoredStorage, 'objects', row.storage_key));
        expect(createHash('sha256').update(bytes).digest('hex')).toBe(row.sha256);
      }
      // The append-only triggers came back too.
      await expect(target.query('DELETE FROM trail_entries WHERE seq = 1')).rejects.toThrow(/append-only/);
    } finally {
      await target.close();
    }

    // The restored database serves: sign in on it and read the technique's evidence.
    const second = await startAppProcess({ databaseUrl: restored.url, label: 'restored', env: { STORAGE_DIR: restoredStorage } });
    const reader = new ApiClient(second.url);
    await reader.signIn(level3.email, FAULT_PASSWORD);
    const list = await reader.call('GET', `/api/evidence?recordType=technique&recordId=${techniqueId}`);
    expect(list.status).toBe(200);
    expect((list.body as { total: number }).total).toBe(4);
  });

  it('then a damaged archive is refused before anything is touched', async () => {
    const broken = path.join(work, 'broken.tar.gz');
    spawnSync('sh', ['-c', `echo not an archive > ${broken}`]);
    const result = runScript('restore', [broken, '--force'], { DATABASE_URL: restored.url, STORAGE_DIR: restoredStorage });
    expect(result.status).toBe(2);
    expect(result.stderr).toMatch(/Cannot read the archive|Not a Whorl backup/);
  });
});
