/**
 * Sign-in hardening: failed sign-ins limited per account and per network address with a clear
 * message (lib/auth/sign-in-limiter.ts through next-auth's authorize), the password rules,
 * the session lifetime enforced on the token itself, and Secure cookies over HTTPS.
 */
import crypto from 'node:crypto';
import { createRequire } from 'node:module';
import path from 'node:path';

import bcrypt from 'bcryptjs';
import { encode } from 'next-auth/jwt';
import { afterEach, beforeAll, describe, expect, it, vi } from 'vitest';

import * as acceptRoute from '@/app/api/invitations/accept/route';
import { authOptions, secureCookiesFor, SESSION_MAX_AGE_S } from '@/lib/auth/options';
import { FAILURES_PER_ACCOUNT, FAILURES_PER_ADDRESS, SignInLockedError } from '@/lib/auth/sign-in-limiter';
import { passwordSchema } from '@/lib/members/schemas';
import { Invitation, User } from '@/models';

import { ctx, jsonRequest, makeOrganisation, signInAs } from './helpers';

// The real session-cookie reader, with the request's cookies supplied by the test
const cookieJar = vi.hoisted(() => new Map<string, string>());
vi.mock('next/headers', () => ({
  cookies: async () => ({
    get: (name: string) => (cookieJar.has(name) ? { name, value: cookieJar.get(name) } : undefined),
  }),
}));

// next-auth's own cookie defaults (not in its package exports, so loaded by path)
type CookieOption = { name: string; options: { secure: boolean; httpOnly: boolean; sameSite: string } };
const { defaultCookies } = createRequire(import.meta.url)(
  path.resolve(import.meta.dirname, '../../node_modules/next-auth/core/lib/cookie.js'),
) as { defaultCookies: (secure: boolean) => Record<'sessionToken' | 'csrfToken', CookieOption> };

type Authorize = (
  credentials: Record<string, string>,
  req: { headers: Record<string, string> },
) => Promise<{ id: string } | null>;
const authorize = (authOptions.providers[0] as unknown as { options: { authorize: Authorize } }).options.authorize;

/** One sign-in attempt from a network address: the user id, null (refused) or the lock message. */
async function attempt(email: string, password: string, address: string): Promise<string | null> {
  try {
    const user = await authorize({ email, password }, { headers: { 'x-forwarded-for': address } });
    return user ? user.id : null;
  } catch (err) {
    if (err instanceof SignInLockedError) return `locked: ${err.message}`;
    throw err;
  }
}

// Documentation addresses (RFC 3849), a fresh one per test so runs never share counters; the
// limiter keys on the last address of X-Forwarded-For, the one the nearest proxy appended
// (the first is whatever the client claimed)
const newAddress = () => `10.0.0.7, 2001:db8::${crypto.randomBytes(6).toString('hex').match(/.{4}/g)!.join(':')}`;
const PASSWORD = 'plug-and-socket-42';

async function makeMember(organisationId: string) {
  return User.create({
    organisationId,
    email: `limit-${crypto.randomUUID().slice(0, 12)}@example.test`,
    name: 'Limit tester',
    role: 'designer',
    passwordHash: await bcrypt.hash(PASSWORD, 4),
  });
}

let orgId: string;
beforeAll(async () => {
  orgId = (await makeOrganisation('Limits')).org.id;
});

describe('failed sign-ins per account', () => {
  const title = `locks an account after ${FAILURES_PER_ACCOUNT} failures, even for the right password, with a clear message`;
  it(title, async () => {
    const user = await makeMember(orgId);
    const address = newAddress();
    expect(FAILURES_PER_ACCOUNT).toBe(5);
    for (let i = 0; i < FAILURES_PER_ACCOUNT; i++) {
      expect(await attempt(user.email, 'wrong-password-1', address)).toBeNull();
    }
    expect(await attempt(user.email, PASSWORD, address)).toBe(
      'locked: Too many failed sign-ins. Try again in 15 minutes.',
    );
    // Another account from the same address is not affected
    const other = await makeMember(orgId);
    expect(await attempt(other.email, PASSWORD, address)).toBe(other.id);
    // Nor is the locked account from another address: the account limit holds everywhere
    expect(await attempt(user.email, PASSWORD, newAddress())).toMatch(/^locked: Too many failed sign-ins/);
  });

  it('a success clears the account’s failures', async () => {
    const user = await makeMember(orgId);
    const address = newAddress();
    for (let i = 0; i < FAILURES_PER_ACCOUNT - 1; i++) await attempt(user.email, 'nope-nope-1', address);
    expect(await attempt(user.email, PASSWORD, address)).toBe(user.id);
    for (let i = 0; i < FAILURES_PER_ACCOUNT - 1; i++) await attempt(user.email, 'nope-nope-1', address);
    expect(await attempt(user.email, PASSWORD, address)).toBe(user.id);
  });

  it('counts unknown e-mail addresses too, so probing for accounts is limited alike', async () => {
    const email = `nobody-${crypto.randomUUID().slice(0, 8)}@example.test`;
    const address = newAddress();
    for (let i = 0; i < FAILURES_PER_ACCOUNT; i++) expect(await attempt(email, 'guess-guess-1', address)).toBeNull();
    expect(await attempt(email, 'guess-guess-1', address)).toMatch(/^locked: /);
  });
});

