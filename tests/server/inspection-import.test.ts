import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Equipment, Inspection, TrailEntry, type User } from '../../server/models';
import { createTestContext, makeUser, signIn, type SignedIn, type TestContext } from '../helpers/test-app';
import { makeInspectionFixture, type InspectionFixture } from '../helpers/inspections';
import { verifyTrail } from '../../server/services/trail.service';

let context: TestContext;
let fixture: InspectionFixture;
let inspector: User;
let quality: SignedIn;

beforeAll(async () => {
  context = createTestContext();
  context.clock.set(new Date('2026-11-20T12:00:00Z'));
  inspector = await makeUser({ roles: ['technician'] });
  fixture = await makeInspectionFixture(inspector);
  quality = await signIn(context.app, await makeUser({ roles: ['quality_manager'] }));
});
afterAll(() => context.close());

const HEADER = 'date,technique code,revision,part number,serial number,work order,customer,inspector e-mail,result,instrument serial,probe serial,reference standard serial,notes';

/** One CSV line; cells are written as given (quote them in the test when the test is about quoting). */
function line(overrides: Partial<Record<string, string>> = {}) {
  const cells = {
    date: '2026-07-01',
    code: fixture.technique.code,
    revision: 'B',
    part: `PN-${fixture.tag}`,
    serial: 'S-1',
    workOrder: `WO-${fixture.tag}`,
    customer: 'Harrowgate Turbine Services',
    email: inspector.email,
    result: 'accept',
    instrument: fixture.instrument.serialNumber,
    probe: fixture.probe.serialNumber,
    standard: fixture.standard.serialNumber,
    notes: '',
    ...overrides,
  };
  return Object.values(cells).join(',');
}

const upload = (path: string, text: string | Buffer, name = 'inspections.csv') =>
  quality.post(path).attach('file', Buffer.isBuffer(text) ? text : Buffer.from(text, 'utf8'), { filename: name, contentType: 'text/csv' });
const preview = (text: string | Buffer) => upload('/api/inspections/import/preview', text);
const commit = (text: string | Buffer) => upload('/api/inspections/import', text);
const rowsFor = (workOrder: string) => Inspection.findAll({ where: { workOrder }, order: [['serialNumber', 'ASC']] });

