// npm run migrate: applies pending migrations to DATABASE_URL.
import { loadConfig } from '../server/config/env';
import { createSequelize } from '../server/db/sequelize';
import { migrate } from '../server/db/migrator';

const config = loadConfig({ ...process.env, SESSION_SECRET: process.env.SESSION_SECRET ?? 'x'.repeat(32) });
const sequelize = createSequelize({ url: config.databaseUrl });
const applied = await migrate(sequelize);
console.log(applied.length ? `Applied: ${applied.join(', ')}` : 'Nothing to apply.');
await sequelize.close();
