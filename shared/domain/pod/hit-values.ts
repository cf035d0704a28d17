// How a hit/miss outcome may be written in a file or a form.
const HIT = new Set(['1', 'yes', 'y', 'hit', 'true', 'found']);
const MISS = new Set(['0', 'no', 'n', 'miss', 'false', 'missed']);

/** true for a hit, false for a miss, null when the text is neither. */
export function parseHit(text: string): boolean | null {
  const value = text.trim().toLowerCase();
  if (HIT.has(value)) return true;
  if (MISS.has(value)) return false;
  return null;
}

export const HIT_VALUES_TEXT = '1/0, yes/no, hit/miss or true/false';
