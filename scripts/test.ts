// npm test: makes sure MariaDB, Chromium and pdftotext are there, type-checks
// the whole project, then runs the whole Vitest suite (unit, API against a
// private MariaDB, browser against the built app). Extra arguments go to Vitest
// (e.g. npm test -- --project unit), and then the type check is left out.
import { spawn, spawnSync } from 'node:child_process';
import { ensurePrerequisites, TEST_PREREQUISITES } from './lib/prerequisites';

try {
  ensurePrerequisites(TEST_PREREQUISITES);
} catch (error) {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
}

if (process.argv.length <= 2) {
  // Vitest strips types without checking them: a type error would otherwise pass.
  const typecheck = spawnSync('npx', ['tsc', '--noEmit', '-p', '.'], { stdio: 'inherit', env: process.env });
  if (typecheck.status !== 0) {
    console.error('npm test: the type check failed (npx tsc --noEmit); no tests were run');
    process.exit(1);
  }
}

const child = spawn('npx', ['vitest', 'run', ...process.argv.slice(2)], { stdio: 'inherit', env: process.env });
const forward = (signal: NodeJS.Signals) => child.kill(signal);
process.on('SIGINT', forward);
process.on('SIGTERM', forward);
child.on('exit', (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
