import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import PDFDocument from 'pdfkit';
import request from 'supertest';
import { Certification, EvidenceFile, Technique, TrailEntry } from '../../server/models';
import { addEvidenceFromBytes, countEvidence, sweepEvidenceTemp } from '../../server/services/evidence.service';
import { defineAbilityFor } from '../../shared/abilities';
import { createTestContext, makeUser, signIn, signedInAs, type TestContext } from '../helpers/test-app';
import { makeActionRow } from '../helpers/evidence-owners';

const ROOT = path.resolve(import.meta.dirname, '../..');
const storageDir = path.join(ROOT, '.data', `test-evidence-${process.pid}-${Date.now()}`);
const tempDir = path.join(storageDir, 'tmp');
const objectsDir = path.join(storageDir, 'objects');

let context: TestContext;
beforeAll(() => {
  mkdirSync(storageDir, { recursive: true });
  context = createTestContext({ STORAGE_DIR: storageDir, UPLOAD_MAX_FILES: '3' });
});
afterAll(async () => {
  await context.close();
  rmSync(storageDir, { recursive: true, force: true });
});

function makePdf(text: string): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const doc = new PDFDocument({ size: 'A4', info: { Title: 'Eddy current calibration record' } });
    const chunks: Buffer[] = [];
    doc.on('data', (chunk: Buffer) => chunks.push(chunk));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
    doc.fontSize(14).text(text);
    doc.end();
  });
}

const sha256 = (bytes: Buffer) => createHash('sha256').update(bytes).digest('hex');
const filesUnder = (dir: string): string[] =>
  existsSync(dir) ? readdirSync(dir, { recursive: true, withFileTypes: true }).filter((entry) => entry.isFile()).map((entry) => path.join(entry.parentPath, entry.name)) : [];

// A 64-bit ELF header, then padding: what an executable renamed .pdf starts with.
const ELF = Buffer.concat([Buffer.from([0x7f, 0x45, 0x4c, 0x46, 0x02, 0x01, 0x01, 0x00]), Buffer.alloc(120, 0)]);
// A Windows executable: "MZ", then a PE header offset.
const MZ = Buffer.concat([Buffer.from('MZ'), Buffer.alloc(58, 0), Buffer.from([0x80, 0, 0, 0]), Buffer.alloc(64, 0), Buffer.from('PE\0\0')]);

async function ownerWithAction() {
  const quality = await makeUser({ roles: ['quality_manager'] });
  const technician = await makeUser({ roles: ['technician'] });
  const action = await makeActionRow(context.deps.sequelize, { ownerId: technician.id, createdById: quality.id });
  return { quality, technician, action, session: await signIn(context.app, technician) };
}

