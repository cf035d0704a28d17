// Passwords are checked against a list of common and breached passwords
// (NIST SP 800-63B §5.1.1.2): the ~49,000 most common passwords of public
// breach corpora that @zxcvbn-ts/language-common ships (MIT licence, offline),
// plus repetitive or sequential text, the person's own e-mail, and the demo
// password, which only the demo data may use. No composition rules.
import { dictionary } from '@zxcvbn-ts/language-common';
import { DEMO_PASSWORD } from '../db/seed/seed-context';

const COMMON = new Set(dictionary['passwords-common'].map((password) => password.toLowerCase()));

export const COMMON_PASSWORD_MESSAGE = 'this password is on a list of common or breached passwords; choose a longer phrase of your own';

function isRepetitive(text: string): boolean {
  return /^(.{1,4})\1+$/u.test(text);
}

function isSequential(text: string): boolean {
  const codes = [...text].map((char) => char.codePointAt(0)!);
  const step = codes[1] - codes[0];
  return Math.abs(step) === 1 && codes.every((code, index) => index === 0 || code - codes[index - 1] === step);
}

/** Why a new password is refused, as a message for the password field; null when it may be used. */
export function passwordProblem(password: string, { email }: { email?: string } = {}): string | null {
  const folded = password.toLowerCase();
  if (folded.includes(DEMO_PASSWORD)) return 'this is the published demo password; choose a password of your own';
  // "password1234", "dragon!!!!2026": a listed password with digits or symbols added is still listed.
  const stem = folded.replace(/[\d\W_]+$/u, '').replace(/^[\d\W_]+/u, '');
  if (COMMON.has(folded) || (stem.length >= 4 && COMMON.has(stem))) return COMMON_PASSWORD_MESSAGE;
  if (isRepetitive(folded) || isSequential(folded)) return 'this password is a repeated or sequential run of characters; choose a phrase of your own';
  if (email) {
    const address = email.trim().toLowerCase();
    const local = address.split('@')[0];
    if (folded.includes(address) || folded.replace(/[\d\W_]+/gu, '') === local.replace(/[\d\W_]+/gu, '')) {
      return 'this password is your e-mail address; choose a phrase of your own';
    }
  }
  return null;
}
