// CSV import of the inspection register: parse (UTF-8, optional BOM, RFC 4180
// quoting), resolve the names in each row to records, run the form's own checks,
// and write every row in one transaction only when the whole file is valid.
// Rows are numbered as a spreadsheet shows them: the header is row 1.
import { parse } from 'csv-parse/sync';
import { CsvError } from 'csv-parse';
import { Op, type Transaction } from 'sequelize';
import type { AppDeps } from '../app-deps';
import { Equipment, Inspection, Technique, TechniqueRevision, User } from '../models';
import { AppError } from '../lib/app-error';
import { appendTrailBatch } from './trail-batch';
import { inspectionRuleErrors, loadInspectionFacts } from './inspection-rules';
import { subject } from '@casl/ability';
import type { AppAbility } from '../../shared/abilities';
import {
  INSPECTION_IMPORT_COLUMNS,
  INSPECTION_IMPORT_MAX_ROWS,
  INSPECTION_RESULTS,
  INSPECTION_RESULT_LABELS,
  InspectionFieldsSchema,
  type InspectionImportError,
  type InspectionImportHeader,
  type InspectionImportPreview,
  type InspectionImportResult,
  type InspectionImportRow,
  type InspectionInput,
  type InspectionResult,
} from '../../shared/schemas/inspection';

type Cells = Record<InspectionImportHeader, string>;

const WRITE_CHUNK = 500;

/** Which column each field of InspectionInput comes from, to name the column in an error. */
const COLUMN_OF_FIELD: Record<keyof InspectionInput, InspectionImportHeader> = {
  performedOn: 'date',
  techniqueRevisionId: 'revision',
  partNumber: 'part number',
  serialNumber: 'serial number',
  workOrder: 'work order',
  customer: 'customer',
  inspectorId: 'inspector e-mail',
  result: 'result',
  instrumentId: 'instrument serial',
  probeId: 'probe serial',
  referenceStandardId: 'reference standard serial',
  notes: 'notes',
};

const normaliseHeader = (value: string) => value.toLowerCase().replace(/[^a-z0-9]/g, '');
const HEADER_BY_KEY = new Map(INSPECTION_IMPORT_COLUMNS.map((column) => [normaliseHeader(column.header), column.header]));
const RESULT_BY_KEY = new Map<string, InspectionResult>(
  INSPECTION_RESULTS.flatMap((result) => [
    [normaliseHeader(result), result],
    [normaliseHeader(INSPECTION_RESULT_LABELS[result]), result],
  ]),
);
const EQUIPMENT_COLUMNS = [
  ['instrument serial', 'instrument', 'instrumentId'],
  ['probe serial', 'probe', 'probeId'],
  ['reference standard serial', 'reference-standard', 'referenceStandardId'],
] as const;

const fileError = (message: string): InspectionImportPreview => ({ rows: [], errors: [{ row: 1, field: '(file)', message }], warnings: [], valid: false });

/** UTF-8 only: a file saved in a legacy code page would turn "Kühlwerk" into mojibake silently. */
function decode(buffer: Buffer): string | null {
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(buffer);
  } catch {
    return null;
  }
}

/** Comma by default; a header line with semicolons and no commas (a common spreadsheet export in Europe) reads with semicolons. */
function detectDelimiter(text: string): string {
  const firstLine = text.replace(/^\uFEFF/, '').split(/\r?\n/, 1)[0] ?? '';
  return !firstLine.includes(',') && firstLine.includes(';') ? ';' : ',';
}

interface ParsedFile {
  header: (InspectionImportHeader | null)[];
  records: { row: number; cells: Cells }[];
  errors: InspectionImportError[];
}

