// Reads a demonstration's data from a CSV file (one row per inspector's call on one flaw, plus
// rows measured on flaw-free sites) and answers the specimens, inspections and noise it holds with
// per-row errors, writing nothing: the client shows the preview and records the demonstration
// through the ordinary create route. Rows are numbered as a spreadsheet does (header = row 1).
import { parse, CsvError } from 'csv-parse/sync';
import { Equipment, User } from '../models';
import { parseHit, HIT_VALUES_TEXT } from '../../shared/domain/pod/hit-values';
import type { PodDemonstrationData } from '../../shared/schemas/pod';

export const POD_IMPORT_MAX_BYTES = 2 * 1024 * 1024;
export const POD_IMPORT_MAX_ROWS = 5000;

export const POD_IMPORT_COLUMNS = [
  { header: 'specimen id', required: true },
  { header: 'flaw id', required: true },
  { header: 'size mm', required: true },
  { header: 'flaw type', required: true },
  { header: 'inspector e-mail', required: true },
  { header: 'date', required: true },
  { header: 'hit', required: false },
  { header: 'signal', required: false },
  { header: 'instrument serial', required: false },
  { header: 'probe serial', required: false },
  { header: 'flaw free', required: false },
] as const;
type Header = (typeof POD_IMPORT_COLUMNS)[number]['header'];

export interface PodImportError {
  row: number;
  field: string;
  message: string;
}

export interface PodImportPreview {
  model: 'hit-miss' | 'signal-response' | null;
  specimens: PodDemonstrationData['specimens'];
  inspections: PodDemonstrationData['inspections'];
  noise: number[];
  errors: PodImportError[];
  valid: boolean;
}

const normalise = (name: string) => name.toLowerCase().replace(/[\s_-]/g, '');
const HEADER_BY_KEY = new Map<string, Header>(POD_IMPORT_COLUMNS.map((c) => [normalise(c.header), c.header]));
const empty = (errors: PodImportError[]): PodImportPreview => ({ model: null, specimens: [], inspections: [], noise: [], errors, valid: false });

