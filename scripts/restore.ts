// npm run restore FILE [-- --force]: loads a backup archive into the target
// database (as DATABASE_OWNER_URL, granting DATABASE_URL its privileges; or the
// local install) and evidence folder (STORAGE_DIR).
// The archive is checked before anything is touched: the manifest, the dump's
// hash and every evidence file's hash. A target database that already holds
// tables is refused unless --force (which drops them first). Afterwards the
// restore is verified: row counts, the trail's hash chain, every evidence hash.
import { spawn, spawnSync } from 'node:child_process';
import { createReadStream, existsSync } from 'node:fs';
import { chmod, copyFile, mkdir, mkdtemp, readFile, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { parseArgs } from 'node:util';
import { QueryTypes } from 'sequelize';
import { createSequelize } from '../server/db/sequelize';
import { verifyTrail } from '../server/services/trail.service';
import { configureTrail } from '../server/services/trail-anchors';
import { accountOf, grantApplicationPrivileges } from '../server/db/privileges';
import { ARCHIVE_FORMAT, listFiles, resolveTarget, sha256File, withOptionFile, type BackupManifest } from './lib/backup-common';

const { values, positionals } = parseArgs({ options: { force: { type: 'boolean', default: false } }, allowPositionals: true });

class RefusedError extends Error {}

function runClient(optionFile: string, database: string, sql: string | { file: string }): Promise<void> {
  return new Promise((resolve, reject) => {
    const args = [`--defaults-file=${optionFile}`, '--batch', database];
    const client = spawn('mariadb', typeof sql === 'string' ? [...args, '-e', sql] : args, { stdio: ['pipe', 'ignore', 'pipe'] });
    let stderr = '';
    client.stderr.on('data', (chunk) => (stderr += chunk));
    client.once('error', reject);
    client.once('exit', (code) => (code === 0 ? resolve() : reject(new Error(`mariadb client failed (${code}): ${stderr.trim()}`))));
    if (typeof sql === 'string') client.stdin.end();
    else createReadStream(sql.file).pipe(client.stdin);
  });
}

async function checkArchive(dir: string): Promise<BackupManifest> {
  const manifestFile = path.join(dir, 'manifest.json');
  if (!existsSync(manifestFile)) throw new RefusedError('Not a Whorl backup: manifest.json is missing');
  const manifest = JSON.parse(await readFile(manifestFile, 'utf8')) as BackupManifest;
  if (manifest.format !== ARCHIVE_FORMAT || manifest.version !== 1) throw new RefusedError(`Unknown archive format ${manifest.format} v${manifest.version}`);
  if ((await sha256File(path.join(dir, 'database.sql'))) !== manifest.dump.sha256) throw new RefusedError('The database dump does not match its hash in the manifest');
  for (const file of manifest.evidence ?? []) {
    const copy = path.join(dir, 'evidence', file.path);
    if (!existsSync(copy) || (await sha256File(copy)) !== file.sha256) throw new RefusedError(`Evidence file ${file.path} is missing or damaged in the archive`);
  }
  return manifest;
}

async function main() {
  const file = positionals[0];
  if (!file) throw new RefusedError('Usage: npm run restore -- FILE.tar.gz [--force]');
  if (!existsSync(file)) throw new RefusedError(`No such file: ${file}`);
  const staging = await mkdtemp(path.join(os.tmpdir(), 'whorl-restore-'));
  const target = await resolveTarget(process.env);
  const ownerUrl = target.config.databaseOwnerUrl ?? target.config.databaseUrl;
  const sequelize = createSequelize({ url: ownerUrl, poolMax: 2, queryTimeoutMs: 600_000 });
  configureTrail(target.config);
  try {
    const tar = spawnSync('tar', ['-xzf', path.resolve(file), '-C', staging, '--no-same-owner'], { encoding: 'utf8' });
    if (tar.status !== 0) throw new RefusedError(`Cannot read the archive: ${tar.stderr.trim()}`);
    const manifest = await checkArchive(staging);
    const { database } = target.connection;

    const tables = await sequelize.query<{ name: string }>(
      "SELECT table_name AS name FROM information_schema.tables WHERE table_schema = ? AND table_type = 'BASE TABLE'",
      { replacements: [database], type: QueryTypes.SELECT },
    );
    const existing = target.objectsDir ? await listFiles(target.objectsDir) : [];
    if ((tables.length > 0 || existing.length > 0) && !values.force) {
      throw new RefusedError(
        `The target is not empty (database ${database}: ${tables.length} table(s); evidence folder: ${existing.length} file(s)). ` +
          'Restore into a fresh database, or add --force to replace the database (evidence files are only ever added).',
      );
    }

    await withOptionFile(target.connection, async (optionFile) => {
      if (tables.length > 0) {
        const drops = tables.map((table) => `DROP TABLE IF EXISTS \`${table.name.replace(/`/g, '``')}\``).join('; ');
        await runClient(optionFile, database, `SET FOREIGN_KEY_CHECKS = 0; ${drops}; SET FOREIGN_KEY_CHECKS = 1`);
      }
      await runClient(optionFile, database, { file: path.join(staging, 'database.sql') });
    });

    let copied = 0;
    if (manifest.evidence && target.objectsDir) {
      for (const entry of manifest.evidence) {
        const destination = path.join(target.objectsDir, entry.path);
        if (existsSync(destination)) {
          // Content-addressed and append-only: an existing object must already be these bytes.
          if ((await sha256File(destination)) !== entry.sha256) throw new Error(`Existing evidence file ${entry.path} differs from the backup's`);
          continue;
        }
        await mkdir(path.dirname(destination), { recursive: true });
        await copyFile(path.join(staging, 'evidence', entry.path), destination);
        await chmod(destination, 0o444);
        copied += 1;
      }
    } else if (manifest.evidence && !target.objectsDir) {
      console.warn('The target stores evidence in S3-compatible storage: copy the archive\'s evidence/ folder into the bucket with its own tools.');
    }

    // The recreated tables need the application account's privileges again.
    if (ownerUrl !== target.config.databaseUrl) await grantApplicationPrivileges(sequelize, await accountOf(target.config.databaseUrl));

    // Verification of what is now in place.
    const counts: Record<string, number> = {};
    const restoredTables = await sequelize.query<{ name: string }>(
      "SELECT table_name AS name FROM information_schema.tables WHERE table_schema = ? AND table_type = 'BASE TABLE' ORDER BY table_name",
      { replacements: [database], type: QueryTypes.SELECT },
    );
    for (const { name } of restoredTables) {
      const [row] = await sequelize.query<{ n: number | string }>(`SELECT COUNT(*) AS n FROM \`${name.replace(/`/g, '``')}\``, { type: QueryTypes.SELECT });
      counts[name] = Number(row.n);
    }
    // The chain alone: a backup is older than the anchors written since it was taken.
    const trail = counts.trail_entries !== undefined && counts.trail_settings !== undefined ? await verifyTrail(sequelize, { anchors: false }) : null;
    const problems: string[] = [];
    if (trail && !trail.ok) problems.push(`the trail chain is broken at entry ${trail.firstBrokenSeq}`);
    let evidenceChecked = 0;
    if (counts.evidence_files !== undefined && target.objectsDir) {
      const rows = await sequelize.query<{ id: number; sha256: string; storage_key: string; stored_at: Date | null }>(
        'SELECT id, sha256, storage_key, stored_at FROM evidence_files',
        { type: QueryTypes.SELECT },
      );
      for (const row of rows) {
        const stored = path.join(target.objectsDir, row.storage_key);
        if (!existsSync(stored)) {
          if (row.stored_at) problems.push(`evidence ${row.id}: file ${row.storage_key} is missing`);
          continue;
        }
        if ((await sha256File(stored)) !== row.sha256) problems.push(`evidence ${row.id}: file does not match its SHA-256`);
        evidenceChecked += 1;
      }
    }
    console.log(`Restored ${file} (made ${manifest.createdAt}) into database ${database}; ${copied} evidence file(s) copied.`);
    console.log(`  rows: ${Object.entries(counts).map(([name, n]) => `${name} ${n}`).join(', ')}`);
    if (trail) console.log(`  trail: ${trail.entries} entries, chain ${trail.ok ? 'intact' : 'BROKEN'}`);
    console.log(`  evidence: ${evidenceChecked} file(s) match their SHA-256`);
    if (problems.length) {
      console.error(`Restore verification failed:\n  ${problems.join('\n  ')}`);
      process.exitCode = 1;
    }
  } finally {
    await sequelize.close();
    await rm(staging, { recursive: true, force: true });
    await target.release();
  }
}

main().catch((error) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(error instanceof RefusedError ? 2 : 1);
});
