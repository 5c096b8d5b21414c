// accounts: sign up, sign in, e-mail verification and password reset.
// tokens are mailed once and kept only as their sha256 (tokens.ts).
import { and, eq, gt, isNull } from 'drizzle-orm';
import { generateIdFromEntropySize } from 'lucia';
import { PUBLIC_BASE_URL } from 'astro:env/server';
import { db } from '../db';
import { emailTokens, users, type User } from '../db/schema';
import { hashPassword, verifyPassword } from './password';
import { lucia } from './lucia';
import { clearFailures, lockedFor, recordFailure } from './rateLimit';
import { hashToken, tokenPair, DAY_MS, HOUR_MS } from '../tokens';
import { sendMail } from '../mail';
import { audit } from '../audit';

export const VERIFY_LIFETIME_MS = 48 * HOUR_MS;
export const RESET_LIFETIME_MS = 1 * HOUR_MS;

export type Outcome<T> = { ok: true; value: T } | { ok: false; status: number; code: string; message: string; fields?: Record<string, string> };

const fail = (status: number, code: string, message: string, fields?: Record<string, string>) => ({ ok: false as const, status, code, message, fields });

export async function userByEmail(email: string): Promise<User | null> {
  const rows = await db.select().from(users).where(eq(users.email, email.toLowerCase())).limit(1);
  return rows[0] ?? null;
}

/** a new account; `verified` when the address was already proved (an accepted invitation) */
export async function createUser(input: { name: string; email: string; password: string; verified?: boolean }): Promise<Outcome<User>> {
  const email = input.email.toLowerCase();
  if (await userByEmail(email)) {
    return fail(409, 'email_taken', 'An account with this e-mail already exists.', { email: 'An account with this e-mail already exists; sign in instead' });
  }
  const id = generateIdFromEntropySize(10);
  const passwordHash = await hashPassword(input.password);
  try {
    await db.insert(users).values({ id, email, name: input.name, passwordHash, emailVerifiedAt: input.verified ? new Date() : null });
  } catch (err) {
    if (String((err as { code?: string }).code) === 'ER_DUP_ENTRY') {
      return fail(409, 'email_taken', 'An account with this e-mail already exists.', { email: 'An account with this e-mail already exists; sign in instead' });
    }
    throw err;
  }
  const user = (await db.select().from(users).where(eq(users.id, id)).limit(1))[0];
  await audit({ action: 'sign_up', actorId: id, target: email });
  return { ok: true, value: user };
}

/** make a single-use token for the user and return it (only the hash is stored) */
async function issueToken(userId: string, purpose: 'verify' | 'reset', lifetimeMs: number): Promise<string> {
  const { token, hash } = tokenPair();
  await db.insert(emailTokens).values({ userId, purpose, tokenHash: hash, expiresAt: new Date(Date.now() + lifetimeMs) });
  return token;
}

/** take a token: valid, unused and unexpired; marks it used in the same statement */
async function consumeToken(token: string, purpose: 'verify' | 'reset'): Promise<{ userId: string } | null> {
  const hash = hashToken(token);
  const rows = await db
    .select()
    .from(emailTokens)
    .where(and(eq(emailTokens.tokenHash, hash), eq(emailTokens.purpose, purpose)))
    .limit(1);
  const row = rows[0];
  if (!row || row.usedAt || row.expiresAt.getTime() <= Date.now()) return null;
  const [res] = await db
    .update(emailTokens)
    .set({ usedAt: new Date() })
    .where(and(eq(emailTokens.id, row.id), isNull(emailTokens.usedAt), gt(emailTokens.expiresAt, new Date())));
  // another request took it first
  if ((res as { affectedRows?: number }).affectedRows !== 1) return null;
  return { userId: row.userId };
}

export async function sendVerification(user: Pick<User, 'id' | 'email' | 'name'>): Promise<void> {
  const token = await issueToken(user.id, 'verify', VERIFY_LIFETIME_MS);
  const url = `${PUBLIC_BASE_URL}/verify/${token}`;
  await sendMail({
    to: user.email,
    subject: 'Confirm your e-mail address for Wallpulse',
    purpose: 'verify',
    text: `Hello ${user.name},\n\nconfirm that this address is yours by opening the link below. It works once and expires in 48 hours.\n\n${url}\n\nIf you did not sign up for Wallpulse, ignore this message.\n`,
  });
}

