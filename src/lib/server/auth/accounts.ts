// accounts: sign up, sign in, e-mail verification and password reset.
// tokens are mailed once and kept only as their sha256 (tokens.ts).
import { and, eq, gt, isNull } from 'drizzle-orm';
import { generateIdFromEntropySize } from 'lucia';
import { PUBLIC_BASE_URL } from 'astro:env/server';
import { db } from '../db';
import { emailTokens, users, type User } from '../db/schema';
import { hashPassword, verifyPassword } from './password';
import { lucia } from './lucia';
import { LIMITS, clearSignInFailures, limitKey, recordSignInFailure, signInWait, spendAll, tryAgainIn } from './rateLimit';
import { hashToken, tokenPair, DAY_MS, HOUR_MS } from '../tokens';
import { deliverNow, queueMail } from '../mail';
import { audit } from '../audit';

/**
 * Answers that must not tell whether an address has an account take at least this long
 * either way (the work behind them differs by a few database writes).
 */
const EVEN_ANSWER_MS = 250;
async function evenOut(startedAt: number): Promise<void> {
  const left = EVEN_ANSWER_MS - (Date.now() - startedAt);
  if (left > 0) await new Promise((r) => setTimeout(r, left));
}

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

function verificationMail(user: Pick<User, 'email' | 'name'>, token: string) {
  const url = `${PUBLIC_BASE_URL}/verify/${token}`;
  return {
    to: user.email,
    subject: 'Confirm your e-mail address for Wallpulse',
    purpose: 'verify',
    text: `Hello ${user.name},\n\nconfirm that this address is yours by opening the link below. It works once and expires in 48 hours.\n\n${url}\n\nIf you did not sign up for Wallpulse, ignore this message.\n`,
  };
}

/** queue a new confirmation link for the user (the worker sends it, unless forDeliverNow) */
export async function queueVerification(user: Pick<User, 'id' | 'email' | 'name'>, forDeliverNow = false): Promise<number> {
  const token = await issueToken(user.id, 'verify', VERIFY_LIFETIME_MS);
  return queueMail(verificationMail(user, token), { forDeliverNow });
}

/**
 * A signed-in person asks for the link again: limited per account, and sent at once so the
 * answer can say whether it went out. 'limited' carries the message to show.
 */
export async function resendVerification(user: Pick<User, 'id' | 'email' | 'name'>): Promise<{ sent: boolean; limited?: string }> {
  const wait = await spendAll([[LIMITS.resendAccount, user.id]]);
  if (wait > 0) return { sent: false, limited: `Several links were sent already in the last hour. ${tryAgainIn(wait)}` };
  return { sent: await deliverNow(await queueVerification(user, true)) };
}

export async function verifyEmail(token: string): Promise<Outcome<{ userId: string }>> {
  const taken = await consumeToken(token, 'verify');
  if (!taken) return fail(410, 'token_invalid', 'This confirmation link is not valid: it was used already, has expired, or was mistyped.');
  await db.update(users).set({ emailVerifiedAt: new Date() }).where(and(eq(users.id, taken.userId), isNull(users.emailVerifiedAt)));
  return { ok: true, value: taken };
}

/** check the password; counts failures (rateLimit.ts) and writes the audit rows */
export async function signIn(email: string, password: string, ip: string): Promise<Outcome<User>> {
  const wait = await signInWait(email, ip);
  if (wait > 0) {
    await audit({ action: 'sign_in_failed', target: email, ip, success: false, detail: { reason: 'rate_limited' } });
    return fail(429, 'rate_limited', `Too many failed sign-ins for this address or from this network. ${tryAgainIn(wait)} Or reset your password.`);
  }
  const user = await userByEmail(email);
  // verify against a hash even for an unknown address, so the answer takes as long either way
  const ok = user ? await verifyPassword(user.passwordHash, password) : (await verifyPassword(await dummyHash(), password), false);
  if (!user || !ok) {
    await recordSignInFailure(email, ip);
    await audit({ action: 'sign_in_failed', actorId: user?.id ?? null, target: email, ip, success: false, detail: { reason: user ? 'wrong_password' : 'unknown_email' } });
    return fail(401, 'bad_credentials', 'That e-mail and password do not match an account.', { password: 'E-mail or password is wrong' });
  }
  await clearSignInFailures(email, ip);
  await audit({ action: 'sign_in', actorId: user.id, target: email, ip });
  return { ok: true, value: user };
}

/** what sign-up answers, whether or not the address had an account */
export const SIGN_UP_SENT = (email: string) =>
  `We sent a link to ${email}. Open it to confirm the address and sign in; it lasts 48 hours. If the address has an account already, the message says how to sign in instead.`;

/**
 * Sign up without telling whether the address has an account: a new address gets an account
 * (unconfirmed, not signed in) and a confirmation link that signs it in; a known address gets a
 * message to its owner instead. Either way the answer and its timing are the same. Limited
 * per source and per address.
 */
export async function signUp(input: { name: string; email: string; password: string }, ip: string): Promise<Outcome<{ email: string }>> {
  const startedAt = Date.now();
  const email = input.email.toLowerCase();
  const wait = await spendAll([
    [LIMITS.signUpSource, ip],
    [LIMITS.signUpAddress, limitKey.address(email)],
  ]);
  if (wait > 0) return fail(429, 'rate_limited', `Too many sign-ups from this network or for this address. ${tryAgainIn(wait)}`);
  const existing = await userByEmail(email);
  if (existing) {
    // the same work as a new account (hashing the password), then a word to the owner
    await hashPassword(input.password);
    await queueMail({
      to: existing.email,
      subject: 'Someone tried to create a Wallpulse account with your address',
      purpose: 'signup_existing',
      text: `Hello ${existing.name},\n\nsomeone asked to create a Wallpulse account for this address, which has one already. If it was you, sign in at ${PUBLIC_BASE_URL}/signin, or choose a new password at ${PUBLIC_BASE_URL}/reset if you have forgotten it.\n\nIf it was not you, ignore this message; nothing has changed.\n`,
    });
  } else {
    const made = await createUser(input);
    if (made.ok) await queueVerification(made.value);
  }
  await evenOut(startedAt);
  return { ok: true, value: { email } };
}

// an argon2id hash of a random string, checked for unknown addresses
let dummy: Promise<string> | null = null;
const dummyHash = () => (dummy ??= hashPassword(tokenPair().token));

/**
 * Always answers the same, in content and in time, whether or not the address has an account:
 * the mail is queued, never sent inside the request. Limited per address and per source;
 * returns the seconds to wait when a limit is reached, else 0.
 */
export async function requestPasswordReset(email: string, ip: string): Promise<number> {
  const startedAt = Date.now();
  const wait = await spendAll([
    [LIMITS.resetSource, ip],
    [LIMITS.resetAddress, limitKey.address(email)],
  ]);
  if (wait > 0) return wait;
  const user = await userByEmail(email);
  if (user) {
    const token = await issueToken(user.id, 'reset', RESET_LIFETIME_MS);
    const url = `${PUBLIC_BASE_URL}/reset/${token}`;
    await queueMail({
      to: user.email,
      subject: 'Reset your Wallpulse password',
      purpose: 'reset',
      text: `Hello ${user.name},\n\nsomeone asked to reset the password of your Wallpulse account. Open the link below to choose a new one. It works once and expires in 1 hour.\n\n${url}\n\nIf it was not you, ignore this message; your password stays as it is.\n`,
    });
  }
  await evenOut(startedAt);
  return 0;
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
