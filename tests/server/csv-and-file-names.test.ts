// CSV export as a spreadsheet would read it (OWASP CSV injection guidance) and
// file names as a person would read them (no bidirectional overrides).
import { describe, expect, it } from 'vitest';
import { parse } from 'csv-parse/sync';
import { csvCell, toCsv } from '../../server/lib/csv';
import { safeFileName } from '../../server/services/evidence-content';

const columns = [{ header: 'Value', value: (row: { value: string | number | null }) => row.value }];
const exported = (values: (string | number | null)[]) => toCsv(columns, values.map((value) => ({ value })));
/** The cells a spreadsheet sees, header first. */
const cellsOf = (text: string) => (parse(text.replace(/^\ufeff/, ''), { relax_quotes: false }) as string[][]).map((row) => row[0]);

describe('CSV export', () => {
  it('when a cell starts with =, +, -, @, tab or CR and is not a plain number, then it is escaped with a leading apostrophe', () => {
    const risky = ["-1+cmd|' /C calc'!A0", '=1+2', '+SUM(A1:A2)', '@SUM(1)', '\t=1+2', '\r=1+2', '-', '-x', '=HYPERLINK("http://x")'];
    expect(cellsOf(exported(risky)).slice(1)).toEqual(risky.map((value) => `'${value}`));
  });

  it('when a cell is a plain number, signed or not, then it stays a number', () => {
    const numbers = ['-12.5', '+3', '-0.001', '1e-3', '-2E+5', '42'];
    expect(cellsOf(exported(numbers)).slice(1)).toEqual(numbers);
    expect(csvCell(-12.5)).toBe(-12.5);
    expect(csvCell('-12.5')).toBe('-12.5');
  });

  it('when a cell holds a bare LF or CR, then every field is quoted so the line break stays inside its cell (no row starting with =)', () => {
    const text = exported(['first line\n=1+2', 'a\rb', 'plain']);
    const rows = parse(text.replace(/^\ufeff/, '')) as string[][];
    expect(rows).toEqual([['Value'], ['first line\n=1+2'], ['a\rb'], ['plain']]);
    // Record by record, split only at CRLF outside quotes: each record begins with a quote.
    for (const line of text.replace(/^\ufeff/, '').split('\r\n').filter(Boolean)) expect(line.startsWith('"')).toBe(true);
    expect(text).toContain('"first line\n=1+2"');
    expect(text).toContain('"plain"');
  });

  it('when a cell is empty or holds quotes, then it is quoted and its quotes doubled', () => {
    expect(exported([null, 'say "hi"'])).toBe('\ufeff"Value"\r\n""\r\n"say ""hi"""\r\n');
  });
});

describe('stored file names', () => {
  it('when a name carries bidirectional controls, then they are removed (the name reads as it is)', () => {
    expect(safeFileName('invoice\u202efdp.exe')).toBe('invoicefdp.exe');
    expect(safeFileName('\u2066report\u2069\u200e\u200f\u202a\u202b\u202c\u202d.pdf')).toBe('report.pdf');
    expect(safeFileName('\u202e')).toBe('evidence');
  });

  it('when a name is plain or non-Latin, then it is kept', () => {
    expect(safeFileName('Prüfbericht δ 0.38 mm.pdf')).toBe('Prüfbericht δ 0.38 mm.pdf');
    expect(safeFileName('تقرير.pdf')).toBe('تقرير.pdf');
  });

  it('when a long name is cut, then no half of a surrogate pair is left', () => {
    const name = safeFileName(`${'a'.repeat(195)}🧪🧪🧪.pdf`);
    expect((name as string & { isWellFormed(): boolean }).isWellFormed()).toBe(true);
    expect(name.endsWith('.pdf')).toBe(true);
  });
});
