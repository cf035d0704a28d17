// Trail entries in words, for the trail page, the record timelines and the
// finding record PDF alike: the event's label, and each change as a field label
// with its value before and after; ids become names ("Area: Structures Bay"),
// codes become labels, lists are counted or named, and no JSON is ever shown.
import type { PresentedTrailEntryView, TrailChangeLine, TrailEntryView } from '../../shared/schemas/trail';
import {
  CONTAINMENT_DECISION_LABELS,
  EQUIPMENT_KIND_LABELS,
  EQUIPMENT_STATUS_LABELS,
  INSPECTION_RESULT_LABELS,
  VERDICT_LABELS,
  fieldLabel,
  findingClassLabel,
  formatNumber,
  humanizeCode,
  recordTypeLabel,
  roleLabel,
  rootCauseMethodLabel,
  ruleLabel,
  stateLabel,
  trailEventLabel,
  UNIT_SUFFIXES,
  formatHz,
} from '../../shared/labels';
import { formatDate, formatDateTime, formatUtcDateTime } from '../../shared/format/dates';

/** The kinds of record an id in a trail entry can point to. */
export type RefKind = 'user' | 'area' | 'technique' | 'revision' | 'audit' | 'finding' | 'action' | 'equipment' | 'inspection';

export const REFERENCE_KEYS: Readonly<Record<string, RefKind>> = {
  areaId: 'area',
  ownerId: 'user',
  leadAuditorId: 'user',
  authorId: 'user',
  userId: 'user',
  inspectorId: 'user',
  updatedById: 'user',
  createdById: 'user',
  approvedById: 'user',
  leadUserId: 'user',
  decidedById: 'user',
  performerIds: 'user',
  techniqueId: 'technique',
  revisionId: 'revision',
  techniqueRevisionId: 'revision',
  revisionIds: 'revision',
  auditId: 'audit',
  findingId: 'finding',
  extentOfId: 'finding',
  findingIds: 'finding',
  actionId: 'action',
  equipmentId: 'equipment',
  instrumentId: 'equipment',
  probeId: 'equipment',
  referenceStandardId: 'equipment',
  equipmentIds: 'equipment',
  inspectionIds: 'inspection',
};

/** Names of referenced records by kind and id, loaded once for a batch of entries. */
export type TrailNames = Map<RefKind, Map<string, string>>;

const HIDDEN_KEYS = new Set(['password', 'version', 'snapshot', 'storageKey', 'id']);
const COUNTED_ONLY: ReadonlySet<RefKind> = new Set(['inspection']);
const MAX_TEXT = 400;
const MAX_LIST = 8;
const ISO_DAY = /^\d{4}-\d{2}-\d{2}$/;
const ISO_TIME = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}/;
const CAUSED_BY = /^([A-Z_]+) on ([a-z_-]+) (\d+)$/;

const isPlainObject = (value: unknown): value is Record<string, unknown> => typeof value === 'object' && value !== null && !Array.isArray(value);
const truncate = (text: string) => (text.length > MAX_TEXT ? `${text.slice(0, MAX_TEXT)}…` : text);
const plural = (count: number, one: string) => `${count} ${count === 1 ? one : `${one}s`}`;

/** Collects the ids each entry refers to, so the caller can load their names in one query per kind. */
export function referencedIds(entries: TrailEntryView[]): Map<RefKind, Set<string>> {
  const wanted = new Map<RefKind, Set<string>>();
  const add = (kind: RefKind, id: unknown) => {
    if (typeof id !== 'number' && typeof id !== 'string') return;
    if (!wanted.has(kind)) wanted.set(kind, new Set());
    wanted.get(kind)!.add(String(id));
  };
  const visit = (key: string, value: unknown, depth: number) => {
    const kind = REFERENCE_KEYS[key];
    if (kind) {
      const values = isPlainObject(value) && ('before' in value || 'from' in value) ? Object.values(value) : [value];
      for (const item of values) (Array.isArray(item) ? item : [item]).forEach((id) => add(kind, id));
      return;
    }
    if (key === 'causedBy' && typeof value === 'string') {
      const match = CAUSED_BY.exec(value);
      if (match && (match[2] === 'action' || match[2] === 'finding' || match[2] === 'audit')) add(match[2], match[3]);
    }
    if (isPlainObject(value) && depth < 2) for (const [sub, item] of Object.entries(value)) visit(sub, item, depth + 1);
  };
  for (const entry of entries) {
    if (isPlainObject(entry.changes)) for (const [key, value] of Object.entries(entry.changes)) visit(key, value, 0);
  }
  return wanted;
}

