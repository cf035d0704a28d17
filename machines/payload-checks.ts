// Small pure checks that the machines' guards share. The server validates every
// body with zod first; these keep the machines safe on their own (a guard must
// refuse a blank reason even if a caller forgot the schema).

/** True for a string that holds something other than white space. */
export function isNonBlank(text: unknown): text is string {
  return typeof text === 'string' && text.trim() !== '';
}

const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

/**
 * True for a calendar date written `YYYY-MM-DD` that exists (2026-02-30 does
 * not). Due dates are whole days, so they compare correctly as strings.
 */
export function isIsoDate(text: unknown): text is string {
  if (typeof text !== 'string') return false;
  const match = ISO_DATE.exec(text);
  if (!match) return false;
  const [, year, month, day] = match.map(Number);
  const date = new Date(Date.UTC(year, month - 1, day));
  return date.getUTCFullYear() === year && date.getUTCMonth() === month - 1 && date.getUTCDate() === day;
}

/** The day after an ISO date, as an ISO date (used for probe events). */
export function nextIsoDate(isoDate: string): string {
  const date = new Date(`${isoDate}T00:00:00Z`);
  date.setUTCDate(date.getUTCDate() + 1);
  return date.toISOString().slice(0, 10);
}

/** A count the server computed: a non-negative whole number. */
export function isCount(value: unknown): value is number {
  return typeof value === 'number' && Number.isInteger(value) && value >= 0;
}