function parseFile(buffer: Buffer): ParsedFile | InspectionImportPreview {
  const text = decode(buffer);
  if (text === null) return fileError('The file is not UTF-8 text. Save it as “CSV UTF-8” and try again.');
  let raw: string[][];
  try {
    raw = parse(text, { bom: true, delimiter: detectDelimiter(text), relax_column_count: true, skip_empty_lines: false });
  } catch (error) {
    if (error instanceof CsvError) {
      const row = typeof (error as { records?: number }).records === 'number' ? (error as unknown as { records: number }).records + 1 : 1;
      return { rows: [], errors: [{ row, field: '(file)', message: `The file cannot be read as CSV: ${error.message}` }], warnings: [], valid: false };
    }
    throw error;
  }
  const isBlank = (record: string[]) => record.every((cell) => cell.trim() === '');
  if (raw.length === 0 || isBlank(raw[0])) {
    return fileError(`The file is empty. The first row must hold the column headers: ${INSPECTION_IMPORT_COLUMNS.map((c) => c.header).join(', ')}.`);
  }
  const errors: InspectionImportError[] = [];
  const header = raw[0].map((cell) => HEADER_BY_KEY.get(normaliseHeader(cell)) ?? null);
  raw[0].forEach((cell, index) => {
    if (!header[index] && cell.trim() !== '') errors.push({ row: 1, field: cell.trim(), message: `unknown column “${cell.trim()}”` });
    if (header[index] && header.indexOf(header[index]) !== index) errors.push({ row: 1, field: header[index]!, message: 'this column appears twice' });
  });
  for (const column of INSPECTION_IMPORT_COLUMNS) {
    if (column.required && !header.includes(column.header)) errors.push({ row: 1, field: column.header, message: `the column “${column.header}” is missing` });
  }
  // Rows cannot be judged against a header that is wrong: fix the header first.
  if (errors.length) return { rows: [], errors, warnings: [], valid: false };
  const records: ParsedFile['records'] = [];
  raw.slice(1).forEach((record, index) => {
    const row = index + 2;
    if (isBlank(record)) return;
    if (record.length > header.length && !isBlank(record.slice(header.length))) {
      errors.push({ row, field: '(row)', message: `this row has ${record.length} cells; the header has ${header.length}` });
    }
    const cells = Object.fromEntries(INSPECTION_IMPORT_COLUMNS.map((column) => [column.header, ''])) as Cells;
    header.forEach((name, position) => {
      if (name) cells[name] = (record[position] ?? '').trim();
    });
    records.push({ row, cells });
  });
  if (records.length === 0 && errors.length === 0) return fileError('The file has a header row but no inspections.');
  if (records.length > INSPECTION_IMPORT_MAX_ROWS) {
    return fileError(`The file has ${records.length} inspections; import at most ${INSPECTION_IMPORT_MAX_ROWS} at a time (split the file).`);
  }
  return { header, records, errors };
}

/** Everything the file's rows name, loaded once: revisions by technique code and letter, people by e-mail, equipment by serial. */
async function loadLookups(records: ParsedFile['records'], transaction?: Transaction) {
  const codes = [...new Set(records.map((r) => r.cells['technique code']).filter(Boolean))];
  const emails = [...new Set(records.map((r) => r.cells['inspector e-mail'].toLowerCase()).filter(Boolean))];
  const serials = [...new Set(records.flatMap((r) => EQUIPMENT_COLUMNS.map(([column]) => r.cells[column])).filter(Boolean))];
  const [revisions, users, equipment] = await Promise.all([
    codes.length
      ? TechniqueRevision.findAll({
          attributes: ['id', 'revision', 'approvedAt'],
          include: [{ model: Technique, as: 'technique', attributes: ['code'], where: { code: { [Op.in]: codes } } }],
          transaction,
        })
      : [],
    emails.length ? User.findAll({ attributes: ['id', 'email', 'displayName', 'active'], where: { email: { [Op.in]: emails } }, transaction }) : [],
    serials.length
      ? Equipment.findAll({ attributes: ['id', 'kind', 'serialNumber', 'status', 'calibrationDueOn'], where: { serialNumber: { [Op.in]: serials } }, transaction })
      : [],
  ]);
  const key = (...parts: string[]) => parts.map((part) => part.toLowerCase()).join('\u0000');
  const techniqueCodes = new Set(revisions.map((r) => r.technique!.code.toLowerCase()));
  return {
    techniqueExists: (code: string) => techniqueCodes.has(code.toLowerCase()),
    revisionOf: (code: string, letter: string) => revisions.find((r) => key(r.technique!.code, r.revision) === key(code, letter)) ?? null,
    userOf: (email: string) => users.find((u) => u.email.toLowerCase() === email.toLowerCase()) ?? null,
    equipmentOf: (serial: string) => equipment.filter((e) => e.serialNumber.toLowerCase() === serial.toLowerCase()),
    equipmentById: new Map(equipment.map((e) => [e.id, e])),
  };
}

interface CheckedFile {
  preview: InspectionImportPreview;
  inputs: { row: number; input: InspectionInput }[];
  /** The register's rows that repeat rows of the file (same revision, part, serial, day and work order). */
  alreadyInRegister: { row: number; existing: Inspection }[];
}