interface Context {
  names: TrailNames;
  timeZone: string;
}

const CODE_LABELS: Readonly<Record<string, (value: string) => string>> = {
  state: stateLabel,
  class: (value) => findingClassLabel(value),
  proposedClass: (value) => findingClassLabel(value),
  method: rootCauseMethodLabel,
  rule: ruleLabel,
  failedRules: ruleLabel,
  verdict: (value) => (VERDICT_LABELS as Record<string, string>)[value] ?? humanizeCode(value),
  decision: (value) => (CONTAINMENT_DECISION_LABELS as Record<string, string>)[value] ?? humanizeCode(value),
  result: (value) => (INSPECTION_RESULT_LABELS as Record<string, string>)[value] ?? humanizeCode(value),
  role: roleLabel,
  roles: roleLabel,
  kind: (value) => (EQUIPMENT_KIND_LABELS as Record<string, string>)[value] ?? humanizeCode(value),
  status: (value) => (EQUIPMENT_STATUS_LABELS as Record<string, string>)[value] ?? humanizeCode(value),
  recordType: recordTypeLabel,
  attempted: (value) => humanizeCode(value),
};

function referenceName(kind: RefKind, id: unknown, context: Context): string {
  if (id === null || id === undefined || id === '') return '—';
  return context.names.get(kind)?.get(String(id)) ?? `${recordTypeLabel(kind === 'revision' ? 'technique' : kind)} no longer on record`;
}

function formatScalar(key: string, value: unknown, context: Context): string {
  if (value === null || value === undefined || value === '') return '—';
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  if (typeof value === 'number') {
    if (/Hz$/.test(key)) return formatHz(value);
    const unit = UNIT_SUFFIXES.find(([pattern]) => pattern.test(key))?.[1] ?? (/Bytes$/.test(key) ? ' bytes' : '');
    return `${formatNumber(value)}${unit}`;
  }
  if (typeof value === 'string') {
    if (/sha256|hash/i.test(key)) return `SHA-256 ${value.slice(0, 16)}…`;
    const code = CODE_LABELS[key];
    if (code) return code(value);
    if (ISO_DAY.test(value)) return formatDate(value);
    if (ISO_TIME.test(value)) return formatDateTime(value, context.timeZone);
    return truncate(value);
  }
  return summarise(key, value, context);
}

/** A value that is a list or an object, in one short phrase. */
function summarise(key: string, value: unknown, context: Context): string {
  if (Array.isArray(value)) {
    if (!value.length) return 'none';
    if (value.every((item) => !isPlainObject(item) && !Array.isArray(item))) {
      const shown = value.slice(0, MAX_LIST).map((item) => formatScalar(key, item, context));
      return value.length > MAX_LIST ? `${shown.join(', ')} and ${value.length - MAX_LIST} more` : shown.join(', ');
    }
    const named = value.map((item) => (isPlainObject(item) ? (item.description ?? item.label ?? item.name ?? item.title) : null)).filter((item): item is string => typeof item === 'string');
    if (named.length === value.length && value.length <= MAX_LIST) return named.map(truncate).join('; ');
    return plural(value.length, 'entry').replace('entrys', 'entries');
  }
  if (isPlainObject(value)) {
    const parts = Object.entries(value)
      .filter(([sub]) => !HIDDEN_KEYS.has(sub))
      .map(([sub, item]) => `${fieldLabel(sub).toLowerCase()} ${isPlainObject(item) || Array.isArray(item) ? summariseShallow(item) : formatValue(sub, item, context)}`);
    return parts.join(', ');
  }
  return String(value);
}

