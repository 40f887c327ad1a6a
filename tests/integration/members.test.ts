import { beforeAll, describe, expect, it } from 'vitest';

import * as acceptRoute from '@/app/api/invitations/accept/route';
import * as membersRoute from '@/app/api/members/route';
import * as memberRoute from '@/app/api/members/[userId]/route';
import { authOptions } from '@/lib/auth/options';
import { dispatchDueMail } from '@/lib/mail/outbox';
import { OutgoingMail, User } from '@/models';

import { caughtMail, ctx, jsonRequest, makeOrganisation, signInAs } from './helpers';

type Org = Awaited<ReturnType<typeof makeOrganisation>>;
let team: Org;

beforeAll(async () => {
  team = await makeOrganisation('Members');
});

/** The credentials provider's authorize(), as next-auth calls it on sign-in. */
async function authorize(email: string, password: string) {
  const provider = authOptions.providers[0] as unknown as {
    options: { authorize: (c: unknown, r: unknown) => Promise<unknown> };
  };
  return provider.options.authorize({ email, password }, { headers: {} });
}

async function waitForMail(to: string) {
  for (let i = 0; i < 50; i++) {
    const mail = (await caughtMail()).find((m) => m.to.includes(to));
    if (mail) return mail;
    await dispatchDueMail();
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`no mail to ${to} arrived at the catcher`);
}

describe('invitations', () => {
  it('the invitation mail arrives at the catcher and its link sets a password once', async () => {
    const email = `new-${Date.now()}@example.test`;
    signInAs(team.users.admin);
    const res = await membersRoute.POST(
      jsonRequest('POST', { email, name: 'Noor Haddad', role: 'installer' }),
      ctx({}),
    );
    expect(res.status).toBe(201);

    const mail = await waitForMail(email);
    expect(mail.subject).toContain('invited');
    const link = mail.text.match(/\/invite\/([A-Za-z0-9_-]+)/);
    expect(link).not.toBeNull();
    const token = link![1];

    const weak = await acceptRoute.POST(jsonRequest('POST', { token, password: 'short' }), ctx({}));
    expect(weak.status).toBe(400);
    expect((await weak.json()).issues[0].path).toBe('password');

    const ok = await acceptRoute.POST(jsonRequest('POST', { token, password: 'joinery-2026-ok' }), ctx({}));
    expect(ok.status).toBe(201);
    const again = await acceptRoute.POST(jsonRequest('POST', { token, password: 'joinery-2026-ok' }), ctx({}));
    expect(again.status).toBe(410);

    const user = await User.findOne({ where: { email } });
    expect(user?.role).toBe('installer');
    expect(user?.organisationId).toBe(team.org.id);
    expect(await authorize(email, 'joinery-2026-ok')).toMatchObject({ email, role: 'installer' });
    expect(await authorize(email, 'wrong-password-1')).toBeNull();
  });

  it('an admin changes a role and deactivates a member, who can then not sign in', async () => {
    signInAs(team.users.admin);
    const target = team.users.inspector;
    const res = await memberRoute.PATCH(jsonRequest('PATCH', { role: 'designer' }), ctx({ userId: target.id }));
    expect((await res.json()).member.role).toBe('designer');
    await memberRoute.PATCH(jsonRequest('PATCH', { active: false }), ctx({ userId: target.id }));
    expect(await authorize(target.email, 'test-password-1')).toBeNull();
  });

  it('an admin cannot deactivate themselves', async () => {
    signInAs(team.users.admin);
    const res = await memberRoute.PATCH(jsonRequest('PATCH', { active: false }), ctx({ userId: team.users.admin.id }));
    expect(res.status).toBe(409);
  });
});

describe('the outbox', () => {
  it('keeps a message queued while the SMTP server is down and sends it once it is back', async () => {
    const holder = globalThis as unknown as { boardwrightMailer?: unknown };
    const nodemailer = await import('nodemailer');
    const { enqueueMail } = await import('@/lib/mail/outbox');
    // Point the transport at a closed port, as if the SMTP server were down.
    holder.boardwrightMailer = nodemailer.createTransport({ host: '127.0.0.1', port: 9, connectionTimeout: 500 });
    const to = `outbox-${Date.now()}@example.test`;
    const id = await enqueueMail({ organisationId: team.org.id, to, subject: 'Retry me', text: 'x' });
    // enqueueMail tries at once; wait for that attempt (or make one) to be recorded.
    let queued = await OutgoingMail.findByPk(id);
    for (let i = 0; i < 50 && (queued?.attempts ?? 0) < 1; i++) {
      await dispatchDueMail();
      await new Promise((r) => setTimeout(r, 50));
      queued = await OutgoingMail.findByPk(id);
    }
    expect(queued?.status).toBe('queued');
    expect(queued?.attempts).toBeGreaterThanOrEqual(1);
    expect(queued?.lastError).toBeTruthy();

    // The server is back: the next due attempt goes through.
    holder.boardwrightMailer = undefined;
    await queued!.update({ nextAttemptAt: new Date() });
    await dispatchDueMail();
    expect((await OutgoingMail.findByPk(id))?.status).toBe('sent');
    expect((await caughtMail()).some((m) => m.to.includes(to))).toBe(true);
  });
});
