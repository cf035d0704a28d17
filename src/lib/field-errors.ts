// The server's 400 details ({ path, message }) turned into what a person reads:
// each message at the field it names, the path translated into the field's own
// label when it has to be said elsewhere, and never a raw key such as
// "calibrationDueOn:", "coils[0].frequenciesHz[0]" or "(row)".
import { ApiError, type ApiErrorDetail } from './api-client';

/** Paths that name no field: the whole body, row or query. */
const WHOLE = /^\((body|row|query|path)\)$/;

/** "coils[0].frequenciesHz[0]" and "coils.0.frequenciesHz.0" both become ["coils", 0, "frequenciesHz", 0]. */
export function pathParts(path: string): (string | number)[] {
  if (WHOLE.test(path)) return [];
  return path
    .replace(/\[(\d+)\]/g, '.$1')
    .split('.')
    .filter(Boolean)
    .map((part) => (/^\d+$/.test(part) ? Number(part) : part));
}

/** "calibrationDueOn" → "calibration due on"; used only when a form gives no label of its own. */
function words(key: string): string {
  return key
    .replace(/Hz$/, '')
    .replace(/Id$/, '')
    .replace(/([a-z0-9])([A-Z])/g, '$1 $2')
    .replace(/_/g, ' ')
    .toLowerCase()
    .trim();
}

const singular = (text: string) => text.replace(/ies$/, 'y').replace(/s$/, '');
const capitalise = (text: string) => text.charAt(0).toUpperCase() + text.slice(1);

/**
 * The label of a path: a form's own label when it has one for the path (or its
 * first key), otherwise the keys in words with list positions counted from 1:
 * "coils.0.frequenciesHz.0" → "Coil 1, frequency 1".
 */
export function pathLabel(path: string, labels: Record<string, string> = {}): string {
  if (labels[path]) return labels[path];
  const parts = pathParts(path);
  if (!parts.length) return '';
  if (typeof parts[0] === 'string' && labels[parts[0]] && parts.length === 1) return labels[parts[0]];
  const out: string[] = [];
  for (let i = 0; i < parts.length; i += 1) {
    const part = parts[i];
    if (typeof part === 'number') continue;
    const next = parts[i + 1];
    const name = labels[part] ?? words(part);
    out.push(typeof next === 'number' ? `${singular(name)} ${next + 1}` : name);
  }
  return capitalise(out.join(', '));
}

/**
 * A schema message may start with its key and label ("frequenciesHz (test
 * frequency) must be …"); at the field the label is already on screen.
 */
export function messageAtField(message: string): string {
  return message.replace(/^[A-Za-z][\w.[\]]* \([^)]*\) /, '');
}

/** A message said away from its field: "Test frequency must be …". */
export function messageWithLabel(detail: ApiErrorDetail, labels: Record<string, string> = {}): string {
  const named = /^[A-Za-z][\w.[\]]* \(([^)]*)\) (.*)$/.exec(detail.message);
  if (named) return `${capitalise(named[1])} ${named[2]}`;
  const label = pathLabel(detail.path, labels);
  return label ? `${label}: ${detail.message}` : capitalise(detail.message);
}

export interface FormErrors {
  /** The message for a field (its path, or any path inside it). */
  at(field: string): string | undefined;
  /** Messages of paths no field of the form shows, each with its label. */
  unplaced: string[];
  /** The request failed on fields the form shows and marks. */
  hasFieldErrors: boolean;
}

/**
 * One helper for every form: `fields` are the paths the form shows, with their
 * labels (used when a message must be said away from its field).
 */
export function formErrors(error: unknown, fields: Record<string, string>): FormErrors {
  const details = error instanceof ApiError ? error.fieldErrors : [];
  const inside = (path: string, field: string) => path === field || path.startsWith(`${field}.`) || path.startsWith(`${field}[`);
  const placed = (path: string) => Object.keys(fields).some((field) => inside(path, field));
  return {
    at: (field) => {
      const detail = details.find((item) => inside(item.path, field));
      return detail ? messageAtField(detail.message) : undefined;
    },
    unplaced: details.filter((detail) => !placed(detail.path)).map((detail) => messageWithLabel(detail, fields)),
    hasFieldErrors: details.some((detail) => placed(detail.path)),
  };
}

/** An error in words for a notice: a validation error lists its fields by label instead of "Some body fields are not valid". */
export function errorInWords(error: unknown, labels: Record<string, string> = {}): string {
  if (error instanceof ApiError) {
    const details = error.fieldErrors;
    if (error.status === 400 && details.length) return details.map((detail) => messageWithLabel(detail, labels)).join('; ');
    return error.message;
  }
  return error instanceof Error ? error.message : String(error);
}
