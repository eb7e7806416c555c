import { afterAll, describe, expect, it } from 'vitest';
import { db } from '@/lib/db';
import { registerUser } from '@/lib/users/register-user';
import { findUserByEmail } from '@/lib/users/repo';
import { signInWithPassword, TooManyAttemptsError } from '@/lib/auth/sign-in-with-password';
import { requestPasswordReset, resetPassword } from '@/lib/auth/password-reset';
import { AppError } from '@/lib/errors';
import { waitForMail } from '@/tests/support/mailbox';
import { uniqueEmail } from '@/tests/support/unique';

afterAll(async () => {
  await db().destroy();
  (globalThis as { ohmsteadDb?: unknown }).ohmsteadDb = undefined;
});

async function expectFieldError(promise: Promise<unknown>, field: string): Promise<AppError> {
  const error = await promise.then(() => undefined, (e: unknown) => e);
  expect(error).toBeInstanceOf(AppError);
  expect((error as AppError).details?.fieldErrors?.[field]).toBeTruthy();
  return error as AppError;
}

describe('sign-up', () => {
  it('stores a user with an Argon2id hash, never the password', async () => {
    const email = uniqueEmail();
    await registerUser({ name: 'Wren Tallis', email, password: 'four wires beat two' });
    const row = await findUserByEmail(email);
    expect(row?.name).toBe('Wren Tallis');
    expect(row?.password_hash).toMatch(/^\$argon2id\$v=19\$m=19456,t=2,p=1\$/);
    expect(row?.password_hash).not.toContain('four wires');
  });

  it('rejects a malformed e-mail with a field error and stores nothing', async () => {
    const before = await db()('users').count({ n: '*' }).first();
    const error = await expectFieldError(registerUser({ name: 'Wren', email: 'not-an-address', password: 'four wires beat two' }), 'email');
    expect(error.code).toBe('validation_failed');
    const after = await db()('users').count({ n: '*' }).first();
    expect(Number(after?.n)).toBe(Number(before?.n));
  });

  it.each([
    ['short', 'Use at least 10 characters.'],
    ['password123', 'This password is too common; choose another.'],
    ['aaaaaaaaaaaa', 'Do not repeat one character.'],
  ])('rejects the weak password %j', async (password, message) => {
    const email = uniqueEmail();
    const error = await expectFieldError(registerUser({ name: 'Wren', email, password }), 'password');
    expect(error.details?.fieldErrors?.password).toBe(message);
    expect(await findUserByEmail(email)).toBeUndefined();
  });

  it('refuses a second account for the same address', async () => {
    const email = uniqueEmail();
    await registerUser({ name: 'Arlo Venn', email, password: 'a long enough passphrase' });
    const error = await expectFieldError(registerUser({ name: 'Bea Venn', email: email.toUpperCase(), password: 'another long passphrase' }), 'email');
    expect(error.code).toBe('conflict');
  });
});

describe('password sign-in', () => {
  it('accepts the right password and refuses a wrong one', async () => {
    const email = uniqueEmail();
    await registerUser({ name: 'Sage Orrin', email, password: 'lock-in at 13.7 Hz' });
    const ok = await signInWithPassword({ email, password: 'lock-in at 13.7 Hz', ip: '127.0.0.9' });
    expect(ok).toMatchObject({ email, name: 'Sage Orrin', siteRole: 'user' });
    expect(await signInWithPassword({ email, password: 'lock-in at 50 Hz!', ip: '127.0.0.9' })).toBeNull();
    expect(await signInWithPassword({ email: uniqueEmail(), password: 'whatever it is', ip: '127.0.0.9' })).toBeNull();
  });

  it('throttles after 10 failures for one address, even with the right password', async () => {
    const email = uniqueEmail();
    await registerUser({ name: 'Bram Ostley', email, password: 'current reversal works' });
    for (let i = 0; i < 10; i += 1) {
      expect(await signInWithPassword({ email, password: `wrong guess ${i}`, ip: `127.1.0.${i}` })).toBeNull();
    }
    await expect(signInWithPassword({ email, password: 'current reversal works', ip: '127.1.1.1' })).rejects.toBeInstanceOf(TooManyAttemptsError);
  });
});

describe('password reset by e-mail', () => {
  it('mails a one-time link through the SMTP fake that sets a new password', async () => {
    const email = uniqueEmail('reset');
    await registerUser({ name: 'Pell Varden', email, password: 'the original phrase' });
    await requestPasswordReset(email);
    const mail = await waitForMail({ to: email, subject: /Reset your Ohmstead password/, timeoutMs: 10_000 });
    const link = mail.links.find((l) => l.includes('/reset-password/'));
    expect(link).toBeTruthy();
    const token = link!.split('/reset-password/')[1]!;
    await resetPassword(token, 'a brand new phrase');
    expect(await signInWithPassword({ email, password: 'a brand new phrase', ip: '127.2.0.1' })).toMatchObject({ email });
    expect(await signInWithPassword({ email, password: 'the original phrase', ip: '127.2.0.1' })).toBeNull();
    await expect(resetPassword(token, 'yet another phrase')).rejects.toThrow(/expired or was already used/);
  });

  it('answers the same for unknown addresses and sends nothing', async () => {
    const email = uniqueEmail('nobody');
    await expect(requestPasswordReset(email)).resolves.toBeUndefined();
    await expect(waitForMail({ to: email, timeoutMs: 1500 })).rejects.toThrow();
  });
});
