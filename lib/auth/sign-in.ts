import 'server-only';
import bcrypt from 'bcryptjs';
import { Op } from 'sequelize';
import { writeTransaction } from '@/lib/db';
import { SignInAttempt, User } from '@/models';

// Throttling: failed attempts are counted per e-mail and per address over a sliding window.
export const SIGN_IN_WINDOW_MS = 15 * 60 * 1000;
export const MAX_FAILURES_PER_EMAIL = 5;
export const MAX_FAILURES_PER_IP = 30;

export class SignInRefused extends Error {}

const logAttempt = (email: string, ip: string | null, succeeded: boolean) =>
  writeTransaction((transaction) => SignInAttempt.create({ email, ip, succeeded }, { transaction }));

async function recentFailures(where: { email?: string; ip?: string }): Promise<number> {
  return SignInAttempt.count({
    where: { ...where, succeeded: false, createdAt: { [Op.gt]: new Date(Date.now() - SIGN_IN_WINDOW_MS) } },
  });
}

/** Checks an e-mail and password; returns the user or throws SignInRefused with a message for the page. */
export async function verifySignIn(emailRaw: string, password: string, ip: string | null) {
  const email = emailRaw.trim().toLowerCase();
  if (
    (await recentFailures({ email })) >= MAX_FAILURES_PER_EMAIL ||
    (ip && (await recentFailures({ ip })) >= MAX_FAILURES_PER_IP)
  ) {
    await logAttempt(email, ip, false);
    console.warn(`Sign-in throttled for ${email} from ${ip ?? 'unknown address'}`);
    throw new SignInRefused('Too many failed attempts. Wait 15 minutes, then try again.');
  }
  const user = await User.findOne({ where: { email } });
  const ok = user ? await bcrypt.compare(password, user.passwordHash) : false;
  if (!user || !ok) {
    await logAttempt(email, ip, false);
    throw new SignInRefused('E-mail or password not recognised.');
  }
  if (user.status !== 'active') {
    await logAttempt(email, ip, false);
    throw new SignInRefused('This account is disabled. Ask an administrator.');
  }
  await writeTransaction(async (transaction) => {
    await SignInAttempt.create({ email, ip, succeeded: true }, { transaction });
    await user.update({ lastSignInAt: new Date() }, { transaction });
  });
  return { id: String(user.id), name: user.name, email: user.email };
}

export const PASSWORD_ROUNDS = 10;
export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, PASSWORD_ROUNDS);
}
