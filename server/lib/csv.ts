// CSV export of any list: every page of the list service, written with
// csv-stringify (RFC 4180 quoting), UTF-8 with a byte-order mark so spreadsheet
// tools read non-ASCII text (names, δ, µ) correctly.
import type { Response } from 'express';
import { stringify } from 'csv-stringify/sync';
import type { ListResponse } from '../../shared/schemas/common';
import { AppError } from './app-error';

export interface CsvColumn<T> {
  header: string;
  value(row: T): string | number | boolean | null | undefined;
}

/** The largest export in one file; beyond it the user narrows the filter. */
export const CSV_MAX_ROWS = 20_000;
const PAGE_SIZE = 200;

/** Runs a list query page by page (the list's own filters and sort) and collects every row. */
export async function collectAllPages<T, Q extends { page: number; pageSize: number }>(
  list: (query: Q) => Promise<ListResponse<T>>,
  query: Q,
  maxRows = CSV_MAX_ROWS,
): Promise<T[]> {
  const rows: T[] = [];
  for (let page = 1; ; page += 1) {
    const result = await list({ ...query, page, pageSize: PAGE_SIZE });
    if (page === 1 && result.total > maxRows) {
      throw new AppError(`This list has ${result.total} rows; narrow the filter to at most ${maxRows} to export it`, {
        status: 422,
        code: 'export_too_large',
      });
    }
    rows.push(...result.items);
    if (result.items.length < PAGE_SIZE || rows.length >= result.total) return rows;
  }
}

// CSV injection (OWASP guidance): a cell that begins with =, +, -, @, tab or CR
// is run as a formula by spreadsheet tools, so it gets a leading apostrophe,
// unless the whole cell is a plain number ("-12.5" stays a number).
const FORMULA_START = /^[=+\-@\t\r]/;
const PLAIN_NUMBER = /^[-+]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][-+]?\d+)?$/;

export function csvCell(value: string | number | boolean | null | undefined): string | number | boolean {
  if (value === null || value === undefined) return '';
  if (typeof value === 'string' && FORMULA_START.test(value) && !PLAIN_NUMBER.test(value)) return `'${value}`;
  return value;
}

export function toCsv<T>(columns: CsvColumn<T>[], rows: T[]): string {
  const records = rows.map((row) => columns.map((column) => csvCell(column.value(row))));
  // Every field quoted: an embedded CR or LF (even a bare LF, which CRLF records
  // would otherwise leave unquoted) stays inside its cell.
  return stringify(records, {
    header: true,
    columns: columns.map((column) => column.header),
    bom: true,
    record_delimiter: 'windows',
    quoted: true,
    quoted_empty: true,
    cast: { boolean: (value) => (value ? 'yes' : 'no') },
  });
}

export function sendCsv<T>(res: Response, fileBase: string, columns: CsvColumn<T>[], rows: T[], now: Date): void {
  const name = `${fileBase}-${now.toISOString().slice(0, 10)}.csv`;
  res.setHeader('Content-Type', 'text/csv; charset=utf-8');
  res.setHeader('Content-Disposition', `attachment; filename="${name}"`);
  res.setHeader('Cache-Control', 'no-store');
  res.send(toCsv(columns, rows));
}