describe('failed sign-ins per network address', () => {
  it(`locks an address after ${FAILURES_PER_ADDRESS} failures spread over many accounts`, async () => {
    expect(FAILURES_PER_ADDRESS).toBe(30);
    const address = newAddress();
    // 30 failures, never more than 3 on one account (below the account limit)
    const probed = Array.from({ length: 10 }, () => `probe-${crypto.randomUUID().slice(0, 8)}@example.test`);
    for (let i = 0; i < FAILURES_PER_ADDRESS; i++) {
      expect(await attempt(probed[i % probed.length], 'guess-guess-1', address)).toBeNull();
    }
    // Now even a member with the right password is refused from that address…
    const user = await makeMember(orgId);
    expect(await attempt(user.email, PASSWORD, address)).toBe(
      'locked: Too many failed sign-ins. Try again in 15 minutes.',
    );
    // …and signs in from anywhere else
    expect(await attempt(user.email, PASSWORD, newAddress())).toBe(user.id);
  });

  it('a client cannot dodge the limit by claiming a new address before the proxy’s entry', async () => {
    const real = newAddress().split(', ')[1];
    const probed = Array.from({ length: 10 }, () => `dodge-${crypto.randomUUID().slice(0, 8)}@example.test`);
    for (let i = 0; i < FAILURES_PER_ADDRESS; i++) {
      // Each attempt claims a different address; the proxy appends the same real one.
      const claimed = `198.51.100.${i}, ${real}`;
      expect(await attempt(probed[i % probed.length], 'guess-guess-1', claimed)).toBeNull();
    }
    const user = await makeMember(orgId);
    expect(await attempt(user.email, PASSWORD, `203.0.113.77, ${real}`)).toMatch(/^locked: /);
  });

  it('a wrong password and an unknown account are refused alike (no hint which)', async () => {
    const user = await makeMember(orgId);
    const address = newAddress();
    expect(await attempt(user.email, 'wrong-password-1', address)).toBeNull();
    expect(await attempt(`x${user.email}`, PASSWORD, address)).toBeNull();
    await user.update({ active: false });
    expect(await attempt(user.email, PASSWORD, address)).toBeNull();
  });
});

describe('password rules', () => {
  it('accepts a long password with letters and digits', () => {
    for (const ok of ['wiring-plan-2026', 'abcdefghi1', `${'a'.repeat(190)}1234567890`]) {
      expect(passwordSchema.safeParse(ok).success, ok).toBe(true);
    }
  });

  it.each([
    ['short1', 'Use at least 10 characters.'],
    ['onlylettersandmore', 'Include at least one digit.'],
    ['1234567890123', 'Include at least one letter.'],
    [`${'a1'.repeat(101)}`, 'Use at most 200 characters.'],
  ])('refuses %s with “%s”', (password, message) => {
    const parsed = passwordSchema.safeParse(password);
    expect(parsed.success).toBe(false);
    expect(parsed.error!.issues.map((i) => i.message)).toContain(message);
  });

  it('the invitation route applies them, naming the field', async () => {
    const { org, users } = await makeOrganisation('Rules');
    const token = crypto.randomBytes(32).toString('base64url');
    await Invitation.create({
      organisationId: org.id,
      email: `rules-${crypto.randomUUID().slice(0, 8)}@example.test`,
      name: 'New starter',
      role: 'installer',
      tokenHash: crypto.createHash('sha256').update(token).digest('hex'),
      expiresAt: new Date(Date.now() + 86_400_000),
      invitedById: users.admin.id,
    });
    signInAs(null);
    const weak = await acceptRoute.POST(jsonRequest('POST', { token, password: 'password' }), ctx({}));
    expect(weak.status).toBe(400);
    const { issues } = await weak.json();
    expect(issues).toEqual([
      { path: 'password', message: 'Use at least 10 characters.' },
      { path: 'password', message: 'Include at least one digit.' },
    ]);
    const strong = await acceptRoute.POST(jsonRequest('POST', { token, password: 'socket-outlet-13' }), ctx({}));
    expect(strong.status).toBe(201);
  });
});