const summariseShallow = (item: unknown) => (Array.isArray(item) ? plural(item.length, 'item') : `${Object.keys(item as object).length} details`);

function formatValue(key: string, value: unknown, context: Context): string {
  const kind = REFERENCE_KEYS[key];
  if (kind) {
    if (Array.isArray(value)) {
      if (COUNTED_ONLY.has(kind) || value.length > MAX_LIST) return plural(value.length, kind === 'revision' ? 'technique revision' : kind === 'equipment' ? 'item' : kind);
      return value.length ? value.map((id) => referenceName(kind, id, context)).join(', ') : 'none';
    }
    return referenceName(kind, value, context);
  }
  if (key === 'causedBy' && typeof value === 'string') {
    const match = CAUSED_BY.exec(value);
    if (match) {
      const [, event, type, id] = match;
      const name = type === 'action' || type === 'finding' || type === 'audit' ? context.names.get(type)?.get(id) : undefined;
      return `${trailEventLabel(type, event)} on ${recordTypeLabel(type).toLowerCase()} ${name ?? id}`;
    }
  }
  return formatScalar(key, value, context);
}

function signatureLine(value: Record<string, unknown>): TrailChangeLine {
  const role = typeof value.role === 'string' ? roleLabel(value.role) : null;
  const parts = [
    typeof value.meaning === 'string' ? `“${value.meaning}”` : 'Signed',
    role ? `as ${role}` : null,
    typeof value.signedAt === 'string' ? formatUtcDateTime(value.signedAt) : null,
    typeof value.contentHash === 'string' ? `signed content SHA-256 ${value.contentHash.slice(0, 16)}…` : null,
  ].filter(Boolean);
  return { label: 'Signature', value: parts.join(' · ') };
}

function changeLines(changes: unknown, context: Context, prefix = '', depth = 0): TrailChangeLine[] {
  if (!isPlainObject(changes)) return [];
  const lines: TrailChangeLine[] = [];
  for (const [key, value] of Object.entries(changes)) {
    if (HIDDEN_KEYS.has(key)) continue;
    const label = prefix ? `${prefix}, ${fieldLabel(key).toLowerCase()}` : fieldLabel(key);
    if (key === 'signature' && isPlainObject(value)) {
      lines.push(signatureLine(value));
    } else if (isPlainObject(value) && 'before' in value && 'after' in value) {
      lines.push({ label, before: formatValue(key, value.before, context), after: formatValue(key, value.after, context) });
    } else if (isPlainObject(value) && 'from' in value && 'to' in value && Object.keys(value).length === 2) {
      lines.push({ label, before: formatValue(key, value.from, context), after: formatValue(key, value.to, context) });
    } else if (isPlainObject(value) && !REFERENCE_KEYS[key] && depth < 1) {
      lines.push(...changeLines(value, context, label, depth + 1));
    } else {
      lines.push({ label, value: formatValue(key, value, context) });
    }
  }
  return lines;
}

export function presentTrailEntry(entry: TrailEntryView, names: TrailNames, timeZone: string): PresentedTrailEntryView {
  return {
    ...entry,
    eventLabel: trailEventLabel(entry.recordType, entry.event),
    recordLabel: recordTypeLabel(entry.recordType),
    details: changeLines(entry.changes, { names, timeZone }),
  };
}

/** A change line as one sentence, for PDFs and plain text. */
export function changeLineText(line: TrailChangeLine): string {
  return line.value !== undefined ? `${line.label}: ${line.value}` : `${line.label}: ${line.before ?? '—'} → ${line.after ?? '—'}`;
}
