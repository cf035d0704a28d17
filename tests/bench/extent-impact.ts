// Extent of condition, impact worksheet and CSV import at the bench's volume,
// each request timed one at a time (they are long single requests, not a load):
// the auditor raises a major finding from a failed checklist rule on the seeded
// impact technique; the quality manager runs the extent over every approved
// technique, reads the impact worksheet of its seeded inspections, decides them
// in batches of the largest size the API takes, and imports a file of the
// largest row count the import takes into another technique.
import { INSPECTION_IMPORT_MAX_ROWS } from '../../shared/schemas/inspection';
import type { ContainmentDecisionKind } from '../../shared/schemas/impact';
import type { ApiClient, CallResult } from '../faults/helpers/http-client';
import type { SeedResult } from './seed';

export interface TimedCall {
  name: string;
  ms: number[];
  /** What the answer held, in words (rows, bytes). */
  detail: string;
}

const DECISION_BATCH = 1_000; // ContainmentDecisionsSchema's maximum

function expectStatus(result: CallResult, status: number, what: string): Record<string, any> {
  if (result.status !== status) throw new Error(`${what}: expected ${status}, got ${result.status} ${JSON.stringify(result.body).slice(0, 400)}`);
  return result.body as Record<string, any>;
}

const kb = (value: unknown) => `${(Buffer.byteLength(JSON.stringify(value)) / 1024).toFixed(0)} kB of JSON`;

async function send(client: ApiClient, kind: string, id: number, body: Record<string, unknown>) {
  const { version } = expectStatus(await client.call('GET', `/api/${kind}/${id}`), 200, `read ${kind} ${id}`);
  return expectStatus(await client.call('POST', `/api/${kind}/${id}/events`, { ...body, version }), 200, `${body.type} on ${kind} ${id}`);
}

/** A major finding in containment, raised from the first failed result of the technique's checklist. */
async function raiseMajorFinding(auditor: ApiClient, quality: ApiClient, techniqueId: number, auditorId: number) {
  const today = new Date().toISOString().slice(0, 10);
  const audit = expectStatus(
    await auditor.call('POST', '/api/audits', {
      title: 'Bench audit for extent and impact',
      criteria: 'Company ET procedure',
      areaId: 1,
      leadAuditorId: auditorId,
      plannedStart: today,
      plannedEnd: today,
      techniques: [{ techniqueId }],
    }),
    201,
    'create the audit',
  );
  await send(auditor, 'audits', audit.id, { type: 'START_FIELDWORK' });
  const run = expectStatus(await auditor.call('POST', `/api/audits/${audit.id}/checklist-runs`, { techniqueId }), 201, 'run the checklist');
  const resultIndex = (run.output.results as { status: string }[]).findIndex((result) => result.status === 'fail');
  const finding = expectStatus(await auditor.call('POST', `/api/audits/${audit.id}/findings`, { checklistRunId: run.id, resultIndex }), 201, 'raise the finding');
  await send(auditor, 'findings', finding.id, { type: 'SUBMIT' });
  await send(quality, 'findings', finding.id, { type: 'CLASSIFY', class: 'major' });
  return { id: finding.id as number, rule: run.output.results[resultIndex].rule as string };
}

function importFile(seed: SeedResult, rows: number): string {
  const header = 'date,technique code,revision,part number,serial number,work order,customer,inspector e-mail,result';
  const lines = [header];
  const day = new Date(Date.now() - 86_400_000).toISOString().slice(0, 10);
  for (let i = 1; i <= rows; i += 1) {
    const email = seed.technicianEmails[i % seed.technicianEmails.length];
    lines.push(`${day},${seed.importTechnique!.code},A,PN-IMP-${i % 25},IMP-${i},"WO-IMP, batch ${Math.floor(i / 50)}",Bench Customer Ærø Import,${email},accept`);
  }
  return lines.join('\r\n');
}

