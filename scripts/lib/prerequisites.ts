// What the test suite needs from Debian: the MariaDB server, Chromium for the
// browser tests, and pdftotext for checking PDF reports. Installed when missing
// and we run as root; otherwise the exact command is printed and we stop:
// browser tests are never skipped silently.
import { existsSync } from 'node:fs';
import { aptInstall, findMariadbServer } from '../../server/db/local-mariadb';

interface Prerequisite {
  name: string;
  debianPackage: string;
  present(): boolean;
}

export const TEST_PREREQUISITES: Prerequisite[] = [
  { name: 'MariaDB server', debianPackage: 'mariadb-server', present: () => Boolean(findMariadbServer()) },
  { name: 'Chromium', debianPackage: 'chromium', present: () => existsSync(process.env.CHROMIUM_PATH ?? '/usr/bin/chromium') },
  { name: 'pdftotext (poppler-utils)', debianPackage: 'poppler-utils', present: () => existsSync('/usr/bin/pdftotext') },
];

export function ensurePrerequisites(prerequisites: Prerequisite[]): void {
  const missing = prerequisites.filter((item) => !item.present());
  if (missing.length === 0) return;
  const packages = missing.map((item) => item.debianPackage);
  const command = `apt-get update && apt-get install -y ${packages.join(' ')}`;
  if (process.getuid?.() !== 0) {
    throw new Error(`Missing: ${missing.map((item) => item.name).join(', ')}. Install with:\n  sudo ${command}`);
  }
  console.log(`Installing ${packages.join(', ')} from Debian…`);
  aptInstall(packages);
  const still = missing.filter((item) => !item.present());
  if (still.length) throw new Error(`Still missing after apt-get: ${still.map((item) => item.name).join(', ')}`);
}