export async function verifyEmail(token: string): Promise<Outcome<{ userId: string }>> {
  const taken = await consumeToken(token, 'verify');
  if (!taken) return fail(410, 'token_invalid', 'This confirmation link is not valid: it was used already, has expired, or was mistyped.');
  await db.update(users).set({ emailVerifiedAt: new Date() }).where(and(eq(users.id, taken.userId), isNull(users.emailVerifiedAt)));
  return { ok: true, value: taken };
}

/** check the password; counts failures per e-mail + IP and writes the audit rows */
export async function signIn(email: string, password: string, ip: string): Promise<Outcome<User>> {
  const wait = lockedFor(email, ip);
  if (wait > 0) {
    await audit({ action: 'sign_in_failed', target: email, ip, success: false, detail: { reason: 'rate_limited' } });
    const minutes = Math.ceil(wait / 60);
    return fail(429, 'rate_limited', `Too many failed sign-ins for this address. Try again in ${minutes} minute${minutes === 1 ? '' : 's'}, or reset your password.`);
  }
  const user = await userByEmail(email);
  // verify against a hash even for an unknown address, so the answer takes as long either way
  const ok = user ? await verifyPassword(user.passwordHash, password) : (await verifyPassword(await dummyHash(), password), false);
  if (!user || !ok) {
    recordFailure(email, ip);
    await audit({ action: 'sign_in_failed', actorId: user?.id ?? null, target: email, ip, success: false, detail: { reason: user ? 'wrong_password' : 'unknown_email' } });
    return fail(401, 'bad_credentials', 'That e-mail and password do not match an account.', { password: 'E-mail or password is wrong' });
  }
  clearFailures(email, ip);
  await audit({ action: 'sign_in', actorId: user.id, target: email, ip });
  return { ok: true, value: user };
}

// an argon2id hash of a random string, checked for unknown addresses
let dummy: Promise<string> | null = null;
const dummyHash = () => (dummy ??= hashPassword(tokenPair().token));

/** always answers the same, whether or not the address has an account */
export async function requestPasswordReset(email: string): Promise<void> {
  const user = await userByEmail(email);
  if (!user) return;
  const token = await issueToken(user.id, 'reset', RESET_LIFETIME_MS);
  const url = `${PUBLIC_BASE_URL}/reset/${token}`;
  await sendMail({
    to: user.email,
    subject: 'Reset your Wallpulse password',
    purpose: 'reset',
    text: `Hello ${user.name},\n\nsomeone asked to reset the password of your Wallpulse account. Open the link below to choose a new one. It works once and expires in 1 hour.\n\n${url}\n\nIf it was not you, ignore this message; your password stays as it is.\n`,
  });
}

/** a valid, unused reset token (without using it up): for the reset page */
export async function resetTokenValid(token: string): Promise<boolean> {
  const rows = await db
    .select({ usedAt: emailTokens.usedAt, expiresAt: emailTokens.expiresAt })
    .from(emailTokens)
    .where(and(eq(emailTokens.tokenHash, hashToken(token)), eq(emailTokens.purpose, 'reset')))
    .limit(1);
  return Boolean(rows[0] && !rows[0].usedAt && rows[0].expiresAt.getTime() > Date.now());
}

/** set a new password with a reset token; every session of the user ends */
export async function resetPassword(token: string, password: string, ip: string): Promise<Outcome<{ userId: string }>> {
  const taken = await consumeToken(token, 'reset');
  if (!taken) return fail(410, 'token_invalid', 'This reset link is not valid: it was used already, has expired (links last 1 hour), or was mistyped.');
  const passwordHash = await hashPassword(password);
  // the link proved the mailbox, so the address counts as confirmed too
  await db.update(users).set({ passwordHash }).where(eq(users.id, taken.userId));
  await db.update(users).set({ emailVerifiedAt: new Date() }).where(and(eq(users.id, taken.userId), isNull(users.emailVerifiedAt)));
  await lucia.invalidateUserSessions(taken.userId);
  await audit({ action: 'password_reset', actorId: taken.userId, ip });
  return { ok: true, value: taken };
}

export { DAY_MS };
