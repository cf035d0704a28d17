// npm run backup [-- --out DIR]: one archive (.tar.gz) holding a consistent
// dump of the database (mariadb-dump --single-transaction: one snapshot, no
// table locks, writers keep working), the evidence files and a manifest of their
// SHA-256 hashes. The dump is taken first, the files second: evidence rows are
// committed before their file is stored and files are never deleted, so every
// row in the dump finds its file in the archive.
import { spawn, spawnSync } from 'node:child_process';
import { createWriteStream } from 'node:fs';
import { chmod, copyFile, mkdir, mkdtemp, rm, stat, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { createInterface } from 'node:readline';
import { parseArgs } from 'node:util';
import { ARCHIVE_FORMAT, ARCHIVE_VERSION, expectedHashOf, listFiles, resolveTarget, sha256File, withOptionFile, type BackupManifest } from './lib/backup-common';
import { DATA_DIR } from './lib/local-config';

const { values } = parseArgs({ options: { out: { type: 'string' } } });

async function dumpDatabase(optionFile: string, database: string, target: string): Promise<void> {
  const dump = spawn(
    'mariadb-dump',
    [
      `--defaults-file=${optionFile}`,
      '--single-transaction',
      '--quick',
      '--triggers',
      '--hex-blob',
      '--skip-comments',
      '--default-character-set=utf8mb4',
      database,
    ],
    { stdio: ['ignore', 'pipe', 'pipe'] },
  );
  let stderr = '';
  dump.stderr.on('data', (chunk) => (stderr += chunk));
  const out = createWriteStream(target);
  // Triggers are dumped with their creator as DEFINER; dropped here so the dump
  // restores under whichever account loads it.
  const lines = createInterface({ input: dump.stdout, crlfDelay: Infinity });
  for await (const line of lines) {
    if (!out.write(line.replace(/\/\*!50017 DEFINER=`[^`]*`@`[^`]*`\*\/\s*/g, '') + '\n')) {
      await new Promise<void>((resolve) => out.once('drain', () => resolve()));
    }
  }
  await new Promise<void>((resolve, reject) => out.end((error?: Error | null) => (error ? reject(error) : resolve())));
  const code = await new Promise<number | null>((resolve) => (dump.exitCode !== null ? resolve(dump.exitCode) : dump.once('exit', resolve)));
  if (code !== 0) throw new Error(`mariadb-dump failed (${code}): ${stderr.trim()}`);
}

async function main() {
  const target = await resolveTarget(process.env);
  const staging = await mkdtemp(path.join(os.tmpdir(), 'whorl-backup-'));
  try {
    const started = performance.now();
    const dumpFile = path.join(staging, 'database.sql');
    await withOptionFile(target.connection, (optionFile) => dumpDatabase(optionFile, target.connection.database, dumpFile));

    let evidence: BackupManifest['evidence'] = null;
    if (target.objectsDir) {
      evidence = [];
      for (const relative of await listFiles(target.objectsDir)) {
        const source = path.join(target.objectsDir, relative);
        const copy = path.join(staging, 'evidence', relative);
        await mkdir(path.dirname(copy), { recursive: true });
        await copyFile(source, copy);
        const sha256 = await sha256File(copy);
        const expected = expectedHashOf(relative);
        if (expected && expected !== sha256) throw new Error(`Evidence file ${relative} does not match its name's hash: the stored file is damaged`);
        evidence.push({ path: relative, sha256, bytes: (await stat(copy)).size });
      }
    } else {
      console.warn('Evidence lives in S3-compatible storage: this archive holds the database only; back the bucket up with its own tools.');
    }

    const manifest: BackupManifest = {
      format: ARCHIVE_FORMAT,
      version: ARCHIVE_VERSION,
      createdAt: new Date().toISOString(),
      database: target.connection.database,
      dump: { file: 'database.sql', sha256: await sha256File(dumpFile), bytes: (await stat(dumpFile)).size },
      evidence,
    };
    await writeFile(path.join(staging, 'manifest.json'), JSON.stringify(manifest, null, 2));

    const outDir = path.resolve(values.out ?? path.join(DATA_DIR, 'backups'));
    await mkdir(outDir, { recursive: true });
    const stamp = manifest.createdAt.replace(/[:.]/g, '-');
    const archive = path.join(outDir, `whorl-${target.connection.database}-${stamp}.tar.gz`);
    const tar = spawnSync('tar', ['-czf', archive, '-C', staging, '.'], { encoding: 'utf8' });
    if (tar.status !== 0) throw new Error(`tar failed: ${tar.stderr}`);
    await chmod(archive, 0o600);
    const seconds = ((performance.now() - started) / 1000).toFixed(1);
    console.log(`Backup written: ${archive}`);
    console.log(`  database ${target.connection.database}: ${manifest.dump.bytes} bytes of SQL; ${evidence?.length ?? 0} evidence file(s); ${seconds} s`);
    // The archive's own name on the last line, for scripts.
    console.log(archive);
  } finally {
    await rm(staging, { recursive: true, force: true });
    await target.release();
  }
}

main().catch((error) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});

