import { RateLimiterPostgres, type RateLimiterRes } from 'rate-limiter-flexible';

import { db } from '@/lib/db';

/** Failed sign-ins allowed per account, and per network address, in a 15-minute window. */
export const FAILURES_PER_ACCOUNT = 5;
export const FAILURES_PER_ADDRESS = 30;
const WINDOW_S = 15 * 60;

type Limiters = { account: RateLimiterPostgres; address: RateLimiterPostgres };
// Made on first use. The counts live in PostgreSQL (sign_in_limits), so every process and every
// instance counts against the same limits; only these client objects are per process.
let made: Limiters | undefined;

function limiters(): Limiters {
  if (made) return made;
  const common = {
    storeClient: db(),
    storeType: 'sequelize',
    tableName: 'sign_in_limits',
    tableCreated: true,
    clearExpiredByTimeout: false,
    duration: WINDOW_S,
  };
  made = {
    account: new RateLimiterPostgres({ ...common, keyPrefix: 'acct', points: FAILURES_PER_ACCOUNT }),
    address: new RateLimiterPostgres({ ...common, keyPrefix: 'addr', points: FAILURES_PER_ADDRESS }),
  };
  return made;
}

export class SignInLockedError extends Error {}

/** Throws, with a message for the sign-in page, when this account or address is locked out. */
export async function checkSignInAllowed(email: string, address: string): Promise<void> {
  const { account, address: byAddress } = limiters();
  const [a, b] = await Promise.all([account.get(email), byAddress.get(address)]);
  const blocked = [a, b].filter(
    (r): r is RateLimiterRes => !!r && r.consumedPoints >= (r === a ? FAILURES_PER_ACCOUNT : FAILURES_PER_ADDRESS),
  );
  if (blocked.length) {
    const minutes = Math.ceil(Math.max(...blocked.map((r) => r.msBeforeNext)) / 60_000);
    throw new SignInLockedError(`Too many failed sign-ins. Try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`);
  }
}

/** Counts a failure against the account and the address; a success clears the account. */
export async function recordSignInResult(email: string, address: string, ok: boolean) {
  const { account, address: byAddress } = limiters();
  if (ok) {
    await account.delete(email);
    return;
  }
  // consume() rejects once the points are gone; the next check reports the lock-out.
  await Promise.allSettled([account.consume(email), byAddress.consume(address)]);
}
