// Seeds a benchmark database with a realistic volume through the mariadb driver's
// bulk protocol (conn.batch: one round trip per few thousand rows). Record
// snapshots come from the real machines (pure transitions), the trail is a valid
// hash chain computed with the server's own hashEntry, technique verdicts come
// from the checklist engine. Ids are given explicitly: bulk inserts may leave
// gaps in auto-increment values, and rows refer to each other by id.
// Tables that do not exist yet are skipped and reported.
import mariadb from 'mariadb';
import { createHash } from 'node:crypto';
import path from 'node:path';
import { hashEntry } from '../../server/services/trail.service';
import { loadTrailKey, setTrailKey } from '../../server/services/trail-key';
import { hashPassword } from '../../server/auth/passwords';
import { recordMachines, createInitialSnapshot, applyEvent, persistSnapshot } from '../../machines';
import { DEMO_TECHNIQUES } from '../../shared/domain/demo-techniques';
import { evaluateParsedTechnique } from '../../shared/domain/checklist';
import type { Role } from '../../shared/roles';

export const VOLUME = { findings: 50_000, actions: 50_000, techniques: 2_000, trail: 300_000, evidence: 20_000, audits: 1_000, inspections: 100_000 };
/** Inspections made to the one technique the extent and impact benchmark raises its finding against. */
export const IMPACT_INSPECTIONS = 5_000;
export const BENCH_PASSWORD = 'benchmark password 2026';
const BATCH = 5_000;
const YEAR = 2026;

export interface SeedResult {
  seconds: number;
  counts: Record<string, number>;
  skipped: string[];
  users: { admin: string; quality: string; owner: string; auditor: string };
  /** Corrective actions owned by the benchmark owner in in_progress, for the extension round trip. */
  ownerActionIds: number[];
  findingIds: number[];
  /** An approved technique whose checklist fails a rule: the extent and impact benchmark raises its finding here. */
  impactTechnique: { id: number; code: string } | null;
  /** Another approved technique, with no inspections seeded: the CSV import goes to it. */
  importTechnique: { id: number; code: string } | null;
  /** Technicians' e-mail addresses, for the inspector column of an import. */
  technicianEmails: string[];
}

const utc = (date: Date) => date.toISOString().replace('T', ' ').replace('Z', '');
const day = (date: Date) => date.toISOString().slice(0, 10);

async function insertBatched(conn: mariadb.Connection, table: string, columns: string[], rows: unknown[][]): Promise<void> {
  const sql = `INSERT INTO ${table} (${columns.join(', ')}) VALUES (${columns.map(() => '?').join(', ')})`;
  for (let start = 0; start < rows.length; start += BATCH) {
    await conn.batch(sql, rows.slice(start, start + BATCH));
  }
}

/** A machine snapshot reached by real transitions, stored the way the server stores it. */
function snapshotAfter(kind: 'finding' | 'action', events: object[], input?: object) {
  const { machine } = recordMachines[kind];
  let { snapshot } = createInitialSnapshot(machine as never, input as never) as { snapshot: unknown };
  for (const event of events) {
    const applied = applyEvent(machine as never, snapshot as never, event as never) as { snapshot: unknown; changed: boolean };
    if (!applied.changed) throw new Error(`seed: ${kind} refused ${JSON.stringify(event)}`);
    snapshot = applied.snapshot;
  }
  const persisted = persistSnapshot(machine as never, snapshot as never) as { value: string; context: Record<string, unknown> };
  return { state: persisted.value, context: persisted.context, json: JSON.stringify(persisted) };
}

