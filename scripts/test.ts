// npm test: makes sure MariaDB, Chromium and pdftotext are there, then runs the
// whole Vitest suite (unit, API against a private MariaDB, browser against the
// built app). Extra arguments go to Vitest (e.g. npm test -- --project unit).
import { spawn } from 'node:child_process';
import { ensurePrerequisites, TEST_PREREQUISITES } from './lib/prerequisites';

try {
  ensurePrerequisites(TEST_PREREQUISITES);
} catch (error) {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
}

const child = spawn('npx', ['vitest', 'run', ...process.argv.slice(2)], { stdio: 'inherit', env: process.env });
const forward = (signal: NodeJS.Signals) => child.kill(signal);
process.on('SIGINT', forward);
process.on('SIGTERM', forward);
child.on('exit', (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
