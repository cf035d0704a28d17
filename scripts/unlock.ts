// npm run unlock -- EMAIL: lifts the sign-in lock of one account at once (and
// every pause of sign-in from an address), from the server itself, for when no
// administrator can sign in. Uses DATABASE_URL, or the local instance.
import { loadConfig } from '../server/config/env';
import { createSequelize } from '../server/db/sequelize';
import { initModels, User } from '../server/models';
import { clearAccountLock, normaliseEmail } from '../server/auth/sign-in.service';
import { resolveTarget } from './lib/backup-common';
import { configureTrail } from '../server/services/trail-anchors';

async function main() {
  const email = process.argv.slice(2).find((arg) => !arg.startsWith('-'));
  if (!email) {
    console.error('Usage: npm run unlock -- EMAIL');
    process.exit(2);
  }
  const target = process.env.DATABASE_URL
    ? { config: loadConfig({ ...process.env, SESSION_SECRET: process.env.SESSION_SECRET ?? 'x'.repeat(32) }), release: async () => undefined }
    : await resolveTarget(process.env);
  const sequelize = createSequelize({ url: target.config.databaseUrl });
  try {
    // The unlock is a trail entry: chained with the same key as the server's (TRAIL_HMAC_KEY or TRAIL_KEY_FILE).
    configureTrail(target.config);
    initModels(sequelize);
    const user = await User.findOne({ where: { email: normaliseEmail(email) } });
    if (!user) {
      console.error(`No account has the e-mail address ${normaliseEmail(email)}.`);
      process.exitCode = 1;
      return;
    }
    const lifted = await clearAccountLock(sequelize, user.id, null);
    const [, addresses] = (await sequelize.query('DELETE FROM sign_in_address_failures')) as [unknown, { affectedRows?: number } | number];
    const cleared = typeof addresses === 'number' ? addresses : (addresses?.affectedRows ?? 0);
    console.log(
      `${user.displayName} <${user.email}>: ${lifted ? 'sign-in lock lifted and failed attempts forgotten' : 'was not locked'}` +
        `${cleared ? `; ${cleared} paused address${cleared === 1 ? '' : 'es'} cleared` : ''}.` +
        `${user.active ? '' : ' Note: this account is deactivated; an administrator reactivates it.'}`,
    );
  } finally {
    await sequelize.close();
    await target.release();
  }
}

main().catch((error) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
