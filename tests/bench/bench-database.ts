// The benchmark's own MariaDB: a fresh folder under .data/bench-*, a free port,
// migrated; stopped and removed at the end of the run.
import { rmSync } from 'node:fs';
import path from 'node:path';
import { findFreePort, startLocalMariadb, type LocalInstance } from '../../server/db/local-mariadb';
import { migrateWithAccounts } from '../../server/db/privileges';

const ROOT = path.resolve(import.meta.dirname, '../..');

export async function startBenchDatabase(): Promise<{ instance: LocalInstance; dir: string; stop(): Promise<void> }> {
  const dir = path.join(ROOT, '.data', `bench-${process.pid}-${Date.now()}`);
  const port = await findFreePort();
  const instance = await startLocalMariadb({ dir, port, database: 'whorl_bench' });
  const stop = async () => {
    await instance.stop();
    rmSync(dir, { recursive: true, force: true });
  };
  try {
    await migrateWithAccounts({ ownerUrl: instance.ownerUrl, appUrl: instance.url });
  } catch (error) {
    await stop();
    throw error;
  }
  return { instance, dir, stop };
}
