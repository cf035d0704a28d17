import { hash, verify } from '@node-rs/argon2';

// Argon2id with the parameters OWASP lists as a minimum (19 MiB, t=2, p=1).
const OPTIONS = { algorithm: 2 /* Algorithm.Argon2id (a const enum) */, memoryCost: 19_456, timeCost: 2, parallelism: 1 } as const;

export const PASSWORD_MIN_LENGTH = 12;
export const PASSWORD_MAX_LENGTH = 128;

export function hashPassword(password: string): Promise<string> {
  return hash(password, OPTIONS);
}

let dummyHash: Promise<string> | undefined;

/** Verifies a password; with no stored hash it still spends the same time, so unknown e-mails are not revealed by timing. */
export async function verifyPassword(storedHash: string | null, password: string): Promise<boolean> {
  if (!storedHash) {
    dummyHash ??= hashPassword('not-a-real-password-for-timing');
    await verify(await dummyHash, password).catch(() => false);
    return false;
  }
  return verify(storedHash, password).catch(() => false);
}
