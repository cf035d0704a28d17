// Many trail entries under one lock of the chain head: the same entries, hashes
// and sequence numbers as calling appendTrail once per entry (see trail.service.ts),
// in a few multi-row INSERTs. A CSV import of thousands of rows would otherwise
// hold the chain head, and so every other writer, for the whole file.
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { TrailEntry } from '../models';
import { hashEntry, type TrailInput } from './trail.service';

const CHUNK = 500;

export async function appendTrailBatch(sequelize: Sequelize, transaction: Transaction, inputs: TrailInput[]): Promise<void> {
  if (inputs.length === 0) return;
  const [head] = await sequelize.query<{ seq: number | string; hash: string }>('SELECT seq, hash FROM trail_head WHERE id = 1 FOR UPDATE', {
    type: QueryTypes.SELECT,
    transaction,
  });
  if (!head) throw new Error('trail_head row is missing: run the migrations');
  let seq = Number(head.seq);
  let prevHash = head.hash;
  const entries = inputs.map((input) => {
    seq += 1;
    const entry = {
      seq,
      // Milliseconds only, as appendTrail: the column keeps three fractional digits.
      at: new Date(Math.floor((input.at ?? new Date()).getTime())),
      userId: input.userId,
      recordType: input.recordType,
      recordId: String(input.recordId),
      event: input.event,
      changes: input.changes ?? null,
      prevHash,
    };
    const hash = hashEntry(entry);
    prevHash = hash;
    return { ...entry, hash };
  });
  for (let start = 0; start < entries.length; start += CHUNK) {
    await TrailEntry.bulkCreate(entries.slice(start, start + CHUNK), { transaction });
  }
  await sequelize.query('UPDATE trail_head SET seq = ?, hash = ? WHERE id = 1', { replacements: [seq, prevHash], transaction });
}