export async function seedBenchDatabase(url: string, log: (line: string) => void = console.log): Promise<SeedResult> {
  const started = performance.now();
  // The key the bench's app server reads (the default key file under the project's .data/).
  setTrailKey(loadTrailKey({ trail: { keyFile: path.resolve(import.meta.dirname, '../../.data/trail-key'), anchorFile: '' } }));
  const parsed = new URL(url);
  const conn = await mariadb.createConnection({
    host: parsed.hostname,
    port: Number(parsed.port),
    user: decodeURIComponent(parsed.username),
    password: decodeURIComponent(parsed.password),
    database: parsed.pathname.slice(1),
    // Bulk inserts of a few thousand rows of JSON: allow large packets and skip per-row checks while loading.
    maxAllowedPacket: 64 * 1024 * 1024,
  });
  const counts: Record<string, number> = {};
  const skipped: string[] = [];
  const tables = new Set(
    ((await conn.query('SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE()')) as { name: string }[]).map(
      (row) => row.name,
    ),
  );
  const has = (table: string) => {
    if (tables.has(table)) return true;
    skipped.push(table);
    return false;
  };
  await conn.query('SET foreign_key_checks = 0, unique_checks = 0');
  const now = new Date();
  const ts = utc(now);

  // People and areas.
  const passwordHash = await hashPassword(BENCH_PASSWORD);
  await conn.batch('INSERT INTO areas (id, code, name, created_at, updated_at) VALUES (?, ?, ?, ?, ?)', [
    [1, 'WBS', 'Wheel and Brake Shop', ts, ts],
    [2, 'STR', 'Structures Bay', ts, ts],
    [3, 'RCV', 'Receiving Inspection', ts, ts],
  ]);
  const people: { email: string; roles: Role[]; areaId: number | null }[] = [
    { email: 'admin@bench.example', roles: ['admin'], areaId: null },
    { email: 'quality@bench.example', roles: ['quality_manager'], areaId: null },
    { email: 'owner@bench.example', roles: ['level3'], areaId: 1 },
    { email: 'auditor@bench.example', roles: ['auditor'], areaId: null },
  ];
  for (let i = 0; i < 40; i += 1) {
    const roles: Role[] = [(['auditor', 'level3', 'technician', 'quality_manager'] as Role[])[i % 4]];
    people.push({ email: `person${i}@bench.example`, roles, areaId: (i % 3) + 1 });
  }
  await insertBatched(
    conn,
    'users',
    ['id', 'email', 'display_name', 'password_hash', 'area_id', 'active', 'failed_sign_ins', 'mail_digest', 'version', 'created_at', 'updated_at'],
    people.map((person, i) => [i + 1, person.email, `Bench Person ${i}`, passwordHash, person.areaId, 1, 0, 0, 0, ts, ts]),
  );
  await insertBatched(
    conn,
    'role_assignments',
    ['user_id', 'role', 'created_at', 'updated_at'],
    people.flatMap((person, i) => person.roles.map((role) => [i + 1, role, ts, ts])),
  );
  const userCount = people.length;
  const auditorIds = people.flatMap((person, i) => (person.roles.includes('auditor') ? [i + 1] : []));
  const ownerIds = people.flatMap((person, i) => (person.roles.includes('level3') || person.roles.includes('technician') ? [i + 1] : []));
  counts.users = userCount;

  // Techniques: demo techniques varied by code, each with one revision whose verdict the engine computed.
  // Approved a year ago, so that a year of inspections lies within each revision's time in force.
  const approvedTs = utc(new Date(now.getTime() - 365 * 86_400_000));
  const approvedTechniqueIds: number[] = [];
  let impactTechnique: SeedResult['impactTechnique'] = null;
  let importTechnique: SeedResult['importTechnique'] = null;
  if (has('techniques') && has('technique_revisions')) {
    const techniques: unknown[][] = [];
    const revisions: unknown[][] = [];
    for (let i = 1; i <= VOLUME.techniques; i += 1) {
      const base = DEMO_TECHNIQUES[i % DEMO_TECHNIQUES.length];
      const content = { ...base, code: `BT-${String(i).padStart(5, '0')}`, revision: 'A' };
      const output = evaluateParsedTechnique(content);
      const failed = [...new Set(output.results.filter((result) => result.status === 'fail').map((result) => result.rule))];
      const approved = i % 5 !== 0;
      if (approved) {
        approvedTechniqueIds.push(i);
        if (!impactTechnique && failed.length) impactTechnique = { id: i, code: content.code };
        else if (!importTechnique) importTechnique = { id: i, code: content.code };
      }
      techniques.push([i, content.code, content.title ?? `Technique ${i}`, (i % 3) + 1, 3, ts, ts]);
      revisions.push([i, i, 1, 'A', approved ? 'approved' : 'draft', JSON.stringify(content), output.verdict, JSON.stringify(failed), 3, 3, approved ? 2 : null, approved ? approvedTs : null, null, 0, ts, ts]);
    }
    await insertBatched(conn, 'techniques', ['id', 'code', 'title', 'area_id', 'created_by_id', 'created_at', 'updated_at'], techniques);
    await insertBatched(
      conn,
      'technique_revisions',
      ['id', 'technique_id', 'seq', 'revision', 'state', 'content', 'verdict', 'failed_rules', 'created_by_id', 'updated_by_id', 'approved_by_id', 'approved_at', 'superseded_at', 'version', 'created_at', 'updated_at'],
      revisions,
    );
    counts.techniques = VOLUME.techniques;
  }

  // Audits (fieldwork), findings (one per audit result, spread over states) and one corrective action per finding.
  const findingIds: number[] = [];
  const ownerActionIds: number[] = [];
  if (has('audits') && has('findings') && has('corrective_actions')) {
    const auditSnapshot = JSON.stringify(
      persistSnapshot(recordMachines.audit.machine, applyEvent(recordMachines.audit.machine, createInitialSnapshot(recordMachines.audit.machine).snapshot, { type: 'START_FIELDWORK' }).snapshot),
    );
    const audits: unknown[][] = [];
    for (let i = 1; i <= VOLUME.audits; i += 1) {
      audits.push([i, `Audit ${i} of ET techniques`, 'Written practice and customer specification', (i % 3) + 1, auditorIds[i % auditorIds.length], '2026-01-10', '2026-01-20', '[]', 'fieldwork', auditSnapshot, recordMachines.audit.version, 0, 4, ts, ts]);
    }
    await insertBatched(
      conn,
      'audits',
      ['id', 'title', 'criteria', 'area_id', 'lead_auditor_id', 'planned_start', 'planned_end', 'scope', 'state', 'snapshot', 'machine_version', 'version', 'created_by_id', 'created_at', 'updated_at'],
      audits,
    );
    counts.audits = VOLUME.audits;

    const dueDate = day(new Date(now.getTime() + 60 * 86_400_000));
    const findingTemplates = [
      snapshotAfter('finding', [{ type: 'SUBMIT' }, { type: 'CLASSIFY', class: 'minor' }]),
      snapshotAfter('finding', [{ type: 'SUBMIT' }, { type: 'CLASSIFY', class: 'major' }, { type: 'RECORD_CONTAINMENT', description: 'Parts quarantined', facts: { undecidedInspectionCount: 0 } }]),
      snapshotAfter('finding', [{ type: 'SUBMIT' }, { type: 'CLASSIFY', class: 'minor' }, { type: 'ACTION_VERIFIED' }]),
    ];
    const actionTemplates = [
      snapshotAfter('action', [], { dueDate }),
      snapshotAfter('action', [{ type: 'START' }], { dueDate }),
      snapshotAfter('action', [{ type: 'START' }, { type: 'SUBMIT_PLAN', method: 'five_whys', rootCause: 'Edge not controlled', plan: [{ description: 'Add an edge guide', dueDate }] }, { type: 'APPROVE_PLAN' }], { dueDate }),
    ];
    const findings: unknown[][] = [];
    const actions: unknown[][] = [];
    const rules = ['orientation-coverage', 'edge-effect', 'penetration-depth', 'fill-factor', 'center-effect'];
    for (let i = 1; i <= VOLUME.findings; i += 1) {
      const template = findingTemplates[i % findingTemplates.length];
      const created = utc(new Date(now.getTime() - (VOLUME.findings - i) * 60_000));
      const cls = (template.context.class as string | null) ?? null;
      findings.push([
        i, `F-${YEAR}-${String(i).padStart(4, '0')}`, ((i - 1) % VOLUME.audits) + 1, (i % VOLUME.techniques) + 1, `BT-${String((i % VOLUME.techniques) + 1).padStart(5, '0')}`,
        `Checklist rule failed on technique ${i % VOLUME.techniques}`, rules[i % rules.length], 'The technique must cover every expected flaw orientation',
        'Checklist output of the audit', cls, template.context.containmentDescription ?? null, dueDate,
        auditorIds[i % auditorIds.length], (i % 3) + 1, template.state, template.json, recordMachines.finding.version, 3, created, created,
      ]);
      findingIds.push(i);
      // The benchmark owner owns the first actions; those in in_progress carry the extension round trip.
      const ownerId = i <= 300 ? 3 : ownerIds[i % ownerIds.length];
      const actionTemplate = i <= 300 ? actionTemplates[2] : actionTemplates[i % actionTemplates.length];
      if (i <= 300) ownerActionIds.push(i);
      const ctx = actionTemplate.context;
      actions.push([
        i, `CA-${YEAR}-${String(i).padStart(4, '0')}`, i, ownerId, dueDate, null, ctx.method ?? null, ctx.rootCause ?? null, JSON.stringify(ctx.plan ?? []),
        2, actionTemplate.state, actionTemplate.json, recordMachines.action.version, 1, created, created,
      ]);
    }
    await insertBatched(
      conn,
      'findings',
      ['id', 'number', 'audit_id', 'technique_id', 'technique_code', 'title', 'rule', 'requirement', 'objective_evidence', 'class', 'containment', 'due_date', 'author_id', 'area_id', 'state', 'snapshot', 'machine_version', 'version', 'created_at', 'updated_at'],
      findings,
    );
    await insertBatched(
      conn,
      'corrective_actions',
      ['id', 'number', 'finding_id', 'owner_id', 'due_date', 'pending_extension', 'method', 'root_cause', 'plan', 'created_by_id', 'state', 'snapshot', 'machine_version', 'version', 'created_at', 'updated_at'],
      actions,
    );
    if (tables.has('record_numbers')) {
      await conn.batch('INSERT INTO record_numbers (prefix, year, last) VALUES (?, ?, ?)', [
        ['F', YEAR, VOLUME.findings],
        ['CA', YEAR, VOLUME.actions],
      ]);
    }
    counts.findings = VOLUME.findings;
    counts.corrective_actions = VOLUME.actions;
  }

  // Inspections: a year of work spread over the approved techniques (revision id = technique id above),
  // IMPACT_INSPECTIONS of them made to the technique the impact benchmark raises its finding against.
  const technicianIds = people.flatMap((person, i) => (person.roles.includes('technician') ? [i + 1] : []));
  if (has('inspections') && impactTechnique && importTechnique) {
    const spread = approvedTechniqueIds.filter((id) => id !== impactTechnique!.id && id !== importTechnique!.id);
    const customers = ['Bench Customer North', 'Bench Customer South', 'Bench Customer East', 'Bench Customer West', 'Bench Customer Harbour'];
    const results = ['accept', 'accept', 'accept', 'accept', 'accept', 'accept', 'accept', 'accept', 'reject', 'indication_recorded'];
    const rows: unknown[][] = [];
    for (let k = 1; k <= VOLUME.inspections; k += 1) {
      const techniqueId = k <= IMPACT_INSPECTIONS ? impactTechnique.id : spread[k % spread.length];
      const performedOn = day(new Date(now.getTime() - ((k % 360) + 1) * 86_400_000));
      rows.push([
        k, techniqueId, techniqueId, performedOn, `PN-${String(k % 40).padStart(3, '0')}`, `SN-${k}`, `WO-${Math.floor(k / 8)}`, customers[k % customers.length],
        technicianIds[k % technicianIds.length], results[k % results.length], null, null, null, null, 2, 0, ts, ts,
      ]);
    }
    await insertBatched(
      conn,
      'inspections',
      ['id', 'technique_revision_id', 'technique_id', 'performed_on', 'part_number', 'serial_number', 'work_order', 'customer', 'inspector_id', 'result', 'instrument_id', 'probe_id', 'reference_standard_id', 'notes', 'created_by_id', 'version', 'created_at', 'updated_at'],
      rows,
    );
    counts.inspections = VOLUME.inspections;
  }

  // Evidence rows on the actions (metadata only: the benchmark reads lists, not file bytes).
  if (has('evidence_files')) {
    const rows: unknown[][] = [];
    for (let i = 1; i <= VOLUME.evidence; i += 1) {
      const sha = createHash('sha256').update(`evidence ${i}`).digest('hex');
      rows.push([i, 'action', (i % VOLUME.actions) + 1, `eddy-current-report-${i}.pdf`, 'application/pdf', 40_000 + i, sha, `sha256/${sha.slice(0, 2)}/${sha.slice(2, 4)}/${sha}`, ts, 3, 0, ts, ts]);
    }
    await insertBatched(
      conn,
      'evidence_files',
      ['id', 'record_type', 'record_id', 'original_name', 'media_type', 'size_bytes', 'sha256', 'storage_key', 'stored_at', 'uploaded_by_id', 'version', 'created_at', 'updated_at'],
      rows,
    );
    counts.evidence_files = VOLUME.evidence;
  }

  // The trail: one valid chain of 300,000 entries, oldest first, ending at trail_head.
  {
    let prevHash = '0'.repeat(64);
    const kinds = ['finding', 'action', 'technique', 'evidence', 'user'];
    const events = ['RAISED', 'SUBMIT', 'CLASSIFY', 'START', 'EVIDENCE_ADDED'];
    const startAt = now.getTime() - VOLUME.trail * 1_000;
    let batch: unknown[][] = [];
    const sql = 'INSERT INTO trail_entries (seq, at, user_id, record_type, record_id, event, changes, prev_hash, hash) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?)';
    for (let seq = 1; seq <= VOLUME.trail; seq += 1) {
      const entry = {
        seq,
        at: new Date(startAt + seq * 1_000),
        userId: (seq % userCount) + 1,
        recordType: kinds[seq % kinds.length],
        recordId: String((seq % VOLUME.findings) + 1),
        event: events[seq % events.length],
        changes: { state: { before: 'raised', after: 'in_review' }, note: `change ${seq}` },
        prevHash,
      };
      const hash = hashEntry(entry);
      batch.push([seq, utc(entry.at), entry.userId, entry.recordType, entry.recordId, entry.event, JSON.stringify(entry.changes), prevHash, hash]);
      prevHash = hash;
      if (batch.length === BATCH) {
        await conn.batch(sql, batch);
        batch = [];
      }
    }
    if (batch.length) await conn.batch(sql, batch);
    await conn.query('UPDATE trail_head SET seq = ?, hash = ? WHERE id = 1', [VOLUME.trail, prevHash]);
    counts.trail_entries = VOLUME.trail;
  }

  await conn.query('SET foreign_key_checks = 1, unique_checks = 1');
  await conn.query('ANALYZE TABLE findings, corrective_actions, trail_entries, inspections').catch(() => undefined);
  await conn.end();
  const seconds = (performance.now() - started) / 1000;
  log(`seeded in ${seconds.toFixed(1)} s: ${Object.entries(counts).map(([k, v]) => `${k} ${v}`).join(', ')}${skipped.length ? `; tables not there yet: ${skipped.join(', ')}` : ''}`);
  return {
    seconds,
    counts,
    skipped,
    users: { admin: 'admin@bench.example', quality: 'quality@bench.example', owner: 'owner@bench.example', auditor: 'auditor@bench.example' },
    ownerActionIds,
    findingIds,
    impactTechnique,
    importTechnique,
    technicianEmails: people.flatMap((person) => (person.roles.includes('technician') ? [person.email] : [])),
  };
}
