import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { parse } from 'csv-parse/sync';
import { QueryTypes } from 'sequelize';
import { Certification, TrailEntry } from '../../server/models';
import { buildRegisterFacts } from '../../server/services/technique-links.service';
import { evaluateParsedTechnique, parseTechnique } from '../../shared/domain/checklist';
import { DEMO_TECHNIQUES } from '../../shared/domain/demo-techniques';
import { createTestContext, makeUser, signIn, signedInAs, type TestContext } from '../helpers/test-app';

let context: TestContext;
beforeAll(() => {
  context = createTestContext();
});
afterAll(() => context.close());

let serial = 0;
const unique = (prefix: string) => `${prefix}-${Date.now().toString(36)}-${(serial += 1)}`;

const certificationBody = (userId: number, overrides: Record<string, unknown> = {}) => ({
  userId,
  method: 'ET',
  level: 2,
  scheme: 'EN 4179',
  certificateNumber: unique('ET'),
  issuedOn: '2024-03-01',
  expiresOn: '2029-02-28',
  nearVisionExamOn: '2026-06-15',
  colourVisionCheckedOn: '2024-03-01',
  sectors: ['aerospace'],
  ...overrides,
});

describe('personnel certifications', () => {
  it('when signed out, then the register is 401; when a technician writes, then 403 and nothing is stored', async () => {
    expect((await request(context.app).get('/api/certifications')).status).toBe(401);
    const technician = await signedInAs(context, ['technician']);
    expect((await technician.agent.get('/api/certifications')).status).toBe(200);
    const before = await Certification.count();
    const refused = await technician.post('/api/certifications').send(certificationBody(technician.user.id));
    expect(refused.status).toBe(403);
    expect(await Certification.count()).toBe(before);
  });

  it('when the body is invalid, then 400 names the field', async () => {
    const quality = await signedInAs(context, ['quality_manager']);
    const person = await makeUser({ roles: ['technician'] });
    const badLevel = await quality.post('/api/certifications').send(certificationBody(person.id, { level: 4 }));
    expect(badLevel.status).toBe(400);
    expect(badLevel.body.error.details).toContainEqual(expect.objectContaining({ path: 'level', message: 'level must be 1, 2 or 3' }));
    const backwards = await quality.post('/api/certifications').send(certificationBody(person.id, { expiresOn: '2024-01-01' }));
    expect(backwards.status).toBe(400);
    expect(backwards.body.error.details).toContainEqual(expect.objectContaining({ path: 'expiresOn', message: 'the expiry date must be after the issue date' }));
    const unknownField = await quality.post('/api/certifications').send({ ...certificationBody(person.id), grade: 'A' });
    expect(unknownField.status).toBe(400);
    const noPerson = await quality.post('/api/certifications').send(certificationBody(99_999_999));
    expect(noPerson.status).toBe(400);
    expect(noPerson.body.error.details).toContainEqual(expect.objectContaining({ path: 'userId', message: 'no such person' }));
  });

  it('when a quality manager records and edits a certificate, then both are stored, versioned and on the trail', async () => {
    const quality = await signedInAs(context, ['quality_manager']);
    const person = await makeUser({ roles: ['technician'], displayName: 'Ødegård Ñúñez' });
    const created = await quality.post('/api/certifications').send(certificationBody(person.id));
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ personName: 'Ødegård Ñúñez', method: 'ET', level: 2, sectors: ['aerospace'] });
    const edited = await quality.patch(`/api/certifications/${created.body.id}`).send({ version: created.body.version, level: 3 });
    expect(edited.status).toBe(200);
    expect(edited.body.level).toBe(3);
    const stale = await quality.patch(`/api/certifications/${created.body.id}`).send({ version: created.body.version, level: 1 });
    expect(stale.status).toBe(409);
    expect((await quality.patch('/api/certifications/99999999').send({ version: 0, level: 1 })).status).toBe(404);
    const trail = await TrailEntry.findAll({ where: { recordType: 'certification', recordId: String(created.body.id) }, order: [['seq', 'ASC']] });
    expect(trail.map((entry) => entry.event)).toEqual(['CERTIFICATION_CREATED', 'CERTIFICATION_UPDATED']);
    expect(trail[1].changes).toMatchObject({ level: { before: 2, after: 3 } });
  });

  // The boundaries of docs/domain.md rule 8 as Whorl reads them: a certificate is valid through its expiry day;
  // warnings at 60 and 30 days (Whorl product defaults); a near-vision exam counts for 12 calendar months
  // (ISO 9712, annual near-vision check; the policy setting nearVisionExamMonths).
  it('when the clock moves across the 60-day, 30-day and expiry boundaries, then the flags change on exactly those days', async () => {
    const quality = await signedInAs(context, ['quality_manager']);
    const person = await makeUser({ roles: ['technician'] });
    const created = await quality.post('/api/certifications').send(
      certificationBody(person.id, { issuedOn: '2022-03-01', expiresOn: '2027-03-01', nearVisionExamOn: '2026-02-28' }),
    );
    expect(created.status).toBe(201);
    const at = async (day: string) => {
      context.clock.set(new Date(`${day}T12:00:00Z`));
      const response = await quality.agent.get(`/api/certifications/${created.body.id}`);
      return response.body as { certificate: { status: string; daysLeft: number }; vision: { status: string; dueOn: string } };
    };
    try {
      expect((await at('2026-12-30')).certificate).toEqual({ status: 'valid', daysLeft: 61 });
      expect((await at('2026-12-31')).certificate).toEqual({ status: 'expires-60', daysLeft: 60 });
      expect((await at('2027-01-29')).certificate).toEqual({ status: 'expires-60', daysLeft: 31 });
      expect((await at('2027-01-30')).certificate).toEqual({ status: 'expires-30', daysLeft: 30 });
      expect((await at('2027-03-01')).certificate).toEqual({ status: 'expires-30', daysLeft: 0 });
      expect((await at('2027-03-02')).certificate).toEqual({ status: 'expired', daysLeft: -1 });
      // Vision exam on 2026-02-28: counts through 2027-02-28, overdue from 2027-03-01.
      expect((await at('2027-02-28')).vision).toMatchObject({ status: 'due-soon', dueOn: '2027-02-28' });
      expect((await at('2027-03-01')).vision).toMatchObject({ status: 'overdue', dueOn: '2027-02-28' });
      expect((await at('2027-01-28')).vision).toMatchObject({ status: 'ok' });
      expect((await at('2027-01-29')).vision).toMatchObject({ status: 'due-soon' });
    } finally {
      context.clock.set(null);
    }
  });

  it('when the list is filtered by flag, then SQL returns exactly the flagged certificates', async () => {
    const quality = await signedInAs(context, ['quality_manager']);
    const person = await makeUser({ roles: ['technician'] });
    const make = (overrides: Record<string, unknown>) => quality.post('/api/certifications').send(certificationBody(person.id, overrides));
    const expired = await make({ issuedOn: '2020-01-01', expiresOn: '2026-11-30' });
    const expiring = await make({ issuedOn: '2022-01-01', expiresOn: '2027-01-30' });
    const visionOld = await make({ nearVisionExamOn: '2025-11-30' });
    const fine = await make({ nearVisionExamOn: '2026-10-01' });
    context.clock.set(new Date('2026-12-01T08:00:00Z'));
    try {
      const ids = async (flag: string) =>
        ((await quality.agent.get('/api/certifications').query({ userId: person.id, flag })).body.items as { id: number }[]).map((i) => i.id).sort();
      expect(await ids('expired')).toEqual([expired.body.id]);
      expect(await ids('expiring')).toEqual([expiring.body.id]);
      expect(await ids('vision-overdue')).toEqual([visionOld.body.id]);
      expect(await ids('attention')).toEqual([expired.body.id, expiring.body.id, visionOld.body.id].sort());
      const all = await quality.agent.get('/api/certifications').query({ userId: person.id, sort: '-expiresOn', pageSize: 2 });
      expect(all.body.total).toBe(4);
      expect(all.body.items).toHaveLength(2);
      // Sorted by expiry, latest first: the two with the default expiry (2029-02-28) come before the others.
      expect(all.body.items.map((i: { id: number }) => i.id).sort()).toEqual([visionOld.body.id, fine.body.id].sort());
    } finally {
      context.clock.set(null);
    }
  });

  it('when the register is exported, then the CSV has a BOM and round-trips commas, quotes and non-ASCII text', async () => {
    const quality = await signedInAs(context, ['quality_manager']);
    const person = await makeUser({ roles: ['technician'], displayName: 'Brack, "Sunny" Ærø-Śmigły' });
    const created = await quality
      .post('/api/certifications')
      .send(certificationBody(person.id, { sectors: ['=SUM(A1)', 'aerospace', 'pressure "vessels"'] }));
    expect(created.status).toBe(201);
    const response = await quality.agent.get('/api/certifications.csv').query({ userId: person.id }).buffer(true).parse((res, done) => {
      const chunks: Buffer[] = [];
      res.on('data', (chunk: Buffer) => chunks.push(chunk));
      res.on('end', () => done(null, Buffer.concat(chunks)));
    });
    expect(response.status).toBe(200);
    expect(response.headers['content-type']).toBe('text/csv; charset=utf-8');
    expect(response.headers['content-disposition']).toMatch(/^attachment; filename="certifications-\d{4}-\d{2}-\d{2}\.csv"$/);
    const body = response.body as Buffer;
    expect([...body.subarray(0, 3)]).toEqual([0xef, 0xbb, 0xbf]);
    const rows = parse(body, { bom: true, columns: true }) as Record<string, string>[];
    expect(rows).toHaveLength(1);
    expect(rows[0].Person).toBe('Brack, "Sunny" Ærø-Śmigły');
    expect(rows[0]['Certificate number']).toBe(created.body.certificateNumber);
    // A cell that a spreadsheet would run as a formula is prefixed with an apostrophe.
    expect(rows[0].Sectors).toBe(`'=SUM(A1); aerospace; pressure "vessels"`);
    expect(rows[0].Level).toBe('2');
  });
});

