// A fresh private MariaDB per test run, never the demo data: its own folder
// under .data/, its own free port, removed when the run ends.
import { rmSync } from 'node:fs';
import path from 'node:path';
import { findFreePort, startLocalMariadb, type LocalInstance } from '../../server/db/local-mariadb';
import { migrateWithAccounts } from '../../server/db/privileges';

const ROOT = path.resolve(import.meta.dirname, '../..');

export async function startTestDatabase(label: string): Promise<{ instance: LocalInstance; dir: string; stop(): Promise<void> }> {
  const dir = path.join(ROOT, '.data', `test-${label}-${process.pid}-${Date.now()}`);
  const port = await findFreePort();
  const instance = await startLocalMariadb({ dir, port, database: `whorl_${label}` });
  try {
    // As in production: migrations as the owner, the application account with data privileges only.
    await migrateWithAccounts({ ownerUrl: instance.ownerUrl, appUrl: instance.url });
  } catch (error) {
    await instance.stop();
    throw error;
  }
  return {
    instance,
    dir,
    async stop() {
      await instance.stop();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}