describe('evidence uploads', () => {
  it('when the action owner uploads a real PDF, then it is stored under its SHA-256, downloads byte-identical and both steps are on the trail', async () => {
    const { action, session } = await ownerWithAction();
    const pdf = await makePdf('Reference standard RS-7 calibration, 2026-11-30');
    const upload = await session
      .post('/api/evidence')
      .field('recordType', 'action')
      .field('recordId', String(action.id))
      .attach('file', pdf, { filename: 'calibration record.pdf', contentType: 'application/pdf' });
    expect(upload.status).toBe(201);
    const [view] = upload.body.items;
    expect(view).toMatchObject({ fileName: 'calibration record.pdf', mediaType: 'application/pdf', sizeBytes: pdf.length, sha256: sha256(pdf), canSupersede: true });
    expect(view.shortHash).toBe(sha256(pdf).slice(0, 12));

    const stored = path.join(objectsDir, 'sha256', view.sha256.slice(0, 2), view.sha256.slice(2, 4), view.sha256);
    expect(readFileSync(stored).equals(pdf)).toBe(true);
    expect(filesUnder(tempDir)).toEqual([]);

    const download = await session.agent.get(`/api/evidence/${view.id}/download`).buffer(true).parse((res, done) => {
      const chunks: Buffer[] = [];
      res.on('data', (chunk: Buffer) => chunks.push(chunk));
      res.on('end', () => done(null, Buffer.concat(chunks)));
    });
    expect(download.status).toBe(200);
    expect((download.body as Buffer).equals(pdf)).toBe(true);
    expect(download.headers['content-disposition']).toBe('attachment; filename="calibration record.pdf"');
    expect(download.headers['x-content-type-options']).toBe('nosniff');
    expect(download.headers['content-type']).toContain('application/pdf');

    const list = await session.agent.get(`/api/evidence?recordType=action&recordId=${action.id}`);
    expect(list.status).toBe(200);
    expect(list.body.items.map((item: { id: number }) => item.id)).toEqual([view.id]);

    const trail = await TrailEntry.findAll({ where: { recordType: 'evidence', recordId: String(view.id) }, order: [['seq', 'ASC']] });
    expect(trail.map((entry) => entry.event)).toEqual(['EVIDENCE_UPLOADED', 'EVIDENCE_DOWNLOADED']);
    expect(trail[0].changes).toMatchObject({ owner: { recordType: 'action', recordId: action.id, label: action.number }, sha256: view.sha256 });
    expect(await countEvidence('action', action.id)).toBe(1);
  });

  for (const [label, bytes] of [['an ELF executable', ELF], ['a Windows MZ executable', MZ]] as const) {
    it(`when ${label} is renamed .pdf, then 415 with no row and no file left`, async () => {
      const { action, session } = await ownerWithAction();
      const before = await EvidenceFile.count();
      const response = await session
        .post('/api/evidence')
        .field('recordType', 'action')
        .field('recordId', String(action.id))
        .attach('file', bytes, { filename: 'report.pdf', contentType: 'application/pdf' });
      expect(response.status).toBe(415);
      expect(response.body.error.code).toBe('unsupported_media_type');
      expect(response.body.error.message).toContain('report.pdf');
      expect(await EvidenceFile.count()).toBe(before);
      expect(filesUnder(tempDir)).toEqual([]);
    });
  }

  it('when a PNG is named .pdf, then 415 says the name and content disagree', async () => {
    const { action, session } = await ownerWithAction();
    const png = Buffer.from('89504e470d0a1a0a0000000d4948445200000001000000010806000000', 'hex');
    const response = await session
      .post('/api/evidence')
      .field('recordType', 'action')
      .field('recordId', String(action.id))
      .attach('file', png, { filename: 'scan.pdf', contentType: 'application/pdf' });
    expect(response.status).toBe(415);
    expect(response.body.error.message).toContain('image/png');
  });

  it('when an instrument export is UTF-8 CSV, then it is accepted as text/csv; a .csv holding binary bytes is 415', async () => {
    const { action, session } = await ownerWithAction();
    const csv = Buffer.from('channel,frequency_hz,phase_deg,amplitude_v\n1,100000,42.5,1.92\n2,300000,38.1,2.40\n', 'utf8');
    const ok = await session.post('/api/evidence').field('recordType', 'action').field('recordId', String(action.id)).attach('file', csv, { filename: 'export.csv', contentType: 'text/csv' });
    expect(ok.status).toBe(201);
    expect(ok.body.items[0].mediaType).toBe('text/csv');
    const binary = Buffer.from([0x41, 0x42, 0x00, 0xff, 0xfe, 0x43]);
    const refused = await session.post('/api/evidence').field('recordType', 'action').field('recordId', String(action.id)).attach('file', binary, { filename: 'export.csv', contentType: 'text/csv' });
    expect(refused.status).toBe(415);
    const noExtension = await session.post('/api/evidence').field('recordType', 'action').field('recordId', String(action.id)).attach('file', csv, { filename: 'export.xlsx' });
    expect(noExtension.status).toBe(415);
    expect(filesUnder(tempDir)).toEqual([]);
  });

  it('when a file is over UPLOAD_MAX_BYTES, then 413 with nothing in the temporary folder and no row', async () => {
    const small = createTestContext({ STORAGE_DIR: storageDir, UPLOAD_MAX_BYTES: '4096' });
    try {
      const quality = await makeUser({ roles: ['quality_manager'] });
      const technician = await makeUser({ roles: ['technician'] });
      const action = await makeActionRow(small.deps.sequelize, { ownerId: technician.id, createdById: quality.id });
      const session = await signIn(small.app, technician);
      const before = await EvidenceFile.count();
      const big = Buffer.concat([await makePdf('x'.repeat(100)), Buffer.alloc(8192, 0x20)]);
      const response = await session.post('/api/evidence').field('recordType', 'action').field('recordId', String(action.id)).attach('file', big, { filename: 'big.pdf' });
      expect(response.status).toBe(413);
      expect(response.body.error.code).toBe('file_too_large');
      expect(response.body.error.message).toContain('4 KB');
      expect(await EvidenceFile.count()).toBe(before);
      expect(filesUnder(tempDir)).toEqual([]);
    } finally {
      await small.close();
    }
  });

  it('when more files than UPLOAD_MAX_FILES are sent at once, then 413 and nothing is kept', async () => {
    const { action, session } = await ownerWithAction();
    const pdf = await makePdf('one of many');
    let call = session.post('/api/evidence').field('recordType', 'action').field('recordId', String(action.id));
    for (let index = 0; index < 4; index += 1) call = call.attach('file', pdf, { filename: `part-${index}.pdf` });
    const response = await call;
    expect(response.status).toBe(413);
    expect(response.body.error.code).toBe('too_many_files');
    expect(await countEvidence('action', action.id)).toBe(0);
    expect(filesUnder(tempDir)).toEqual([]);
  });

  it('when the file name is a path like ../../x.pdf, then it is stored as x.pdf inside the storage folder', async () => {
    const { action, session } = await ownerWithAction();
    const pdf = await makePdf('path test');
    const response = await session.post('/api/evidence').field('recordType', 'action').field('recordId', String(action.id)).attach('file', pdf, { filename: '../../x.pdf' });
    expect(response.status).toBe(201);
    expect(response.body.items[0].fileName).toBe('x.pdf');
    expect(existsSync(path.join(storageDir, '..', '..', 'x.pdf'))).toBe(false);
    expect(existsSync(path.join(ROOT, 'x.pdf'))).toBe(false);
    const row = await EvidenceFile.findByPk(response.body.items[0].id);
    expect(row!.storageKey).toBe(`sha256/${sha256(pdf).slice(0, 2)}/${sha256(pdf).slice(2, 4)}/${sha256(pdf)}`);
    const download = await session.agent.get(`/api/evidence/${row!.id}/download`);
    expect(download.headers['content-disposition']).toMatch(/^attachment; filename="?x\.pdf"?$/);
  });

  it('when someone without access asks, then 401 signed out, 403 for another technician uploading and for an admin downloading, 404 for no such record', async () => {
    const { action, session } = await ownerWithAction();
    const pdf = await makePdf('access');
    const created = await session.post('/api/evidence').field('recordType', 'action').field('recordId', String(action.id)).attach('file', pdf, { filename: 'a.pdf' });
    const id = created.body.items[0].id;

    expect((await request(context.app).get(`/api/evidence/${id}/download`)).status).toBe(401);
    const admin = await signedInAs(context, ['admin']);
    const adminDownload = await admin.agent.get(`/api/evidence/${id}/download`);
    expect(adminDownload.status).toBe(403);
    expect(adminDownload.headers['content-disposition']).toBeUndefined();

    const other = await signedInAs(context, ['technician']);
    const before = await EvidenceFile.count();
    const foreign = await other.post('/api/evidence').field('recordType', 'action').field('recordId', String(action.id)).attach('file', pdf, { filename: 'b.pdf' });
    expect(foreign.status).toBe(403);
    expect(await EvidenceFile.count()).toBe(before);
    expect(filesUnder(tempDir)).toEqual([]);

    const missing = await session.post('/api/evidence').field('recordType', 'action').field('recordId', '999999').attach('file', pdf, { filename: 'c.pdf' });
    expect(missing.status).toBe(404);
    expect((await session.agent.get('/api/evidence/999999/download')).status).toBe(404);
    const badType = await session.post('/api/evidence').field('recordType', 'invoice').field('recordId', String(action.id)).attach('file', pdf, { filename: 'c.pdf' });
    expect(badType.status).toBe(400);
    expect(badType.body.error.details[0].path).toBe('recordType');
    expect(filesUnder(tempDir)).toEqual([]);

    // An auditor and a quality manager may add evidence to anyone's action.
    const auditor = await signedInAs(context, ['auditor']);
    expect((await auditor.post('/api/evidence').field('recordType', 'action').field('recordId', String(action.id)).attach('file', pdf, { filename: 'd.pdf' })).status).toBe(201);
    expect((await auditor.agent.get(`/api/evidence/${id}/download`)).status).toBe(200);
  });

  it('when evidence belongs to a certificate, then its holder and quality staff may open it and another technician may not', async () => {
    const holder = await makeUser({ roles: ['technician'] });
    const certification = await Certification.create({
      userId: holder.id, method: 'ET', level: 2, scheme: 'EN 4179', certificateNumber: `T-${Date.now()}`, issuedOn: '2025-01-10', expiresOn: '2030-01-10',
      nearVisionExamOn: '2026-06-01', colourVisionCheckedOn: null, notes: null,
    });
    const pdf = await makePdf('Near-vision exam record');
    const own = await signIn(context.app, holder);
    const created = await own.post('/api/evidence').field('recordType', 'certification').field('recordId', String(certification.id)).attach('file', pdf, { filename: 'vision.pdf' });
    expect(created.status).toBe(201);
    const id = created.body.items[0].id;
    expect((await own.agent.get(`/api/evidence/${id}/download`)).status).toBe(200);

    const colleague = await signedInAs(context, ['technician']);
    expect((await colleague.agent.get(`/api/evidence/${id}/download`)).status).toBe(403);
    expect((await colleague.agent.get(`/api/evidence?recordType=certification&recordId=${certification.id}`)).status).toBe(403);
    expect((await colleague.post('/api/evidence').field('recordType', 'certification').field('recordId', String(certification.id)).attach('file', pdf, { filename: 'x.pdf' })).status).toBe(403);

    for (const roles of [['quality_manager'], ['auditor'], ['accountable_manager']] as const) {
      const staff = await signedInAs(context, [...roles]);
      expect((await staff.agent.get(`/api/evidence/${id}/download`)).status).toBe(200);
    }
    expect(filesUnder(tempDir)).toEqual([]);
  });

  it('when evidence is added to a technique, then a Level 3 may and a technician may not', async () => {
    const level3 = await signedInAs(context, ['level3']);
    const technique = await Technique.create({ code: `TST-${Date.now()}`, title: 'Bore scan, rotating probe', areaId: null, createdById: level3.user.id });
    const csv = Buffer.from('notch_depth_mm,amplitude_v\n0.2,0.8\n0.5,2.1\n');
    const allowed = await level3.post('/api/evidence').field('recordType', 'technique').field('recordId', String(technique.id)).attach('file', csv, { filename: 'demonstration.csv' });
    expect(allowed.status).toBe(201);
    const technician = await signedInAs(context, ['technician']);
    const refused = await technician.post('/api/evidence').field('recordType', 'technique').field('recordId', String(technique.id)).attach('file', csv, { filename: 'demonstration.csv' });
    expect(refused.status).toBe(403);
    expect(await countEvidence('technique', technique.id)).toBe(1);
  });

  it('when a stored byte is flipped on disk, then the download is refused and an integrity failure is on the trail', async () => {
    const { action, session } = await ownerWithAction();
    const pdf = await makePdf(`tamper ${Date.now()}`);
    const created = await session.post('/api/evidence').field('recordType', 'action').field('recordId', String(action.id)).attach('file', pdf, { filename: 't.pdf' });
    const view = created.body.items[0];
    const stored = path.join(objectsDir, 'sha256', view.sha256.slice(0, 2), view.sha256.slice(2, 4), view.sha256);
    const bytes = readFileSync(stored);
    bytes[200] ^= 0x01;
    writeFileSync(stored, bytes);

    const download = await session.agent.get(`/api/evidence/${view.id}/download`);
    expect(download.status).toBe(500);
    expect(download.body.error.code).toBe('evidence_integrity_failed');
    expect(download.body.error.message).toContain('changed in storage');
    const failure = await TrailEntry.findOne({ where: { recordType: 'evidence', recordId: String(view.id), event: 'EVIDENCE_INTEGRITY_FAILED' } });
    expect(failure?.changes).toMatchObject({ expectedSha256: view.sha256, actualSha256: sha256(bytes) });
  });

  it('when a cross-origin upload comes without the CSRF token, then it is refused and nothing is stored', async () => {
    const { action, session } = await ownerWithAction();
    const pdf = await makePdf('csrf');
    const before = await EvidenceFile.count();
    const noToken = await session.agent.post('/api/evidence').field('recordType', 'action').field('recordId', String(action.id)).attach('file', pdf, { filename: 'x.pdf' });
    expect(noToken.status).toBe(403);
    const crossSite = await session.agent
      .post('/api/evidence')
      .set('Origin', 'http://attacker.example')
      .field('recordType', 'action')
      .field('recordId', String(action.id))
      .attach('file', pdf, { filename: 'x.pdf' });
    expect(crossSite.status).toBe(403);
    expect(crossSite.body.error.code).toBe('cross_origin');
    expect(await EvidenceFile.count()).toBe(before);
    expect(filesUnder(tempDir)).toEqual([]);
  });

  it('when evidence is superseded, then only the uploader or a quality manager may, with a reason, the file stays and the count drops', async () => {
    const { action, session, quality } = await ownerWithAction();
    const pdf = await makePdf('supersede me');
    const first = (await session.post('/api/evidence').field('recordType', 'action').field('recordId', String(action.id)).attach('file', pdf, { filename: 'v1.pdf' })).body.items[0];
    const second = (await session.post('/api/evidence').field('recordType', 'action').field('recordId', String(action.id)).attach('file', await makePdf('second'), { filename: 'v2.pdf' })).body.items[0];
    expect(await countEvidence('action', action.id)).toBe(2);

    const other = await signedInAs(context, ['technician']);
    expect((await other.post(`/api/evidence/${first.id}/supersede`).send({ reason: 'not mine' })).status).toBe(403);
    const noReason = await session.post(`/api/evidence/${first.id}/supersede`).send({ reason: '' });
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.details[0].path).toBe('reason');

    const done = await session.post(`/api/evidence/${first.id}/supersede`).send({ reason: 'Wrong revision of the calibration sheet' });
    expect(done.status).toBe(200);
    expect(done.body.superseded).toMatchObject({ reason: 'Wrong revision of the calibration sheet', by: { id: session.user.id } });
    expect((await session.post(`/api/evidence/${first.id}/supersede`).send({ reason: 'again please' })).status).toBe(422);

    const qm = await signIn(context.app, quality);
    expect((await qm.post(`/api/evidence/${second.id}/supersede`).send({ reason: 'Replaced by the signed copy' })).status).toBe(200);
    expect(await countEvidence('action', action.id)).toBe(0);
    // Still downloadable: superseded is a mark, not a deletion.
    expect((await session.agent.get(`/api/evidence/${first.id}/download`)).status).toBe(200);
    const events = await TrailEntry.findAll({ where: { recordType: 'evidence', recordId: String(first.id), event: 'EVIDENCE_SUPERSEDED' } });
    expect(events).toHaveLength(1);
  });

  it('when an image is previewed inline, then it is sent inline with nosniff; a PDF cannot be previewed', async () => {
    const { action, session } = await ownerWithAction();
    const png = Buffer.from(
      'iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==',
      'base64',
    );
    const created = await session.post('/api/evidence').field('recordType', 'action').field('recordId', String(action.id)).attach('file', png, { filename: 'probe.png' });
    expect(created.status).toBe(201);
    expect(created.body.items[0].previewable).toBe(true);
    const preview = await session.agent.get(`/api/evidence/${created.body.items[0].id}/preview`);
    expect(preview.status).toBe(200);
    expect(preview.headers['content-type']).toBe('image/png');
    expect(preview.headers['content-disposition']).toMatch(/^inline/);
    expect(preview.headers['x-content-type-options']).toBe('nosniff');
    const pdf = (await session.post('/api/evidence').field('recordType', 'action').field('recordId', String(action.id)).attach('file', await makePdf('p'), { filename: 'p.pdf' })).body.items[0];
    expect((await session.agent.get(`/api/evidence/${pdf.id}/preview`)).status).toBe(415);
  });

  it('when evidence is added from bytes (demo data, imports), then it is checked, stored and on the trail like an upload', async () => {
    const { action, technician } = await ownerWithAction();
    const bytes = Buffer.from(`Briefing record, night shift, ${Date.now()}\n`);
    const ability = defineAbilityFor({ id: technician.id, roles: ['technician'], areaId: null });
    const actor = { user: { id: technician.id, email: technician.email, displayName: technician.displayName, roles: ['technician'], areaId: null } as never, ability };
    const view = await addEvidenceFromBytes(context.deps, actor, { recordType: 'action', recordId: action.id, fileName: 'briefing.txt', bytes });
    expect(view).toMatchObject({ fileName: 'briefing.txt', mediaType: 'text/plain', sha256: sha256(bytes) });
    expect(readFileSync(path.join(objectsDir, 'sha256', view.sha256.slice(0, 2), view.sha256.slice(2, 4), view.sha256)).equals(bytes)).toBe(true);
    expect(await TrailEntry.count({ where: { recordType: 'evidence', recordId: String(view.id), event: 'EVIDENCE_UPLOADED' } })).toBe(1);
    await expect(addEvidenceFromBytes(context.deps, actor, { recordType: 'action', recordId: action.id, fileName: 'x.pdf', bytes: ELF })).rejects.toMatchObject({ status: 415 });
    expect(filesUnder(tempDir)).toEqual([]);
  });

  it('when the sweep runs, then it finishes an interrupted move and removes unclaimed leftovers', async () => {
    const { action, technician } = await ownerWithAction();
    mkdirSync(tempDir, { recursive: true });
    const pdf = await makePdf(`interrupted ${Date.now()}`);
    const hash = sha256(pdf);
    writeFileSync(path.join(tempDir, 'interrupted.upload'), pdf);
    writeFileSync(path.join(tempDir, 'leftover.upload'), 'half an upload');
    const row = await EvidenceFile.create({
      recordType: 'action', recordId: action.id, originalName: 'i.pdf', mediaType: 'application/pdf', sizeBytes: pdf.length,
      sha256: hash, storageKey: `sha256/${hash.slice(0, 2)}/${hash.slice(2, 4)}/${hash}`, tempName: 'interrupted.upload', storedAt: null, uploadedById: technician.id,
    });
    const result = await sweepEvidenceTemp(context.deps, { minAgeMs: 0 });
    expect(result).toEqual({ finished: 1, removed: 1 });
    expect(filesUnder(tempDir)).toEqual([]);
    await row.reload();
    expect(row.storedAt).not.toBeNull();
    expect(readFileSync(path.join(objectsDir, row.storageKey)).equals(pdf)).toBe(true);
  });
});
