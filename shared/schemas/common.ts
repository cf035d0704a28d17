import { z } from 'zod';

export const IdParamSchema = z.object({ id: z.coerce.number().int().positive() }).strict();

/** Rows a list page holds when the address names no page size (server and client alike). */
export const DEFAULT_PAGE_SIZE = 25;

/** The common list query: page, pageSize, sort ("field" or "-field" for descending) and q. */
export const ListQueryBaseSchema = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(DEFAULT_PAGE_SIZE),
  sort: z
    .string()
    .regex(/^-?[a-zA-Z][a-zA-Z0-9]*$/, 'sort must be a field name, optionally prefixed with "-"')
    .optional(),
  q: z.string().trim().max(200).optional(),
});

export type ListQuery = z.infer<typeof ListQueryBaseSchema>;

export interface ListResponse<T> {
  items: T[];
  total: number;
}

export const IsoDateSchema = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'use a date like 2026-12-31');

/** Parses a "field" / "-field" sort against an allow-list; falls back to the default. */
export function parseSort<T extends string>(sort: string | undefined, allowed: readonly T[], fallback: `${'' | '-'}${T}`) {
  const value = sort && allowed.includes(sort.replace(/^-/, '') as T) ? sort : fallback;
  const descending = value.startsWith('-');
  return { field: value.replace(/^-/, '') as T, direction: descending ? ('DESC' as const) : ('ASC' as const) };
}

/**
 * Text must be well-formed UTF-16: a lone surrogate ("\ud800", which JSON can
 * carry) has no UTF-8 form, so the database and the trail's hash cannot take it.
 */
export function isWellFormedText(value: string): boolean {
  // String.prototype.isWellFormed is Node 20+ and every current browser.
  return (value as string & { isWellFormed(): boolean }).isWellFormed();
}

export const ILL_FORMED_TEXT_MESSAGE = 'contains a broken character (a lone UTF-16 surrogate); retype or paste the text again';

/** A string schema that refuses ill-formed UTF-16; the server also checks every request body with findIllFormedText. */
export const TextSchema = z.string().refine(isWellFormedText, ILL_FORMED_TEXT_MESSAGE);

/** The path of the first ill-formed string anywhere in a value (keys included), or null. */
export function findIllFormedText(value: unknown, path: string[] = [], depth = 0): string | null {
  if (typeof value === 'string') return isWellFormedText(value) ? null : path.join('.') || '(body)';
  if (depth > 32 || value === null || typeof value !== 'object') return null;
  for (const [key, item] of Object.entries(value as Record<string, unknown>)) {
    if (!isWellFormedText(key)) return [...path, '(a field name)'].join('.');
    const found = findIllFormedText(item, [...path, key], depth + 1);
    if (found) return found;
  }
  return null;
}