async function timed(times: number, call: () => Promise<CallResult>, check: (result: CallResult) => string): Promise<{ ms: number[]; detail: string }> {
  const ms: number[] = [];
  let detail = '';
  for (let i = 0; i < times; i += 1) {
    const result = await call();
    detail = check(result);
    ms.push(result.ms);
  }
  return { ms, detail };
}

export async function benchExtentAndImport(seed: SeedResult, clients: { auditor: ApiClient; quality: ApiClient; auditorId: number }): Promise<TimedCall[]> {
  if (!seed.impactTechnique || !seed.importTechnique) return [];
  const { auditor, quality } = clients;
  const timings: TimedCall[] = [];
  const finding = await raiseMajorFinding(auditor, quality, seed.impactTechnique.id, clients.auditorId);

  const extent = await timed(3, () => quality.call('POST', `/api/findings/${finding.id}/extent-runs`, undefined, 120_000), (result) => {
    const run = expectStatus(result, 201, 'extent run');
    return `${run.evaluatedCount} approved techniques evaluated for ${finding.rule}, ${run.failing.length} failing; ${kb(run)}`;
  });
  timings.push({ name: 'extent run (POST /api/findings/:id/extent-runs)', ...extent });

  const impact = await timed(3, () => quality.call('GET', `/api/findings/${finding.id}/impact`, undefined, 120_000), (result) => {
    const view = expectStatus(result, 200, 'impact worksheet');
    return `${view.total} inspections in ${view.groups.length} customer/part groups; ${kb(view)}`;
  });
  timings.push({ name: 'impact worksheet (GET /api/findings/:id/impact)', ...impact });

  const ids = (expectStatus(await quality.call('GET', `/api/findings/${finding.id}/impact`, undefined, 120_000), 200, 'impact worksheet').rows as { inspection: { id: number } }[]).map(
    (row) => row.inspection.id,
  );
  const decisions: number[] = [];
  for (let start = 0; start < ids.length; start += DECISION_BATCH) {
    const result = await quality.call(
      'POST',
      `/api/findings/${finding.id}/containment-decisions`,
      { inspectionIds: ids.slice(start, start + DECISION_BATCH), decision: 'reinspect' satisfies ContainmentDecisionKind, reason: 'Bench: re-inspect with a corrected technique' },
      120_000,
    );
    expectStatus(result, 200, 'containment decisions');
    decisions.push(result.ms);
  }
  const { version } = expectStatus(await quality.call('GET', `/api/findings/${finding.id}`), 200, 'read the finding');
  const contained = await quality.call('POST', `/api/findings/${finding.id}/events`, { type: 'RECORD_CONTAINMENT', version, description: 'Every inspection decided' }, 120_000);
  expectStatus(contained, 200, 'RECORD_CONTAINMENT');
  timings.push({ name: `containment decisions, ${DECISION_BATCH} inspections a request`, ms: decisions, detail: `${ids.length} inspections decided in ${decisions.length} requests` });
  timings.push({ name: 'RECORD_CONTAINMENT with every inspection decided', ms: [contained.ms], detail: 'counts the undecided inspections inside the transition' });

  const file = Buffer.from(importFile(seed, INSPECTION_IMPORT_MAX_ROWS), 'utf8');
  const detail = `${INSPECTION_IMPORT_MAX_ROWS} rows, ${(file.length / 1024).toFixed(0)} kB`;
  const preview = await quality.upload('/api/inspections/import/preview', 'file', file, 'bench.csv', 'text/csv', 120_000);
  const previewed = expectStatus(preview, 200, 'import preview');
  if (!previewed.valid) throw new Error(`import preview found errors: ${JSON.stringify(previewed.errors.slice(0, 3))}`);
  timings.push({ name: 'CSV import preview (writes nothing)', ms: [preview.ms], detail });
  const imported = await quality.upload('/api/inspections/import', 'file', file, 'bench.csv', 'text/csv', 120_000);
  expectStatus(imported, 201, 'import');
  timings.push({ name: 'CSV import (checked again, written in one transaction with a trail entry per row)', ms: [imported.ms], detail });
  return timings;
}
