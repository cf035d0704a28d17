// npm run backup while the app runs and writes, then npm run restore into a
// fresh instance: one consistent snapshot (every area with its trail entry, the
// trail a prefix of the source's), an intact trail chain, every evidence file
// with its SHA-256; a non-empty target is refused unless --force.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { spawn, spawnSync } from 'node:child_process';
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

/** The same, without blocking this process: a write load keeps running meanwhile. */
function runScriptAsync(script: 'backup' | 'restore', args: string[], env: Record<string, string>) {
  return new Promise<{ status: number | null; stdout: string; stderr: string }>((resolve) => {
    const child = spawn(process.execPath, ['--import', 'tsx', path.join(ROOT, 'scripts', `${script}.ts`), ...args], {
      cwd: ROOT,
      env: { PATH: process.env.PATH, HOME: process.env.HOME, ...env },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let stdout = '';
    let stderr = '';
    child.stdout.on('data', (chunk) => (stdout += chunk));
    child.stderr.on('data', (chunk) => (stderr += chunk));
    const timer = setTimeout(() => child.kill('SIGKILL'), 120_000);
    child.once('exit', (status) => {
      clearTimeout(timer);
      resolve({ status, stdout, stderr });
    });
  });
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

    // Writes go on while the dump runs: areas, each with its trail entry, from two workers.
    let writing = true;
    let written = 0;
    const acknowledgedBefore = new Set<string>();
    const writers = [0, 1].map(async (worker) => {
      for (let n = 0; writing; n += 1) {
        const code = `BW-${worker}-${n}`;
        const response = await adminClient.call('POST', '/api/areas', { code, name: `Written during the backup ${worker}-${n}` });
        expect(response.status).toBe(201);
        written += 1;
        acknowledgedBefore.add(code);
      }
    });
    await new Promise((resolve) => setTimeout(resolve, 300));
    const beforeDump = new Set(acknowledgedBefore);
    const backup = await runScriptAsync('backup', ['--out', path.join(work, 'backups')], {
      DATABASE_URL: source.url,
      DATABASE_OWNER_URL: source.ownerUrl,
      STORAGE_DIR: sourceStorage,
    });
    const writtenDuringBackup = written;
    writing = false;
    await Promise.all(writers);
    expect(backup.status, backup.stderr).toBe(0);
    const archive = backup.stdout.trim().split('\n').pop()!;
    expect(existsSync(archive)).toBe(true);
    expect(writtenDuringBackup).toBeGreaterThan(beforeDump.size);
    await app.stop();

    const sourceCounts = await tableCounts(source.sequelize);
    expect(sourceCounts.evidence_files).toBe(4);
    expect(sourceCounts.trail_entries).toBeGreaterThan(10);

    // The fresh target was migrated by its setup: not empty, so refused without --force.
    const refused = runScript('restore', [archive], { DATABASE_URL: restored.url, DATABASE_OWNER_URL: restored.ownerUrl, STORAGE_DIR: restoredStorage });
    expect(refused.status).toBe(2);
    expect(refused.stderr).toMatch(/not empty/);

    const restore = runScript('restore', [archive, '--force'], { DATABASE_URL: restored.url, DATABASE_OWNER_URL: restored.ownerUrl, STORAGE_DIR: restoredStorage });
    expect(restore.status, restore.stderr + restore.stdout).toBe(0);
    expect(restore.stdout).toMatch(/chain intact/);

    // Checked here independently of the script's own report.
    const target = createSequelize({ url: restored.url, poolMax: 2 });
    const targetOwner = createSequelize({ url: restored.ownerUrl, poolMax: 1 });
    try {
      const counts = await tableCounts(target);
      // Tables the load did not touch are equal; the others hold one consistent snapshot.
      for (const [table, count] of Object.entries(sourceCounts)) {
        if (!['areas', 'trail_entries', 'sessions'].includes(table)) expect(counts[table], table).toBe(count);
      }
      // The chain alone: the source's anchors may be newer than the backup.
      const trail = await verifyTrail(target, { anchors: false });
      expect(trail).toMatchObject({ ok: true, entries: counts.trail_entries });
      expect(counts.trail_entries).toBeLessThanOrEqual(sourceCounts.trail_entries);
      // The restored trail is a prefix of the source's: its head is the source's entry of the same sequence.
      const [head] = await target.query<{ seq: number; hash: string }>('SELECT seq, hash FROM trail_head WHERE id = 1', { type: QueryTypes.SELECT });
      const [sourceEntry] = await source.sequelize.query<{ hash: string }>('SELECT hash FROM trail_entries WHERE seq = ?', {
        replacements: [head.seq],
        type: QueryTypes.SELECT,
      });
      expect(head.hash).toBe(sourceEntry.hash);
      // Consistent: every restored area has its trail entry and every area entry its area; nothing acknowledged before the dump is missing.
      const areas = await target.query<{ id: number; code: string }>("SELECT id, code FROM areas WHERE code LIKE 'BW-%'", { type: QueryTypes.SELECT });
      const areaEntries = await target.query<{ record_id: string }>(
        "SELECT record_id FROM trail_entries WHERE record_type = 'area' AND event = 'AREA_CREATED' AND JSON_VALUE(changes, '$.code') LIKE 'BW-%'",
        { type: QueryTypes.SELECT },
      );
      expect(areaEntries.map((entry) => Number(entry.record_id)).sort((a, b) => a - b)).toEqual(areas.map((area) => area.id).sort((a, b) => a - b));
      const restoredCodes = new Set(areas.map((area) => area.code));
      expect([...beforeDump].filter((code) => !restoredCodes.has(code))).toEqual([]);
      console.log(`backup under load: ${writtenDuringBackup} areas written by the end of the dump, ${areas.length} in the snapshot, ${counts.trail_entries} trail entries restored of ${sourceCounts.trail_entries}`);
      const rows = await target.query<{ sha256: string; storage_key: string }>('SELECT sha256, storage_key FROM evidence_files', { type: QueryTypes.SELECT });
      expect(rows.map((row) => row.sha256).sort()).toEqual([...uploaded].sort());
      for (const row of rows) {
        const bytes = readFileSync(path.join(restoredStorage, 'objects', row.storage_key));
        expect(createHash('sha256').update(bytes).digest('hex')).toBe(row.sha256);
      }
      // The application account may not delete trail entries, and the append-only triggers came back for the owner too.
      await expect(target.query('DELETE FROM trail_entries WHERE seq = 1')).rejects.toThrow(/denied/);
      await expect(targetOwner.query('DELETE FROM trail_entries WHERE seq = 1')).rejects.toThrow(/append-only/);
    } finally {
      await target.close();
      await targetOwner.close();
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
    const result = runScript('restore', [broken, '--force'], { DATABASE_URL: restored.url, DATABASE_OWNER_URL: restored.ownerUrl, STORAGE_DIR: restoredStorage });
    expect(result.status).toBe(2);
    expect(result.stderr).toMatch(/Cannot read the archive|Not a Whorl backup/);
  });
});