describe('equipment', () => {
  const standard = (overrides: Record<string, unknown> = {}) => ({
    kind: 'reference-standard',
    description: 'Aluminium block, three EDM notches',
    serialNumber: unique('RS'),
    calibratedOn: '2026-01-10',
    calibrationDueOn: '2027-01-10',
    conductivityIacs: 30.5,
    material: '2024-T3',
    notches: [
      { label: 'N1', orientation: 'axial', depthMm: 0.2, lengthMm: 1.5, edgeDistanceMm: null },
      { label: 'N2', orientation: 'circumferential', depthMm: 0.5, lengthMm: 3, edgeDistanceMm: 2.5 },
    ],
    ...overrides,
  });

  it('when a quality manager registers a reference standard with notches, then they come back in order and a technician may not edit', async () => {
    const quality = await signedInAs(context, ['quality_manager']);
    const created = await quality.post('/api/equipment').send(standard());
    expect(created.status).toBe(201);
    expect(created.body.notches.map((n: { label: string; depthMm: number; edgeDistanceMm: number | null }) => [n.label, n.depthMm, n.edgeDistanceMm])).toEqual([
      ['N1', 0.2, null],
      ['N2', 0.5, 2.5],
    ]);
    expect(created.body.conductivityIacs).toBe(30.5);
    const technician = await signedInAs(context, ['technician']);
    expect((await technician.patch(`/api/equipment/${created.body.id}`).send({ version: 0, status: 'retired' })).status).toBe(403);
    const quarantined = await quality.patch(`/api/equipment/${created.body.id}`).send({ version: created.body.version, status: 'quarantined' });
    expect(quarantined.status).toBe(200);
    expect(quarantined.body.status).toBe('quarantined');
    const trail = await TrailEntry.findAll({ where: { recordType: 'equipment', recordId: String(created.body.id) }, order: [['seq', 'ASC']] });
    expect(trail.map((entry) => entry.event)).toEqual(['EQUIPMENT_CREATED', 'EQUIPMENT_QUARANTINED']);
  });

  it('when notches are given for a probe or the due date precedes calibration, then 400', async () => {
    const quality = await signedInAs(context, ['quality_manager']);
    const probe = await quality.post('/api/equipment').send(standard({ kind: 'probe' }));
    expect(probe.status).toBe(400);
    expect(probe.body.error.details).toContainEqual(expect.objectContaining({ path: 'notches', message: 'only a reference standard has notches' }));
    const backwards = await quality.post('/api/equipment').send(standard({ calibrationDueOn: '2025-01-01' }));
    expect(backwards.status).toBe(400);
    expect(backwards.body.error.details[0].path).toBe('calibrationDueOn');
  });

  it('when filtered by overdue calibration on a fixed day, then only overdue items are listed, and the CSV holds the notches', async () => {
    const quality = await signedInAs(context, ['quality_manager']);
    const tag = unique('filter');
    const overdue = await quality.post('/api/equipment').send(standard({ description: `Overdue ${tag}`, calibrationDueOn: '2026-11-30' }));
    await quality.post('/api/equipment').send(standard({ description: `Current ${tag}`, calibrationDueOn: '2026-12-01' }));
    context.clock.set(new Date('2026-12-01T10:00:00Z'));
    try {
      const list = await quality.agent.get('/api/equipment').query({ q: tag, calibration: 'overdue' });
      expect(list.body.items.map((i: { id: number }) => i.id)).toEqual([overdue.body.id]);
      expect(list.body.items[0].calibration).toEqual({ status: 'overdue', daysLeft: -1 });
      const csv = await quality.agent.get('/api/equipment.csv').query({ q: tag, sort: 'calibrationDueOn' });
      const rows = parse(csv.text, { bom: true, columns: true }) as Record<string, string>[];
      expect(rows.map((r) => r['Calibration status'])).toEqual(['Out of calibration', 'Calibration due soon']);
      expect(rows[0].Notches).toBe('N1: axial 0.2 mm deep × 1.5 mm; N2: circumferential 0.5 mm deep × 3 mm, 2.5 mm from edge');
    } finally {
      context.clock.set(null);
    }
  });
});