async function checkFile(deps: AppDeps, ability: AppAbility, buffer: Buffer, transaction?: Transaction): Promise<CheckedFile> {
  const parsed = parseFile(buffer);
  if (!('records' in parsed)) return { preview: parsed, inputs: [], alreadyInRegister: [] };
  const errors = [...parsed.errors];
  const lookups = await loadLookups(parsed.records, transaction);
  const rows: InspectionImportRow[] = [];
  const candidates: { row: number; input: InspectionInput }[] = [];
  // Every row also goes through the form's rules, whatever else failed, so that a row's problems show at once.
  const ruleChecks: { row: number; input: InspectionInput; reported: Set<string>; errors: InspectionImportError[] }[] = [];

  for (const { row, cells } of parsed.records) {
    const rowErrors: InspectionImportError[] = [];
    const fail = (field: string, message: string) => rowErrors.push({ row, field, message });

    const code = cells['technique code'];
    const letter = cells.revision;
    const revision = code && letter ? lookups.revisionOf(code, letter) : null;
    if (!code) fail('technique code', 'enter the technique code');
    else if (!lookups.techniqueExists(code)) fail('technique code', `no technique with the code “${code}”`);
    else if (!letter) fail('revision', 'enter the revision');
    else if (!revision) fail('revision', `technique ${code} has no revision “${letter}”`);

    const email = cells['inspector e-mail'];
    const user = email ? lookups.userOf(email) : null;
    if (!email) fail('inspector e-mail', 'enter the inspector’s e-mail address');
    else if (!user) fail('inspector e-mail', `no user with the e-mail address “${email}”`);

    const resultText = cells.result;
    const result = resultText ? (RESULT_BY_KEY.get(normaliseHeader(resultText)) ?? null) : null;
    if (!resultText) fail('result', 'enter the result: accept, reject or indication recorded');
    else if (!result) fail('result', `“${resultText}” is not a result: use accept, reject or indication recorded`);

    const equipment: Record<(typeof EQUIPMENT_COLUMNS)[number][2], number | null> = { instrumentId: null, probeId: null, referenceStandardId: null };
    const equipmentRefs: Record<(typeof EQUIPMENT_COLUMNS)[number][2], { serialNumber: string; id: number | null } | null> = {
      instrumentId: null,
      probeId: null,
      referenceStandardId: null,
    };
    for (const [column, kind, field] of EQUIPMENT_COLUMNS) {
      const serial = cells[column];
      if (!serial) continue;
      const matches = lookups.equipmentOf(serial);
      const ofKind = matches.filter((item) => item.kind === kind);
      if (matches.length === 0) fail(column, `no equipment with the serial number “${serial}”`);
      else if (ofKind.length === 0) fail(column, `“${serial}” is registered as ${matches[0].kind.replace('-', ' ')}, not ${kind.replace('-', ' ')}`);
      else if (ofKind.length > 1) fail(column, `more than one ${kind.replace('-', ' ')} has the serial number “${serial}”`);
      else equipment[field] = ofKind[0].id;
      equipmentRefs[field] = { serialNumber: serial, id: equipment[field] };
    }

    rows.push({
      row,
      performedOn: cells.date,
      technique: { code, revision: letter, revisionId: revision?.id ?? null },
      partNumber: cells['part number'],
      serialNumber: cells['serial number'],
      workOrder: cells['work order'],
      customer: cells.customer,
      inspector: { email, id: user?.id ?? null, name: user?.displayName ?? null },
      result,
      instrument: equipmentRefs.instrumentId,
      probe: equipmentRefs.probeId,
      referenceStandard: equipmentRefs.referenceStandardId,
      notes: cells.notes || null,
    });

    // The form's schema over what the row resolved to; a field already reported above is not reported twice.
    const parsedInput = InspectionFieldsSchema.safeParse({
      techniqueRevisionId: revision?.id ?? 0,
      performedOn: cells.date,
      partNumber: cells['part number'],
      serialNumber: cells['serial number'],
      workOrder: cells['work order'],
      customer: cells.customer,
      inspectorId: user?.id ?? 0,
      result: result ?? 'accept',
      ...equipment,
      notes: cells.notes || null,
    });
    // Rows name the importer as inspector, unless a quality role imports for others (shared/abilities.ts).
    if (user && !ability.can('create', subject('Inspection', { inspectorId: user.id }))) {
      fail('inspector e-mail', 'you import only inspections you performed; a quality manager imports them for other inspectors');
    }
    const reported = new Set(rowErrors.map((error) => error.field));
    // Stand-in ids for what did not resolve are already reported under their own column.
    if (!revision) reported.add('revision');
    if (!user) reported.add('inspector e-mail');
    if (!result) reported.add('result');
    if (!parsedInput.success) {
      for (const issue of parsedInput.error.issues) {
        const column = COLUMN_OF_FIELD[String(issue.path[0]) as keyof InspectionInput] ?? '(row)';
        if (!reported.has(column)) fail(column, issue.message);
        reported.add(column);
      }
    } else if (rowErrors.length === 0) {
      candidates.push({ row, input: parsedInput.data });
    }
    const standIn = {
      techniqueRevisionId: revision?.id ?? 0,
      performedOn: cells.date,
      inspectorId: user?.id ?? 0,
      ...equipment,
    } as InspectionInput;
    ruleChecks.push({ row, input: parsedInput.success ? parsedInput.data : standIn, reported, errors: rowErrors });
  }

  // The same checks as the form, for every row; a column already reported is not reported twice.
  const facts = await loadInspectionFacts(ruleChecks.map((c) => c.input), transaction);
  const now = deps.clock.now();
  for (const check of ruleChecks) {
    for (const error of inspectionRuleErrors(check.input, facts, now)) {
      const column = COLUMN_OF_FIELD[error.path];
      if (check.reported.has(column)) continue;
      check.reported.add(column);
      check.errors.push({ row: check.row, field: column, message: error.message });
    }
    errors.push(...check.errors);
  }
  const duplicates = await duplicateErrors(candidates, transaction);
  errors.push(...duplicates.errors);
  errors.sort((a, b) => a.row - b.row);
  const warnings = equipmentWarnings(candidates, lookups.equipmentById);
  const valid = errors.length === 0;
  return { preview: { rows, errors, warnings, valid }, inputs: valid ? candidates : [], alreadyInRegister: duplicates.alreadyInRegister };
}

