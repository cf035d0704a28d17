// Revision identifiers of a written technique: letters (A, B, … Z, AA, AB, …) or
// numbers (1, 2, …), optionally dotted (2.1 → 2.2). The next revision follows the
// form of the last one, so a register that counts in letters keeps counting in letters.

/** What a revision identifier may look like (also safe in a URL path). */
export const REVISION_PATTERN = /^[A-Za-z0-9.-]{1,20}$/;

function nextLetters(letters: string): string {
  const upper = letters === letters.toUpperCase();
  const chars = letters.toUpperCase().split('');
  let i = chars.length - 1;
  while (i >= 0) {
    if (chars[i] === 'Z') {
      chars[i] = 'A';
      i -= 1;
    } else {
      chars[i] = String.fromCharCode(chars[i].charCodeAt(0) + 1);
      break;
    }
  }
  const next = (i < 0 ? 'A' : '') + chars.join('');
  return upper ? next : next.toLowerCase();
}

/** The revision after `current`; skips identifiers already in `taken`. */
export function nextRevision(current: string, taken: ReadonlySet<string> = new Set()): string {
  let candidate = current;
  do {
    if (/^[A-Za-z]+$/.test(candidate)) candidate = nextLetters(candidate);
    else if (/^\d+$/.test(candidate)) candidate = String(Number(candidate) + 1);
    else {
      const match = /^(.*?)(\d+)$/.exec(candidate);
      candidate = match ? `${match[1]}${Number(match[2]) + 1}` : `${candidate}-1`;
    }
  } while (taken.has(candidate));
  return candidate;
}