describe('register facts for a technique', () => {
  it('when a technique links people and equipment, then the engine passes the valid ones and fails the lapsed vision exam and overdue probe', async () => {
    const quality = await signedInAs(context, ['quality_manager']);
    const level3 = await makeUser({ roles: ['level3'], displayName: 'Level Three Person' });
    const technician = await makeUser({ roles: ['technician'], displayName: 'Lapsed Vision Person' });
    await quality.post('/api/certifications').send(certificationBody(level3.id, { level: 3, scheme: 'ISO 9712', nearVisionExamOn: '2026-09-01' }));
    await quality.post('/api/certifications').send(certificationBody(technician.id, { nearVisionExamOn: '2025-11-15' }));
    const instrument = await quality.post('/api/equipment').send({ kind: 'instrument', description: 'Flaw detector', serialNumber: unique('IN'), calibrationDueOn: '2027-05-01' });
    const probe = await quality.post('/api/equipment').send({ kind: 'probe', description: 'Pencil probe', serialNumber: unique('PR'), calibrationDueOn: '2026-11-01' });
    const reference = await quality.post('/api/equipment').send({ kind: 'reference-standard', description: 'Notched block', serialNumber: unique('RS'), calibrationDueOn: '2027-05-01' });
    await context.deps.sequelize.query(
      'INSERT INTO techniques (code, title, area_id, created_by_id, created_at, updated_at) VALUES (?, ?, NULL, ?, NOW(3), NOW(3))',
      { replacements: [unique('TQ'), 'Register facts test technique', level3.id] },
    );
    const [{ id: techniqueId }] = await context.deps.sequelize.query<{ id: number }>('SELECT LAST_INSERT_ID() AS id', { type: QueryTypes.SELECT });

    const technicianSession = await signIn(context.app, technician);
    const refused = await technicianSession.agent
      .put(`/api/techniques/${techniqueId}/register-links`)
      .set('X-CSRF-Token', technicianSession.csrfToken)
      .send({ equipmentIds: [], performerIds: [] });
    expect(refused.status).toBe(403);
    const linked = await quality.agent
      .put(`/api/techniques/${techniqueId}/register-links`)
      .set('X-CSRF-Token', quality.csrfToken)
      .send({ equipmentIds: [instrument.body.id, probe.body.id, reference.body.id], performerIds: [level3.id, technician.id] });
    expect(linked.status).toBe(200);
    expect(linked.body.equipment).toHaveLength(3);
    const badIds = await quality.agent
      .put(`/api/techniques/${techniqueId}/register-links`)
      .set('X-CSRF-Token', quality.csrfToken)
      .send({ equipmentIds: [99_999_999], performerIds: [] });
    expect(badIds.status).toBe(400);

    const facts = await buildRegisterFacts({ techniqueId: Number(techniqueId), approvedById: level3.id, approvedAt: new Date('2026-10-01T09:00:00Z') });
    const technique = parseTechnique(DEMO_TECHNIQUES[0]);
    expect(technique.success).toBe(true);
    if (!technique.success) return;
    const output = evaluateParsedTechnique(technique.data, { registers: facts as never, now: new Date('2026-12-01T12:00:00Z') });
    const personnel = output.results.filter((r) => r.rule === 'personnel');
    expect(personnel.map((r) => r.status)).toEqual(['pass', 'pass', 'fail']);
    expect(personnel[2].message).toContain('Lapsed Vision Person had the last near-vision exam on 2025-11-15');
    const equipment = output.results.filter((r) => r.rule === 'equipment');
    expect(equipment.map((r) => [r.values.kind, r.status])).toEqual([
      ['instrument', 'pass'],
      ['probe', 'fail'],
      ['reference-standard', 'pass'],
    ]);

    // A quarantined instrument fails the check whatever its calibration date.
    await quality.patch(`/api/equipment/${instrument.body.id}`).send({ version: instrument.body.version, status: 'quarantined' });
    const after = await buildRegisterFacts({ techniqueId: Number(techniqueId), approvedById: level3.id, approvedAt: new Date('2026-10-01T09:00:00Z') });
    const rerun = evaluateParsedTechnique(technique.data, { registers: after as never, now: new Date('2026-12-01T12:00:00Z') });
    const instrumentResult = rerun.results.find((r) => r.rule === 'equipment' && r.values.kind === 'instrument')!;
    expect(instrumentResult.status).toBe('fail');
    expect(instrumentResult.message).toContain('Flaw detector [quarantined: out of use]');
  });
});