const duplicateKey = (i: Pick<InspectionInput, 'techniqueRevisionId' | 'partNumber' | 'serialNumber' | 'performedOn' | 'workOrder'>) =>
  [i.techniqueRevisionId, i.partNumber, i.serialNumber, i.performedOn, i.workOrder].map((part) => String(part).toLowerCase()).join('\u0000');

/**
 * The same inspection twice (same revision, part, serial, day and work order), in the file or
 * already in the register: almost always a file imported twice, so it is refused.
 */
async function duplicateErrors(
  candidates: { row: number; input: InspectionInput }[],
  transaction?: Transaction,
): Promise<{ errors: InspectionImportError[]; alreadyInRegister: CheckedFile['alreadyInRegister'] }> {
  if (candidates.length === 0) return { errors: [], alreadyInRegister: [] };
  const errors: InspectionImportError[] = [];
  const firstRow = new Map<string, number>();
  for (const { row, input } of candidates) {
    const key = duplicateKey(input);
    const earlier = firstRow.get(key);
    if (earlier !== undefined) errors.push({ row, field: '(row)', message: `the same inspection as row ${earlier} (revision, part, serial number, date and work order)` });
    else firstRow.set(key, row);
  }
  const revisionIds = [...new Set(candidates.map((c) => c.input.techniqueRevisionId))];
  if (transaction) {
    // Two imports of the same file at once would each find the other's rows missing: the second
    // waits here on the revisions' row locks until the first commits, then its locking read
    // below sees the committed rows (a plain read would see the transaction's older snapshot).
    await TechniqueRevision.findAll({ attributes: ['id'], where: { id: { [Op.in]: revisionIds } }, order: [['id', 'ASC']], lock: transaction.LOCK.UPDATE, transaction });
  }
  const existing = await Inspection.findAll({
    attributes: ['id', 'techniqueRevisionId', 'partNumber', 'serialNumber', 'performedOn', 'workOrder', 'createdById', 'createdAt'],
    where: {
      techniqueRevisionId: { [Op.in]: revisionIds },
      serialNumber: { [Op.in]: [...new Set(candidates.map((c) => c.input.serialNumber))] },
    },
    ...(transaction ? { lock: transaction.LOCK.SHARE } : {}),
    transaction,
  });
  const inRegister = new Map(existing.map((row) => [duplicateKey(row), row]));
  const alreadyInRegister: CheckedFile['alreadyInRegister'] = [];
  for (const { row, input } of candidates) {
    const match = inRegister.get(duplicateKey(input));
    if (match) {
      alreadyInRegister.push({ row, existing: match });
      errors.push({ row, field: '(row)', message: 'the register already holds this inspection (same revision, part, serial number, date and work order): was the file imported before?' });
    }
  }
  return { errors, alreadyInRegister };
}

