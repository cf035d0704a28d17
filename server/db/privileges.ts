// Least privilege for the application's database account. Migrations run as the
// owner account; after each run the owner grants the application account what
// it needs, table by table (MariaDB has no partial revokes, so a database-wide
// grant could not leave the trail out). The application may only read and
// append the trail, read its settings and the migration log, and never holds
// TRIGGER, DROP, ALTER, CREATE or any other DDL privilege: dropping the
// append-only triggers or emptying the trail (TRUNCATE needs DROP) is refused.
import mariadb from 'mariadb';
import { QueryTypes, type Sequelize } from 'sequelize';
import { createSequelize } from './sequelize';
import { migrate } from './migrator';

const DATA = ['SELECT', 'INSERT', 'UPDATE', 'DELETE'];

/** Tables whose privileges differ from plain data tables. */
export const TABLE_PRIVILEGES: Record<string, string[]> = {
  trail_entries: ['SELECT', 'INSERT'],
  trail_settings: ['SELECT'],
  schema_migrations: ['SELECT'],
  // The application moves the head with every entry; the keyed chain and the anchors catch a head moved by anyone else.
  trail_head: ['SELECT', 'UPDATE'],
};

const quoteName = (name: string) => `\`${name.replace(/`/g, '``')}\``;
const quoteString = (value: string) => `'${value.replace(/\\/g, '\\\\').replace(/'/g, "\\'")}'`;

/**
 * `'user'@'host'` of the account a URL signs in as (the host part is the
 * server's match, e.g. '127.0.0.1' or '%'). Asked without selecting the
 * database: before its first grant the account may not use it.
 */
export async function accountOf(url: string): Promise<string> {
  const parsed = new URL(url);
  const connection = await mariadb.createConnection({
    host: parsed.hostname,
    port: Number(parsed.port || 3306),
    user: decodeURIComponent(parsed.username),
    password: decodeURIComponent(parsed.password),
    connectTimeout: 5_000,
  });
  try {
    const [row] = (await connection.query('SELECT CURRENT_USER() AS account')) as { account: string }[];
    const at = row.account.lastIndexOf('@');
    return `${quoteString(row.account.slice(0, at))}@${quoteString(row.account.slice(at + 1))}`;
  } finally {
    await connection.end();
  }
}

/** Grants the application account its privileges on every table that exists now (run as the owner). */
export async function grantApplicationPrivileges(owner: Sequelize, appAccount: string): Promise<void> {
  const tables = await owner.query<{ name: string }>(
    "SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE() AND table_type = 'BASE TABLE'",
    { type: QueryTypes.SELECT },
  );
  for (const { name } of tables) {
    const privileges = TABLE_PRIVILEGES[name] ?? DATA;
    await owner.query(`GRANT ${privileges.join(', ')} ON ${quoteName(name)} TO ${appAccount}`);
  }
}

/**
 * Pending migrations as the owner, then the application account's grants.
 * Without a separate owner (ownerUrl equal to appUrl) it only migrates: an
 * external server configured with a single account keeps working, and the
 * start-up check below says what it lacks.
 */
export async function migrateWithAccounts({ ownerUrl, appUrl }: { ownerUrl?: string; appUrl: string }): Promise<string[]> {
  // Long waits allowed: a migration may rebuild a large table.
  const owner = createSequelize({ url: ownerUrl ?? appUrl, poolMax: 2, acquireTimeoutMs: 30_000, queryTimeoutMs: 600_000 });
  try {
    const applied = await migrate(owner);
    if (ownerUrl && ownerUrl !== appUrl) await grantApplicationPrivileges(owner, await accountOf(appUrl));
    return applied;
  } finally {
    await owner.close();
  }
}

const FORBIDDEN = /\b(ALL PRIVILEGES|DROP|ALTER|TRIGGER|CREATE|INDEX|SUPER|GRANT OPTION)\b/;

/** Privileges of the signed-in account that the application must not hold, as SHOW GRANTS lines (empty when none). */
export async function excessPrivileges(app: Sequelize): Promise<string[]> {
  const rows = await app.query<Record<string, string>>('SHOW GRANTS', { type: QueryTypes.SELECT });
  const lines = rows.map((row) => Object.values(row)[0]);
  const excess = lines.filter((line) => FORBIDDEN.test(line.replace(/ IDENTIFIED BY .*/, '')));
  const trail = lines.filter((line) => /`trail_entries`/.test(line) && /\b(UPDATE|DELETE)\b/.test(line));
  const wide = lines.filter((line) => /ON `[^`]+`\.\*/.test(line) && /\b(UPDATE|DELETE)\b/.test(line));
  return [...new Set([...excess, ...trail, ...wide])];
}