describe('certification reminders', () => {
  it('when a certificate nears expiry and a vision exam lapses, then one candidate per threshold is offered, with stable dedupe keys', async () => {
    const { certificationReminderCandidates } = await import('../../server/services/certification-reminders');
    const quality = await signedInAs(context, ['quality_manager']);
    const person = await makeUser({ roles: ['technician'], displayName: 'Reminder Person' });
    const created = await quality.post('/api/certifications').send(
      certificationBody(person.id, { issuedOn: '2022-03-01', expiresOn: '2027-03-01', nearVisionExamOn: '2026-02-28' }),
    );
    const mine = async (day: string) =>
      (await certificationReminderCandidates(context.deps, new Date(`${day}T06:00:00Z`))).filter((c) => c.certificationId === created.body.id);
    // 61 days out, vision exam current: nothing yet.
    expect(await mine('2026-12-30')).toEqual([]);
    // Exactly 60 days out: the 60-day reminder, to the person and the quality managers.
    const sixty = await mine('2026-12-31');
    expect(sixty.map((c) => [c.kind, c.threshold, c.daysLeft])).toEqual([['certificate-expiry', 60, 60]]);
    expect(sixty[0].recipientUserIds).toEqual(expect.arrayContaining([person.id, quality.user.id]));
    expect(sixty[0].dedupeKey).toBe(`certification:${created.body.id}:expiry:2027-03-01:60`);
    // 31 days out the 60-day key repeats (sent once); at 30 days a new key; vision due within 30 days from 2027-01-29.
    expect((await mine('2027-01-29')).map((c) => c.dedupeKey)).toEqual([
      `certification:${created.body.id}:expiry:2027-03-01:60`,
      `person:${person.id}:vision:2026-02-28:30`,
    ]);
    expect((await mine('2027-01-30'))[0].dedupeKey).toBe(`certification:${created.body.id}:expiry:2027-03-01:30`);
    // After expiry and vision lapse: the lapse reminders (threshold 0).
    const lapsed = await mine('2027-03-02');
    expect(lapsed.map((c) => [c.kind, c.threshold])).toEqual([
      ['certificate-expiry', 0],
      ['vision-exam', 0],
    ]);
    expect(lapsed[0].text).toContain('must not perform or approve inspections');
  });

  it('when a person holds two certificates with one near-vision exam, then one vision reminder goes to them, judged on their latest exam', async () => {
    const { certificationReminderCandidates } = await import('../../server/services/certification-reminders');
    const quality = await signedInAs(context, ['quality_manager']);
    const person = await makeUser({ roles: ['technician'], displayName: 'Two Certificates' });
    const first = await quality.post('/api/certifications').send(
      certificationBody(person.id, { issuedOn: '2022-03-01', expiresOn: '2029-03-01', nearVisionExamOn: '2026-02-28' }),
    );
    const second = await quality.post('/api/certifications').send(
      certificationBody(person.id, { method: 'PT', issuedOn: '2022-03-01', expiresOn: '2029-03-01', nearVisionExamOn: '2026-02-28' }),
    );
    expect([first.status, second.status]).toEqual([201, 201]);
    const visionFor = async (day: string) =>
      (await certificationReminderCandidates(context.deps, new Date(`${day}T06:00:00Z`))).filter(
        (c) => c.kind === 'vision-exam' && c.userId === person.id,
      );
    const overdue = await visionFor('2027-03-02');
    expect(overdue).toHaveLength(1);
    expect(overdue[0].dedupeKey).toBe(`person:${person.id}:vision:2026-02-28:0`);
    expect(overdue[0].text).toContain(first.body.certificateNumber);
    expect(overdue[0].text).toContain(second.body.certificateNumber);

    // A newer exam recorded on either certificate counts for the person: no reminder.
    const updated = await quality.patch(`/api/certifications/${second.body.id}`).send({ version: second.body.version, nearVisionExamOn: '2027-02-20' });
    expect(updated.status).toBe(200);
    expect(await visionFor('2027-03-02')).toEqual([]);
  });
});