/**
 * A file whose every row is already in the register, with nothing else wrong: it was
 * imported before (a second click, or the same file sent again). Say so plainly
 * instead of listing every row as a problem.
 */
async function alreadyImported(checked: CheckedFile, transaction: Transaction): Promise<AppError | null> {
  const { preview, alreadyInRegister } = checked;
  if (preview.valid || preview.rows.length === 0 || alreadyInRegister.length !== preview.rows.length) return null;
  const repeatedRows = new Set(alreadyInRegister.map((entry) => entry.row));
  if (!preview.errors.every((error) => repeatedRows.has(error.row) && error.field === '(row)')) return null;
  const latest = alreadyInRegister.map((entry) => entry.existing).reduce((a, b) => (a.createdAt > b.createdAt ? a : b));
  const importer = await User.findByPk(latest.createdById, { attributes: ['id', 'displayName'], transaction });
  const when = latest.createdAt.toISOString().slice(0, 16).replace('T', ' ');
  const count = preview.rows.length;
  return new AppError(
    `${count === 1 ? 'The inspection in this file is' : `All ${count} inspections in this file are`} already in the register (recorded ${when} UTC by ${importer?.displayName ?? 'another user'}): nothing was written again.`,
    { status: 409, code: 'already_imported', details: { rows: count, recordedAt: latest.createdAt.toISOString(), recordedBy: importer?.displayName ?? null } },
  );
}

/** Equipment past its calibration due date on the day, or out of service now: shown, not refused (the record states what was used). */
function equipmentWarnings(candidates: { row: number; input: InspectionInput }[], equipment: Map<number, Equipment>): InspectionImportError[] {
  const warnings: InspectionImportError[] = [];
  for (const { row, input } of candidates) {
    for (const [column, , field] of EQUIPMENT_COLUMNS) {
      const id = input[field];
      const item = id === null ? undefined : equipment.get(id);
      if (!item) continue;
      if (item.calibrationDueOn && item.calibrationDueOn < input.performedOn) {
        warnings.push({ row, field: column, message: `${item.serialNumber} was due for calibration on ${item.calibrationDueOn}, before this inspection` });
      }
      if (item.status !== 'in_service') warnings.push({ row, field: column, message: `${item.serialNumber} is ${item.status.replace('_', ' ')} in the equipment register` });
    }
  }
  return warnings;
}

export async function previewInspectionImport(deps: AppDeps, ability: AppAbility, buffer: Buffer): Promise<InspectionImportPreview> {
  return (await checkFile(deps, ability, buffer)).preview;
}

/** Writes the whole file or nothing: checked again inside the transaction that writes it. */
export async function importInspections(
  deps: AppDeps,
  { actorId, ability }: { actorId: number; ability: AppAbility },
  buffer: Buffer,
  fileName: string,
): Promise<InspectionImportResult> {
  return deps.sequelize.transaction(async (transaction) => {
    const checked = await checkFile(deps, ability, buffer, transaction);
    const { preview, inputs } = checked;
    const repeated = await alreadyImported(checked, transaction);
    if (repeated) throw repeated;
    if (!preview.valid) {
      throw new AppError(`The file has ${preview.errors.length} ${preview.errors.length === 1 ? 'error' : 'errors'}; nothing was imported`, {
        status: 400,
        code: 'invalid_import',
        details: preview.errors,
      });
    }
    const facts = await loadInspectionFacts(inputs.map((c) => c.input), transaction);
    const at = deps.clock.now();
    const values = inputs.map(({ input }) => ({ ...input, techniqueId: facts.revisions.get(input.techniqueRevisionId)!.techniqueId, createdById: actorId }));
    // Multi-row INSERTs: MariaDB hands a multi-row insert consecutive ids, which Sequelize reads back.
    const created: Inspection[] = [];
    for (let start = 0; start < values.length; start += WRITE_CHUNK) {
      created.push(...(await Inspection.bulkCreate(values.slice(start, start + WRITE_CHUNK), { transaction })));
    }
    if (created.length !== values.length || created.some((row) => !row.id)) throw new Error('the import did not get an id for every inspection');
    await appendTrailBatch(
      deps.sequelize,
      transaction,
      created.map((row, index) => ({
        userId: actorId,
        recordType: 'inspection',
        recordId: row.id,
        event: 'INSPECTION_IMPORTED',
        changes: { ...inputs[index].input, techniqueId: values[index].techniqueId, source: { file: fileName, row: inputs[index].row } },
        at,
      })),
    );
    return { written: inputs.length };
  });
}