describe('session lifetime', () => {
  afterEach(() => {
    vi.useRealTimers();
    cookieJar.clear();
  });

  it('sessions and their tokens last 12 hours', () => {
    expect(SESSION_MAX_AGE_S).toBe(12 * 60 * 60);
    expect(authOptions.session?.strategy).toBe('jwt');
    expect(authOptions.session?.maxAge).toBe(SESSION_MAX_AGE_S);
    // next-auth signs the sign-in token with jwt.maxAge; unset, that is 30 days
    expect(authOptions.jwt?.maxAge).toBe(SESSION_MAX_AGE_S);
  });

  it('the server refuses a session token once its 12 hours are up, or when tampered with', async () => {
    const { sessionUserId } =
      await vi.importActual<typeof import('@/lib/auth/session-cookie')>('@/lib/auth/session-cookie');
    const userId = crypto.randomUUID();
    const secret = authOptions.secret!;
    vi.useFakeTimers({ toFake: ['Date'] });
    const start = Date.now();
    const claims = { userId, role: 'designer' as const, organisationId: userId };
    const token = await encode({ token: claims, secret, maxAge: authOptions.jwt!.maxAge });
    cookieJar.set('next-auth.session-token', token);
    expect(await sessionUserId()).toBe(userId);
    // Just before the end (next-auth allows 15 s of clock skew) and just after it
    vi.setSystemTime(start + (SESSION_MAX_AGE_S - 60) * 1000);
    expect(await sessionUserId()).toBe(userId);
    vi.setSystemTime(start + (SESSION_MAX_AGE_S + 60) * 1000);
    expect(await sessionUserId()).toBeNull();
    // A tampered token, and one made with another secret
    vi.setSystemTime(start);
    cookieJar.set('next-auth.session-token', `${token.slice(0, -4)}AAAA`);
    expect(await sessionUserId()).toBeNull();
    const forged = await encode({ token: claims, secret: 'another-secret-0123456789abcdef', maxAge: 3600 });
    cookieJar.set('next-auth.session-token', forged);
    expect(await sessionUserId()).toBeNull();
  });
});

describe('cookies over HTTPS', () => {
  it('are Secure and prefixed exactly when APP_URL is https', () => {
    expect(secureCookiesFor('https://boards.example.test')).toBe(true);
    expect(secureCookiesFor('http://127.0.0.1:3000')).toBe(false);
    // The option as next-auth turns it into cookies
    const secure = defaultCookies(secureCookiesFor('https://boards.example.test'));
    expect(secure.sessionToken.name).toBe('__Secure-next-auth.session-token');
    expect(secure.sessionToken.options).toMatchObject({ secure: true, httpOnly: true, sameSite: 'lax' });
    expect(secure.csrfToken.name).toBe('__Host-next-auth.csrf-token');
    const plain = defaultCookies(secureCookiesFor('http://127.0.0.1:3000'));
    expect(plain.sessionToken.options.secure).toBe(false);
  });

  it('authOptions takes it from APP_URL', async () => {
    const before = process.env.APP_URL;
    try {
      for (const [url, secure] of [
        ['https://boards.example.test', true],
        ['http://127.0.0.1:3100', false],
      ] as const) {
        process.env.APP_URL = url;
        vi.resetModules();
        const fresh = await import('@/lib/auth/options');
        expect(fresh.authOptions.useSecureCookies, url).toBe(secure);
      }
    } finally {
      process.env.APP_URL = before;
      vi.resetModules();
    }
  });

  it('the server reads the __Secure- session cookie', async () => {
    const { sessionUserId } =
      await vi.importActual<typeof import('@/lib/auth/session-cookie')>('@/lib/auth/session-cookie');
    const userId = crypto.randomUUID();
    const claims = { userId, role: 'designer' as const, organisationId: userId };
    const token = await encode({ token: claims, secret: authOptions.secret!, maxAge: 60 });
    cookieJar.set('__Secure-next-auth.session-token', token);
    expect(await sessionUserId()).toBe(userId);
    cookieJar.clear();
  });
});
