// The CSV preview reports every problem of a row at once: a lookup that fails
// (an unknown inspector) does not hide the date and equipment checks.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { User } from '../../server/models';
import { createTestContext, makeUser, signIn, type SignedIn, type TestContext } from '../helpers/test-app';
import { makeInspectionFixture, type InspectionFixture } from '../helpers/inspections';

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

const HEADER = 'date,technique code,revision,part number,serial number,work order,customer,inspector e-mail,result,instrument serial,probe serial,reference standard serial';

describe('inspection CSV preview', () => {
  it('when a row has an unknown inspector, a future date and a reference standard in the probe column, then all three are reported in one preview', async () => {
    const row = [
      '2026-12-25',
      fixture.technique.code,
      'B',
      `PN-${fixture.tag}`,
      'S-ALL',
      `WO-ALL-${fixture.tag}`,
      'Harrowgate Turbine Services',
      'nobody@tarnbrook.example',
      'accept',
      fixture.instrument.serialNumber,
      fixture.standard.serialNumber,
      fixture.standard.serialNumber,
    ].join(',');
    const response = await quality
      .post('/api/inspections/import/preview')
      .attach('file', Buffer.from(`${HEADER}\r\n${row}\r\n`, 'utf8'), { filename: 'all.csv', contentType: 'text/csv' });
    expect(response.status).toBe(200);
    const fields = (response.body.errors as { row: number; field: string }[]).filter((error) => error.row === 2).map((error) => error.field).sort();
    expect(fields).toEqual(['date', 'inspector e-mail', 'probe serial']);
    expect(response.body.valid).toBe(false);
  });
});
