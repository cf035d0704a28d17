// Record numbers such as F-2026-0007: sequential per prefix and year, with no
// gaps and no duplicates under concurrency. The counter row is bumped inside
// the caller's transaction, so it stays locked until commit (concurrent
// creators wait in turn) and a rollback gives the number back.
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';

export type RecordNumberPrefix = 'F' | 'CA';

export async function allocateRecordNumber(
  sequelize: Sequelize,
  transaction: Transaction,
  prefix: RecordNumberPrefix,
  now: Date,
): Promise<string> {
  const year = now.getUTCFullYear();
  // One statement that inserts the year's first number or bumps the counter, taking the row lock either way.
  await sequelize.query(
    'INSERT INTO record_numbers (prefix, year, last) VALUES (?, ?, 1) ON DUPLICATE KEY UPDATE last = last + 1',
    { replacements: [prefix, year], transaction },
  );
  const [row] = await sequelize.query<{ last: number }>('SELECT last FROM record_numbers WHERE prefix = ? AND year = ?', {
    replacements: [prefix, year],
    type: QueryTypes.SELECT,
    transaction,
  });
  return `${prefix}-${year}-${String(row.last).padStart(4, '0')}`;
}
