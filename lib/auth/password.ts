import { hash, verify } from '@node-rs/argon2';

// Argon2id with the OWASP Password Storage Cheat Sheet's baseline (m = 19 MiB, t = 2, p = 1).
const ARGON2_OPTIONS = { memoryCost: 19_456, timeCost: 2, parallelism: 1 } as const;

export function hashPassword(password: string): Promise<string> {
  return hash(password, ARGON2_OPTIONS);
}

export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash, password);
  } catch {
    return false; // a malformed stored hash is a failed sign-in, never a crash
  }
}

const COMMON_PASSWORDS = new Set([
  'password', 'password1', 'password123', '1234567890', '12345678910', 'qwertyuiop', 'letmein123', 'iloveyou12',
  'welcome123', 'admin12345', 'ohmstead123', 'changeme123', 'abcdefghij', '0987654321', '1111111111',
]);

/** Returns a plain-language problem with a password, or null when it is acceptable (NIST SP 800-63B: length, blocklist). */
export function passwordProblem(password: string, email: string): string | null {
  if (password.length < 10) return 'Use at least 10 characters.';
  if (password.length > 200) return 'Use at most 200 characters.';
  if (COMMON_PASSWORDS.has(password.toLowerCase())) return 'This password is too common; choose another.';
  if (/^(.)\1+$/.test(password)) return 'Do not repeat one character.';
  const local = email.split('@')[0]?.toLowerCase() ?? '';
  if (local.length >= 4 && password.toLowerCase().includes(local)) return 'Do not use your e-mail address in the password.';
  return null;
}
