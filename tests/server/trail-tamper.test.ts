// The trail attacked as a reviewer with database access would: with the owner
// account (or root) one can drop the append-only triggers, cut the tail off and
// move the head back, empty the table, or change an entry and re-chain what
// follows. Each is detected by /api/trail/verify with the first sequence that no
// longer matches. The application's own account cannot do any of it.
import { readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { randomBytes } from 'node:crypto';
import mariadb from 'mariadb';
import { QueryTypes, type Sequelize } from 'sequelize';
import { afterEach, beforeEach, describe, expect, inject, it } from 'vitest';
import { createIsolatedDatabase, createTestContext, signedInAs, type SignedIn, type TestContext } from '../helpers/test-app';
import { createSequelize } from '../../server/db/sequelize';
import { excessPrivileges } from '../../server/db/privileges';
import { keyedEntryHash, unkeyedEntryHash, verifyTrail } from '../../server/services/trail.service';
import { anchorFilePath, writeTrailAnchor } from '../../server/services/trail-anchors';
import { makeCast, findingAwaitingSignoff } from '../helpers/workflow';
import { createScheduler } from '../../server/jobs';
import { trailAnchorJob } from '../../server/jobs/trail-anchor.job';

let context: TestContext;
let owner: Sequelize;
let admin: SignedIn;

interface Row {
  seq: number;
  at: Date;
  user_id: number | null;
  record_type: string;
  record_id: string;
  event: string;
  changes: unknown;
  prev_hash: string;
  hash: string;
}

function ownerUrlOf(appUrl: string): string {
  const url = new URL(inject('databaseOwnerUrl'));
  url.pathname = new URL(appUrl).pathname;
  return url.toString();
}

async function writeEntries(count: number): Promise<void> {
  for (let i = 0; i < count; i += 1) {
    const tag = randomBytes(3).toString('hex').toUpperCase();
    const response = await admin.post('/api/areas').send({ code: `T${tag}`, name: `Tamper area ${tag}` });
    expect(response.status).toBe(201);
  }
}

async function head(): Promise<{ seq: number; hash: string }> {
  const [row] = await owner.query<{ seq: string | number; hash: string }>('SELECT seq, hash FROM trail_head WHERE id = 1', { type: QueryTypes.SELECT });
  return { seq: Number(row.seq), hash: row.hash };
}

async function rows(fromSeq = 1): Promise<Row[]> {
  const found = await owner.query<Row>('SELECT * FROM trail_entries WHERE seq >= ? ORDER BY seq', { replacements: [fromSeq], type: QueryTypes.SELECT });
  return found.map((row) => ({ ...row, seq: Number(row.seq), changes: typeof row.changes === 'string' ? JSON.parse(row.changes) : row.changes }));
}

async function verify() {
  const response = await admin.agent.get('/api/trail/verify');
  expect(response.status).toBe(200);
  return response.body as { ok: boolean; firstBrokenSeq: number | null; caughtBy: string | null; problem: string | null; anchor: { seq: number } | null };
}

/** Changes entry `seq`, then recomputes every hash from it to the end with `hashOf` and moves the head: a re-chained trail. */
async function rewriteAndRechain(seq: number, hashOf: (entry: Parameters<typeof unkeyedEntryHash>[0]) => string): Promise<void> {
  await owner.query('DROP TRIGGER trail_entries_no_update');
  const all = await rows(1);
  let prevHash = all.find((row) => row.seq === seq - 1)?.hash ?? '0'.repeat(64);
  for (const row of all.filter((candidate) => candidate.seq >= seq)) {
    const changes = row.seq === seq ? { code: 'FORGED', name: 'An area that never was' } : row.changes;
    const entry = { seq: row.seq, at: new Date(row.at), userId: row.user_id, recordType: row.record_type, recordId: row.record_id, event: row.event, changes: changes as never, prevHash };
    const hash = hashOf(entry);
    await owner.query('UPDATE trail_entries SET changes = ?, prev_hash = ?, hash = ? WHERE seq = ?', {
      replacements: [JSON.stringify(changes), prevHash, hash, row.seq],
    });
    prevHash = hash;
  }
  await owner.query('UPDATE trail_head SET hash = ? WHERE id = 1', { replacements: [prevHash] });
}

describe('the trail under attack', () => {
  beforeEach(async () => {
    const url = await createIsolatedDatabase('tamper');
    context = createTestContext({ DATABASE_URL: url, TRAIL_ANCHOR_FILE: path.join(inject('databaseDir'), `anchors-${randomBytes(4).toString('hex')}.log`) });
    owner = createSequelize({ url: ownerUrlOf(url), poolMax: 2 });
    admin = await signedInAs(context, ['admin']);
    await writeEntries(10);
  });

  afterEach(async () => {
    await owner.close();
    await context.close();
  });

  describe('when the tail of the trail is cut off and the head moved back', () => {
    it('then verify reports the first missing sequence and the anchor that recorded it', async () => {
      expect(await verify()).toMatchObject({ ok: true, problem: null });
      const anchored = await head();
      await writeTrailAnchor(context.deps.sequelize, 'scheduled');
      const keep = anchored.seq - 3;
      const [last] = await rows(keep);
      await owner.query('DROP TRIGGER trail_entries_no_delete');
      await owner.query('DELETE FROM trail_entries WHERE seq > ?', { replacements: [keep] });
      await owner.query('UPDATE trail_head SET seq = ?, hash = ? WHERE id = 1', { replacements: [keep, last.hash] });

      // The chain alone still adds up: only the anchor outside the database shows what is missing.
      expect((await verifyTrail(context.deps.sequelize, { anchors: false })).ok).toBe(true);
      const result = await verify();
      expect(result).toMatchObject({ ok: false, firstBrokenSeq: keep + 1, caughtBy: 'anchor', anchor: { seq: anchored.seq } });
      expect(result.problem).toMatch(new RegExp(`ends at entry ${keep}.*removed`));
    });
  });

  describe('when the trail is emptied with TRUNCATE and the head reset', () => {
    it('then verify reports an emptied trail from sequence 1, and still does after new entries are written', async () => {
      const anchored = await head();
      await writeTrailAnchor(context.deps.sequelize, 'scheduled');
      await owner.query('TRUNCATE TABLE trail_entries');
      await owner.query("UPDATE trail_head SET seq = 0, hash = REPEAT('0', 64) WHERE id = 1");

      const emptied = await verify();
      expect(emptied).toMatchObject({ ok: false, firstBrokenSeq: 1, caughtBy: 'anchor', anchor: { seq: anchored.seq } });
      expect(emptied.problem).toMatch(/emptied/);

      // The application carries on writing a new chain from 1: the anchor still does not match.
      await writeEntries(2);
      const after = await verify();
      expect(after.ok).toBe(false);
      expect(after.caughtBy).toBe('anchor');
    });
  });

  describe('when the update trigger is dropped, an entry changed and the rest re-chained', () => {
    it('then with the unkeyed hash the first changed sequence is reported', async () => {
      const target = (await head()).seq - 5;
      await rewriteAndRechain(target, unkeyedEntryHash);
      const result = await verify();
      expect(result).toMatchObject({ ok: false, firstBrokenSeq: target, caughtBy: 'chain' });
      expect(result.problem).toMatch(new RegExp(`Entry ${target} does not match`));
    });

    it('then with a guessed key the first changed sequence is reported', async () => {
      const target = (await head()).seq - 4;
      const guessed = Buffer.from('whorl-demo-2026-whorl-demo-2026-whorl', 'utf8');
      await rewriteAndRechain(target, (entry) => keyedEntryHash(guessed, entry));
      expect(await verify()).toMatchObject({ ok: false, firstBrokenSeq: target, caughtBy: 'chain' });
    });

    it('then even with the real key (a leaked key) the anchors catch it, no later than the changed sequence', async () => {
      const target = (await head()).seq - 3;
      await writeTrailAnchor(context.deps.sequelize, 'scheduled');
      const key = Buffer.from('test-trail-key-that-is-long-enough-for-hmac', 'utf8');
      await rewriteAndRechain(target, (entry) => keyedEntryHash(key, entry));
      expect((await verifyTrail(context.deps.sequelize, { anchors: false })).ok).toBe(true);
      const result = await verify();
      expect(result.ok).toBe(false);
      expect(result.caughtBy).toBe('anchor');
      expect(result.firstBrokenSeq).toBeLessThanOrEqual(target);
    });
  });

  describe('when the anchor log itself is edited', () => {
    it('then verify says which line no longer matches', async () => {
      await writeTrailAnchor(context.deps.sequelize, 'scheduled');
      await writeEntries(1);
      await writeTrailAnchor(context.deps.sequelize, 'scheduled');
      const file = anchorFilePath()!;
      const lines = readFileSync(file, 'utf8').trim().split('\n');
      const edited = JSON.parse(lines[0]);
      edited.at = '2020-01-01T00:00:00.000Z';
      writeFileSync(file, [JSON.stringify(edited), ...lines.slice(1)].join('\n') + '\n');
      const result = await verify();
      expect(result).toMatchObject({ ok: false, caughtBy: 'anchor-log' });
      expect(result.problem).toMatch(/Line 1 of the anchor log/);
    });
  });

  describe('when a trail was written before it was keyed', () => {
    it('then its old entries verify with the plain hash, the new ones with the key, and a re-chained old part is caught at the switch', async () => {
      // An upgraded install: the entries so far become "old" ones, hashed without the key.
      const old = await rows(1);
      await owner.query('DROP TRIGGER trail_entries_no_update');
      let prevHash = '0'.repeat(64);
      for (const row of old) {
        const hash = unkeyedEntryHash({ seq: row.seq, at: new Date(row.at), userId: row.user_id, recordType: row.record_type, recordId: row.record_id, event: row.event, changes: row.changes as never, prevHash });
        await owner.query('UPDATE trail_entries SET prev_hash = ?, hash = ? WHERE seq = ?', { replacements: [prevHash, hash, row.seq] });
        prevHash = hash;
      }
      const switchSeq = old[old.length - 1].seq + 1;
      await owner.query('UPDATE trail_head SET hash = ? WHERE id = 1', { replacements: [prevHash] });
      await owner.query('UPDATE trail_settings SET keyed_from_seq = ? WHERE id = 1', { replacements: [switchSeq] });
      await writeEntries(3);
      expect(await verify()).toMatchObject({ ok: true, problem: null });

      // Re-chaining the old part (where the plain hash is accepted) breaks the first keyed entry.
      const keyedHead = await head();
      await owner.query(`CREATE TRIGGER trail_entries_no_update BEFORE UPDATE ON trail_entries FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'trail entries are append-only'`);
      await rewriteAndRechain(2, (entry) => (entry.seq < switchSeq ? unkeyedEntryHash(entry) : keyedEntryHash(Buffer.from('guess'.repeat(8)), entry)));
      expect(keyedHead.seq).toBeGreaterThan(switchSeq);
      expect(await verify()).toMatchObject({ ok: false, firstBrokenSeq: switchSeq, caughtBy: 'chain' });
    });
  });

  describe('when the scheduled anchor job runs', () => {
    it('then the current head is appended to the anchor log with its chained MAC', async () => {
      const now = await head();
      expect(await createScheduler(context.deps, [trailAnchorJob]).tick()).toEqual(['trail-anchor']);
      const lines = readFileSync(anchorFilePath()!, 'utf8').trim().split('\n').map((line) => JSON.parse(line));
      expect(lines[lines.length - 1]).toMatchObject({ reason: 'scheduled', seq: now.seq, hash: now.hash });
      expect(lines[lines.length - 1].mac).toMatch(/^[0-9a-f]{64}$/);
      expect(await verify()).toMatchObject({ ok: true, anchors: { checked: lines.length } });
    });
  });

  describe('when a signature is given', () => {
    it('then the trail head is anchored outside the database', async () => {
      const cast = await makeCast(context);
      const before = readFileSync(anchorFilePath()!, { encoding: 'utf8', flag: 'a+' }).split('\n').filter(Boolean).length;
      await findingAwaitingSignoff(cast);
      const lines = readFileSync(anchorFilePath()!, 'utf8').trim().split('\n').map((line) => JSON.parse(line));
      expect(lines.length).toBeGreaterThan(before);
      const last = lines[lines.length - 1];
      expect(last).toMatchObject({ reason: 'signature' });
      const [row] = await owner.query<{ hash: string }>('SELECT hash FROM trail_entries WHERE seq = ?', { replacements: [last.seq], type: QueryTypes.SELECT });
      expect(row.hash).toBe(last.hash);
    });
  });
});

describe('the application database account', () => {
  const denied = /denied/i;

  it('when it tries to drop a trigger, truncate, update or delete the trail, alter or create a table, then MariaDB refuses for lack of privilege', async () => {
    const url = new URL(inject('databaseUrl'));
    const connection = await mariadb.createConnection({
      host: url.hostname,
      port: Number(url.port),
      user: decodeURIComponent(url.username),
      password: decodeURIComponent(url.password),
      database: url.pathname.slice(1),
    });
    try {
      const attempts = [
        'DROP TRIGGER trail_entries_no_update',
        'DROP TRIGGER trail_entries_no_delete',
        'TRUNCATE TABLE trail_entries',
        'UPDATE trail_entries SET event = event WHERE seq = 1',
        'DELETE FROM trail_entries WHERE seq = 1',
        'UPDATE trail_settings SET keyed_from_seq = 1',
        'ALTER TABLE users ADD COLUMN sneaky INT',
        'ALTER TABLE trail_entries DROP PRIMARY KEY',
        'DROP TABLE areas',
        'CREATE TABLE sneaky (id INT)',
        `CREATE TRIGGER sneaky BEFORE INSERT ON trail_entries FOR EACH ROW SET NEW.event = NEW.event`,
      ];
      for (const sql of attempts) {
        const error = await connection.query(sql).then(
          () => null,
          (caught: { errno?: number; message: string }) => caught,
        );
        expect(error, sql).not.toBeNull();
        // 1142: command denied on a table; 1044: access denied to the database.
        expect([1142, 1044], `${sql}: ${error!.message}`).toContain(error!.errno);
        expect(error!.message, sql).toMatch(denied);
      }
      // What it needs still works: append to the trail and move the head inside a transaction.
      await connection.beginTransaction();
      const [current] = (await connection.query('SELECT seq, hash FROM trail_head WHERE id = 1 FOR UPDATE')) as { seq: number }[];
      expect(Number(current.seq)).toBeGreaterThanOrEqual(0);
      await connection.query('UPDATE trail_head SET seq = seq WHERE id = 1');
      await connection.rollback();
    } finally {
      await connection.end();
    }
    const app = createSequelize({ url: inject('databaseUrl'), poolMax: 1 });
    try {
      expect(await excessPrivileges(app)).toEqual([]);
    } finally {
      await app.close();
    }
  });
});
