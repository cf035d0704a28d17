// Builds the client when dist/ is missing or older than any of its sources.
import { existsSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';

const ROOT = path.resolve(import.meta.dirname, '../..');
const SOURCES = ['src', 'shared', 'machines', 'index.html', 'vite.config.ts', 'package.json'];

function newestMtime(target: string): number {
  if (!existsSync(target)) return 0;
  const stat = statSync(target);
  if (!stat.isDirectory()) return stat.mtimeMs;
  let newest = stat.mtimeMs;
  for (const entry of readdirSync(target)) newest = Math.max(newest, newestMtime(path.join(target, entry)));
  return newest;
}

export function clientBuildIsStale(root = ROOT): boolean {
  const built = path.join(root, 'dist', 'index.html');
  if (!existsSync(built)) return true;
  const builtAt = statSync(built).mtimeMs;
  return SOURCES.some((source) => newestMtime(path.join(root, source)) > builtAt);
}

export async function ensureClientBuilt({ quiet = false }: { quiet?: boolean } = {}): Promise<void> {
  if (!clientBuildIsStale()) return;
  if (!quiet) console.log('Building the client (vite build)…');
  const { build } = await import('vite');
  await build({ root: ROOT, logLevel: quiet ? 'error' : 'warn', configFile: path.join(ROOT, 'vite.config.ts') });
}
