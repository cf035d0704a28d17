// One way of writing dates and times everywhere Whorl shows them (screens, PDFs,
// e-mails, CSV exports): "2 Dec 2026" for calendar dates, "2 Dec 2026, 14:05 CET"
// for moments in the organisation's time zone, and "2 Dec 2026, 13:05 UTC" on
// signatures, which are always stated in UTC. Calendar dates (due dates, planned
// days) are days, not moments: they are never shifted by a time zone.

export const DEFAULT_TIME_ZONE = 'UTC';

const ISO_DAY = /^(\d{4})-(\d{2})-(\d{2})$/;
const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/** True when the IANA zone name is known to this runtime (Europe/Berlin, UTC, …). */
export function isValidTimeZone(timeZone: string): boolean {
  try {
    new Intl.DateTimeFormat('en-GB', { timeZone }).format(0);
    return true;
  } catch {
    return false;
  }
}

const toDate = (value: Date | string | number) => (value instanceof Date ? value : new Date(value));

const partsCache = new Map<string, Intl.DateTimeFormat>();
function formatter(timeZone: string): Intl.DateTimeFormat {
  let cached = partsCache.get(timeZone);
  if (!cached) {
    cached = new Intl.DateTimeFormat('en-GB', {
      timeZone,
      year: 'numeric',
      month: 'numeric',
      day: 'numeric',
      hour: '2-digit',
      minute: '2-digit',
      hourCycle: 'h23',
      timeZoneName: 'short',
    });
    partsCache.set(timeZone, cached);
  }
  return cached;
}

function zoned(date: Date, timeZone: string) {
  const parts = Object.fromEntries(formatter(timeZone).formatToParts(date).map((part) => [part.type, part.value]));
  return {
    year: Number(parts.year),
    month: Number(parts.month),
    day: Number(parts.day),
    time: `${parts.hour}:${parts.minute}`,
    zone: timeZone === 'UTC' || timeZone === 'Etc/UTC' ? 'UTC' : (parts.timeZoneName ?? timeZone),
  };
}

const dayText = (year: number, month: number, day: number) => `${day} ${MONTHS[month - 1]} ${year}`;

/**
 * A calendar date: "2026-12-02" → "2 Dec 2026". A moment (Date or ISO time) is
 * shown as its day in the given zone. Empty values print as a dash.
 */
export function formatDate(value: Date | string | null | undefined, timeZone = DEFAULT_TIME_ZONE): string {
  if (value === null || value === undefined || value === '') return '—';
  if (typeof value === 'string') {
    const day = ISO_DAY.exec(value);
    if (day) return dayText(Number(day[1]), Number(day[2]), Number(day[3]));
  }
  const date = toDate(value);
  if (Number.isNaN(date.getTime())) return String(value);
  const z = zoned(date, timeZone);
  return dayText(z.year, z.month, z.day);
}

/** A moment in the organisation's zone: "2 Dec 2026, 14:05 CET". */
export function formatDateTime(value: Date | string | number | null | undefined, timeZone = DEFAULT_TIME_ZONE): string {
  if (value === null || value === undefined || value === '') return '—';
  const date = toDate(value);
  if (Number.isNaN(date.getTime())) return String(value);
  const z = zoned(date, timeZone);
  return `${dayText(z.year, z.month, z.day)}, ${z.time} ${z.zone}`;
}

/** A signature's moment, always in UTC: "2 Dec 2026, 13:05 UTC". */
export function formatUtcDateTime(value: Date | string | number | null | undefined): string {
  return formatDateTime(value, 'UTC');
}

/** A signature's moment with the local time beside it when the organisation is not on UTC. */
export function formatSignatureTime(value: Date | string | number | null | undefined, timeZone = DEFAULT_TIME_ZONE): string {
  const utc = formatUtcDateTime(value);
  if (utc === '—' || timeZone === 'UTC' || timeZone === 'Etc/UTC') return utc;
  return `${utc} (${formatDateTime(value, timeZone)})`;
}
