// Ends a person's sessions (password or roles changed, account deactivated).
// connect-session-sequelize keeps express-session's data as JSON text; passport
// stores the user id there as "passport":{"user":ID}, so the match is exact.
import type { Sequelize, Transaction } from 'sequelize';

export async function endSessionsOf(
  sequelize: Sequelize,
  userId: number,
  { exceptSid, transaction }: { exceptSid?: string; transaction?: Transaction } = {},
): Promise<void> {
  await sequelize.query(`DELETE FROM sessions WHERE data LIKE ? AND sid <> ?`, {
    replacements: [`%"passport":{"user":${Number(userId)}}%`, exceptSid ?? ''],
    transaction,
  });
}