describe('inspection CSV import', () => {
  it('when a good file is previewed and imported, then the rows in the database equal the file and each has a trail entry', async () => {
    const workOrder = `WO-GOOD-${fixture.tag}`;
    const file = [
      HEADER,
      line({ serial: 'S-1', workOrder, result: 'accept' }),
      line({ serial: 'S-2', workOrder, result: 'Reject', date: '2026-06-01', probe: '' }),
      line({ serial: 'S-3', workOrder, result: 'INDICATION RECORDED', revision: 'a', date: '2026-03-02', notes: 'Signal at bore edge' }),
      line({ serial: 'S-4', workOrder, result: 'indication_recorded', instrument: '', probe: '', standard: '' }),
    ].join('\r\n');

    const previewed = await preview(file);
    expect(previewed.status).toBe(200);
    expect(previewed.body.valid).toBe(true);
    expect(previewed.body.errors).toEqual([]);
    expect(previewed.body.rows).toHaveLength(4);
    expect(previewed.body.rows[0]).toMatchObject({
      row: 2,
      technique: { code: fixture.technique.code, revision: 'B', revisionId: fixture.approved.id },
      inspector: { email: inspector.email, id: inspector.id, name: inspector.displayName },
      result: 'accept',
      instrument: { serialNumber: fixture.instrument.serialNumber, id: fixture.instrument.id },
    });
    expect(previewed.body.rows[2].technique.revisionId).toBe(fixture.superseded.id);
    // Previewing writes nothing.
    expect(await rowsFor(workOrder)).toHaveLength(0);

    const imported = await commit(file);
    expect(imported.status).toBe(201);
    expect(imported.body).toEqual({ written: 4 });
    const rows = await rowsFor(workOrder);
    expect(
      rows.map((r) => [r.serialNumber, r.performedOn, r.techniqueRevisionId, r.techniqueId, r.result, r.inspectorId, r.instrumentId, r.probeId, r.referenceStandardId, r.notes, r.createdById]),
    ).toEqual([
      ['S-1', '2026-07-01', fixture.approved.id, fixture.technique.id, 'accept', inspector.id, fixture.instrument.id, fixture.probe.id, fixture.standard.id, null, quality.user.id],
      ['S-2', '2026-06-01', fixture.approved.id, fixture.technique.id, 'reject', inspector.id, fixture.instrument.id, null, fixture.standard.id, null, quality.user.id],
      ['S-3', '2026-03-02', fixture.superseded.id, fixture.technique.id, 'indication_recorded', inspector.id, fixture.instrument.id, fixture.probe.id, fixture.standard.id, 'Signal at bore edge', quality.user.id],
      ['S-4', '2026-07-01', fixture.approved.id, fixture.technique.id, 'indication_recorded', inspector.id, null, null, null, null, quality.user.id],
    ]);
    const trail = await TrailEntry.findAll({ where: { recordType: 'inspection', recordId: rows.map((r) => String(r.id)) } });
    expect(trail).toHaveLength(4);
    expect(trail.every((entry) => entry.event === 'INSPECTION_IMPORTED' && entry.userId === quality.user.id)).toBe(true);
    expect(trail.find((entry) => entry.recordId === String(rows[1].id))!.changes).toMatchObject({ source: { file: 'inspections.csv', row: 3 } });
    // Each entry names the row it was written for, and the chain still verifies after the batch.
    for (const row of rows) {
      expect(trail.find((entry) => entry.recordId === String(row.id))!.changes).toMatchObject({ serialNumber: row.serialNumber, performedOn: row.performedOn });
    }
    expect((await verifyTrail(context.deps.sequelize)).ok).toBe(true);
  });

  it('when a file is imported twice or repeats a row, then the repeat is refused; equipment past its calibration is a warning only', async () => {
    const workOrder = `WO-TWICE-${fixture.tag}`;
    const lapsed = await Equipment.create({ kind: 'probe', description: 'Lapsed probe', model: null, serialNumber: `LAPSED-${fixture.tag}`, calibratedOn: '2025-06-30', calibrationDueOn: '2026-06-30', conductivityIacs: null, material: null, notes: null });
    const file = [HEADER, line({ workOrder, serial: 'T-1', probe: lapsed.serialNumber }), line({ workOrder, serial: 'T-2' })].join('\n');
    const previewed = await preview(file);
    expect(previewed.body.valid).toBe(true);
    expect(previewed.body.warnings).toEqual([{ row: 2, field: 'probe serial', message: expect.stringContaining('due for calibration on 2026-06-30') }]);
    expect((await commit(file)).status).toBe(201);

    const again = await preview(file);
    expect(again.body.valid).toBe(false);
    expect(again.body.errors.map((e: { row: number; field: string }) => [e.row, e.field])).toEqual([[2, '(row)'], [3, '(row)']]);
    expect(again.body.errors[0].message).toContain('already holds this inspection');
    // Imported again whole: said plainly, not listed as two problems.
    const reimport = await commit(file);
    expect(reimport.status).toBe(409);
    expect(reimport.body.error.code).toBe('already_imported');
    expect(reimport.body.error.message).toMatch(/^All 2 inspections in this file are already in the register \(recorded \d{4}-\d{2}-\d{2} \d{2}:\d{2} UTC by .+\): nothing was written again\.$/);
    expect(await rowsFor(workOrder)).toHaveLength(2);
    // One new row beside the repeated ones: still refused row by row, nothing written.
    const mixed = await commit([file, line({ workOrder, serial: 'T-3' })].join('\n'));
    expect(mixed.status).toBe(400);
    expect(await rowsFor(workOrder)).toHaveLength(2);

    const repeated = await preview([HEADER, line({ workOrder: `${workOrder}-B`, serial: 'T-9' }), line({ workOrder: `${workOrder}-B`, serial: 'T-9' })].join('\n'));
    expect(repeated.body.errors).toEqual([{ row: 3, field: '(row)', message: expect.stringContaining('same inspection as row 2') }]);
  });

  it('when the same file is imported twice at the same moment, then one import writes it and the other is refused', async () => {
    const workOrder = `WO-RACE-${fixture.tag}`;
    const file = [HEADER, line({ workOrder, serial: 'R-1' }), line({ workOrder, serial: 'R-2' })].join('\n');
    const answers = await Promise.all([commit(file), commit(file)]);
    expect(answers.map((answer) => answer.status).sort()).toEqual([201, 409]);
    const refused = answers.find((answer) => answer.status === 409)!;
    expect(refused.body.error).toMatchObject({ code: 'already_imported', details: { rows: 2 } });
    expect(await rowsFor(workOrder)).toHaveLength(2);
  });

  it('when one row of a file is bad, then the preview and the import report that row and field and nothing is written', async () => {
    const workOrder = `WO-BAD-${fixture.tag}`;
    const file = [HEADER, line({ workOrder, serial: 'B-1' }), line({ workOrder, serial: 'B-2' }), line({ workOrder, serial: 'B-3', probe: fixture.standard.serialNumber }), line({ workOrder, serial: 'B-4' })].join('\n');
    const previewed = await preview(file);
    expect(previewed.status).toBe(200);
    expect(previewed.body.valid).toBe(false);
    expect(previewed.body.rows).toHaveLength(4);
    expect(previewed.body.errors).toEqual([{ row: 4, field: 'probe serial', message: expect.stringContaining('reference standard') }]);

    const trailBefore = await TrailEntry.count();
    const refused = await commit(file);
    expect(refused.status).toBe(400);
    expect(refused.body.error.code).toBe('invalid_import');
    expect(refused.body.error.details).toEqual([expect.objectContaining({ row: 4, field: 'probe serial', message: expect.any(String) })]);
    expect(await rowsFor(workOrder)).toHaveLength(0);
    expect(await TrailEntry.count()).toBe(trailBefore);
  });

  it('when rows break the form’s rules, then each is reported by row and column', async () => {
    const file = [
      HEADER,
      line({ date: '2026-05-31' }), // before revision B's approval
      line({ revision: 'C' }), // a draft
      line({ date: '2026-12-01' }), // in the future
      line({ email: 'nobody@test.example' }),
      line({ result: 'pass' }),
      line({ code: 'NO-SUCH-CODE' }),
      line({ part: '' }),
      line({ date: '01/07/2026' }),
      line({ instrument: 'NO-SUCH-SERIAL' }),
    ].join('\n');
    const previewed = await preview(file);
    expect(previewed.body.valid).toBe(false);
    expect(previewed.body.errors.map((e: { row: number; field: string }) => [e.row, e.field])).toEqual([
      [2, 'date'],
      [3, 'revision'],
      [4, 'date'],
      [5, 'inspector e-mail'],
      [6, 'result'],
      [7, 'technique code'],
      [8, 'part number'],
      [9, 'date'],
      [10, 'instrument serial'],
    ]);
    expect(previewed.body.errors[1].message).toContain('draft');
  });

  it('when fields are quoted with commas, quotes and line breaks, then they are read whole and rows keep their spreadsheet numbers', async () => {
    const workOrder = `WO-QUOTE-${fixture.tag}`;
    const file = [
      HEADER,
      line({ workOrder, serial: 'Q-1', customer: '"Brackwater Hydraulics, Hangar 4"', notes: '"Two lines:\r\nfirst, then ""second"""' }),
      line({ workOrder, serial: 'Q-2', part: '"PN-7,A"', result: 'nope' }),
    ].join('\r\n');
    const previewed = await preview(file);
    expect(previewed.body.rows[0]).toMatchObject({ row: 2, customer: 'Brackwater Hydraulics, Hangar 4', notes: 'Two lines:\r\nfirst, then "second"' });
    expect(previewed.body.rows[1]).toMatchObject({ row: 3, partNumber: 'PN-7,A' });
    // The second record starts on the file's fourth line, but it is the spreadsheet's row 3.
    expect(previewed.body.errors).toEqual([{ row: 3, field: 'result', message: expect.stringContaining('nope') }]);

    const fixed = file.replace('nope', 'accept');
    expect((await commit(fixed)).status).toBe(201);
    const rows = await rowsFor(workOrder);
    expect(rows.map((r) => [r.customer, r.partNumber, r.notes])).toEqual([
      ['Brackwater Hydraulics, Hangar 4', `PN-${fixture.tag}`, 'Two lines:\r\nfirst, then "second"'],
      ['Harrowgate Turbine Services', 'PN-7,A', null],
    ]);
  });

  it('when the file has non-ASCII text and a UTF-8 byte-order mark, then the text is stored exactly and the first header is recognised', async () => {
    const workOrder = `WO-ÅÆØ-${fixture.tag}`;
    const text = `\uFEFF${HEADER}\n${line({ workOrder, serial: 'Ü-1', customer: 'Kühlwerk Ærø', notes: '"Å-seite geprüft; δ ≈ 0,38 mm"' })}\n`;
    const previewed = await preview(Buffer.from(text, 'utf8'));
    expect(previewed.body.errors).toEqual([]);
    expect(previewed.body.valid).toBe(true);
    expect(previewed.body.rows[0]).toMatchObject({ performedOn: '2026-07-01', customer: 'Kühlwerk Ærø' });
    expect((await commit(Buffer.from(text, 'utf8'))).status).toBe(201);
    const [row] = await rowsFor(workOrder);
    expect([row.serialNumber, row.customer, row.notes]).toEqual(['Ü-1', 'Kühlwerk Ærø', 'Å-seite geprüft; δ ≈ 0,38 mm']);
  });

  it('when headers differ in case and spacing, columns are reordered, or a semicolon separates them, then the file still reads', async () => {
    const workOrder = `WO-SEMI-${fixture.tag}`;
    const header = 'Result;Date;Technique Code;REVISION;Part_Number;Serial-Number;Work Order;Customer;Inspector Email';
    const row = ['Accept', '2026-07-02', fixture.technique.code, 'B', 'PN-S', 'S-9', workOrder, 'Østerdal Aviation', inspector.email].join(';');
    const previewed = await preview(`${header}\n${row}\n`);
    expect(previewed.body.errors).toEqual([]);
    expect(previewed.body.valid).toBe(true);
    expect(previewed.body.rows[0]).toMatchObject({ result: 'accept', customer: 'Østerdal Aviation', instrument: null });
  });

  it('when the file is empty, header-only, lacks a column, has an unknown one or is not UTF-8, then the message says so and nothing is written', async () => {
    const before = await Inspection.count();
    const empty = await preview('');
    expect(empty.status).toBe(200);
    expect(empty.body).toMatchObject({ valid: false, rows: [], errors: [{ row: 1, field: '(file)', message: expect.stringContaining('empty') }] });
    const headerOnly = await preview(`${HEADER}\r\n`);
    expect(headerOnly.body.errors).toEqual([{ row: 1, field: '(file)', message: 'The file has a header row but no inspections.' }]);
    const headerOnlyImport = await commit(`${HEADER}\r\n`);
    expect(headerOnlyImport.status).toBe(400);
    expect(headerOnlyImport.body.error.details[0].message).toContain('no inspections');

    const missing = await preview(`${HEADER.replace(',customer', '')}\n${line().replace(',Harrowgate Turbine Services', '')}`);
    expect(missing.body.errors).toEqual([{ row: 1, field: 'customer', message: expect.stringContaining('missing') }]);
    const unknown = await preview(`${HEADER},colour\n${line()},red`);
    expect(unknown.body.errors).toEqual([{ row: 1, field: 'colour', message: expect.stringContaining('unknown column') }]);
    const latin1 = await preview(Buffer.from(`${HEADER}\n${line({ customer: 'Kühlwerk' })}`, 'latin1'));
    expect(latin1.body.errors[0]).toMatchObject({ field: '(file)', message: expect.stringContaining('UTF-8') });
    const unclosed = await preview(`${HEADER}\n${line({ customer: '"Never closed' })}`);
    expect(unclosed.body.valid).toBe(false);
    expect(unclosed.body.errors[0].field).toBe('(file)');
    expect(await Inspection.count()).toBe(before);
  });

  it('when the file is over the size limit or has too many rows, then it is refused with a clear message', async () => {
    const big = Buffer.alloc(2 * 1024 * 1024 + 10, 'a');
    const tooLarge = await preview(big);
    expect(tooLarge.status).toBe(413);
    expect(tooLarge.body.error.message).toContain('2 MB');
    expect((await commit(big)).status).toBe(413);

    const many = [HEADER, ...Array.from({ length: 5001 }, (_, i) => line({ serial: `M-${i}` }))].join('\n');
    const tooMany = await preview(many);
    expect(tooMany.body.valid).toBe(false);
    expect(tooMany.body.errors).toEqual([{ row: 1, field: '(file)', message: expect.stringContaining('at most 5000') }]);
  });

  it('when no file or an extra field is sent, or the user may not record inspections, then it is refused', async () => {
    expect((await quality.post('/api/inspections/import/preview').send({})).status).toBe(415);
    expect((await quality.post('/api/inspections/import/preview').field('x', '1')).status).toBe(400);
    const auditor = await signIn(context.app, await makeUser({ roles: ['auditor'] }));
    const refused = await auditor.post('/api/inspections/import').attach('file', Buffer.from(`${HEADER}\n${line()}`), 'x.csv');
    expect(refused.status).toBe(403);
  });
});