export async function previewPodImport(buffer: Buffer): Promise<PodImportPreview> {
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(buffer);
  } catch {
    return empty([{ row: 1, field: '(file)', message: 'The file is not UTF-8 text. Save it as “CSV UTF-8” and try again.' }]);
  }
  const firstLine = text.replace(/^\uFEFF/, '').split(/\r?\n/, 1)[0] ?? '';
  const delimiter = !firstLine.includes(',') && firstLine.includes(';') ? ';' : ',';
  let raw: string[][];
  try {
    raw = parse(text, { bom: true, delimiter, relax_column_count: true, skip_empty_lines: true, trim: true });
  } catch (error) {
    if (error instanceof CsvError) return empty([{ row: 1, field: '(file)', message: `The file cannot be read as CSV: ${error.message}` }]);
    throw error;
  }
  if (raw.length < 2) return empty([{ row: 1, field: '(file)', message: `The file needs a header row (${POD_IMPORT_COLUMNS.map((c) => c.header).join(', ')}) and at least one data row.` }]);
  if (raw.length - 1 > POD_IMPORT_MAX_ROWS) return empty([{ row: 1, field: '(file)', message: `The file has ${raw.length - 1} rows; at most ${POD_IMPORT_MAX_ROWS}.` }]);

  const header = raw[0].map((cell) => HEADER_BY_KEY.get(normalise(cell)) ?? null);
  const errors: PodImportError[] = [];
  raw[0].forEach((cell, i) => {
    if (!header[i] && cell !== '') errors.push({ row: 1, field: cell, message: `unknown column “${cell}”` });
  });
  for (const column of POD_IMPORT_COLUMNS)
    if (column.required && !header.includes(column.header)) errors.push({ row: 1, field: column.header, message: `the column “${column.header}” is missing` });
  const hasHit = header.includes('hit');
  const hasSignal = header.includes('signal');
  if (hasHit === hasSignal) errors.push({ row: 1, field: hasHit ? 'signal' : 'hit', message: 'give either a “hit” column (hit/miss) or a “signal” column (signal response), not both or neither' });
  if (errors.length) return empty(errors);
  const model = hasHit ? 'hit-miss' : 'signal-response';

  const rows = raw.slice(1).map((record, index) => {
    const cells = Object.fromEntries(POD_IMPORT_COLUMNS.map((c) => [c.header, ''])) as Record<Header, string>;
    header.forEach((name, position) => {
      if (name) cells[name] = record[position] ?? '';
    });
    return { row: index + 2, cells };
  });

  const emails = [...new Set(rows.map((r) => r.cells['inspector e-mail'].toLowerCase()).filter(Boolean))];
  const users = emails.length ? await User.findAll({ where: { email: emails }, attributes: ['id', 'email'] }) : [];
  const userByEmail = new Map(users.map((u) => [u.email.toLowerCase(), u.id]));
  const serials = [...new Set(rows.flatMap((r) => [r.cells['instrument serial'], r.cells['probe serial']]).filter(Boolean))];
  const items = serials.length ? await Equipment.findAll({ where: { serialNumber: serials }, attributes: ['id', 'serialNumber', 'kind'] }) : [];
  const itemBySerial = new Map(items.map((e) => [e.serialNumber, e]));

  const specimens = new Map<string, PodDemonstrationData['specimens'][number]>();
  const inspections = new Map<string, PodDemonstrationData['inspections'][number]>();
  const noise: number[] = [];
  for (const { row, cells } of rows) {
    const fail = (field: string, message: string) => errors.push({ row, field, message });
    const flawFree = cells['flaw free'] !== '' && parseHit(cells['flaw free']) === true;
    const signal = cells.signal === '' ? undefined : Number(cells.signal);
    if (hasSignal && (signal === undefined || !Number.isFinite(signal) || signal < 0)) {
      fail('signal', 'must be a number, zero or more');
      continue;
    }
    if (flawFree) {
      if (!hasSignal) fail('flaw free', 'flaw-free sites are measured as signals: this file has no signal column');
      else noise.push(signal!);
      continue;
    }
    const sizeMm = Number(cells['size mm']);
    if (cells['size mm'] === '' || !Number.isFinite(sizeMm) || sizeMm <= 0) fail('size mm', 'must be a number greater than zero');
    for (const field of ['specimen id', 'flaw id', 'flaw type'] as const) if (cells[field] === '') fail(field, 'required');
    const inspectorId = userByEmail.get(cells['inspector e-mail'].toLowerCase());
    if (!inspectorId) fail('inspector e-mail', 'no person has this e-mail address');
    if (!/^\d{4}-\d{2}-\d{2}$/.test(cells.date)) fail('date', 'use a date like 2026-12-31');
    const hit = hasHit ? parseHit(cells.hit) : undefined;
    if (hasHit && hit === null) fail('hit', `must be ${HIT_VALUES_TEXT}`);
    const equipmentIds: number[] = [];
    for (const [field, kind] of [['instrument serial', 'instrument'], ['probe serial', 'probe']] as const) {
      if (cells[field] === '') continue;
      const item = itemBySerial.get(cells[field]);
      if (!item) fail(field, 'no item in the equipment register has this serial');
      else if (item.kind !== kind) fail(field, `this serial belongs to a ${item.kind}, not a ${kind}`);
      else equipmentIds.push(item.id);
    }
    if (errors.some((e) => e.row === row)) continue;
    const known = specimens.get(cells['flaw id']);
    if (known && (known.sizeMm !== sizeMm || known.specimenId !== cells['specimen id'])) {
      fail('size mm', `flaw ${cells['flaw id']} was given as ${known.sizeMm} mm on specimen ${known.specimenId} in an earlier row`);
      continue;
    }
    specimens.set(cells['flaw id'], { specimenId: cells['specimen id'], flawId: cells['flaw id'], sizeMm, flawType: cells['flaw type'] });
    const key = [inspectorId, cells.date, ...equipmentIds].join('|');
    const inspection = inspections.get(key) ?? { inspectorId: inspectorId!, performedOn: cells.date, equipmentIds, results: [] };
    inspection.results.push(hasHit ? { flawId: cells['flaw id'], hit: hit! } : { flawId: cells['flaw id'], signal: signal! });
    inspections.set(key, inspection);
  }
  return { model, specimens: [...specimens.values()], inspections: [...inspections.values()], noise, errors, valid: errors.length === 0 && specimens.size > 0 };
}
