// npm run migrate: applies pending migrations as DATABASE_OWNER_URL (the owner
// account), then grants the application account (DATABASE_URL) its table
// privileges. Without DATABASE_OWNER_URL it migrates as DATABASE_URL.
import { loadConfig } from '../server/config/env';
import { migrateWithAccounts } from '../server/db/privileges';

const config = loadConfig({ ...process.env, SESSION_SECRET: process.env.SESSION_SECRET ?? 'x'.repeat(32) });
const applied = await migrateWithAccounts({ ownerUrl: config.databaseOwnerUrl, appUrl: config.databaseUrl });
console.log(applied.length ? `Applied: ${applied.join(', ')}` : 'Nothing to apply.');
if (config.databaseOwnerUrl) console.log('Granted the application account its table privileges.');
