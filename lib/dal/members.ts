import 'server-only';

import crypto from 'node:crypto';

import bcrypt from 'bcryptjs';
import { Op } from 'sequelize';

import type { Actor } from '@/lib/auth/session';
import { db } from '@/lib/db';
import { audit } from '@/lib/dal/audit';
import { env } from '@/lib/env';
import { conflict, HttpError, notFound } from '@/lib/errors';
import { enqueueMail } from '@/lib/mail/outbox';
import { invitationMail } from '@/lib/mail/templates';
import type { AcceptInviteInput, InviteInput, MemberUpdate } from '@/lib/members/schemas';
import { Invitation, Organisation, User } from '@/models';
import type { Member } from '@/lib/members/types';

/** Invitations are valid for a week. */
const INVITATION_TTL_MS = 7 * 24 * 60 * 60 * 1000;

const hashToken = (token: string) => crypto.createHash('sha256').update(token).digest('hex');

/** Members of the caller's organisation, and invitations not yet taken up. */
export async function listMembers(actor: Actor): Promise<Member[]> {
  const [users, invitations] = await Promise.all([
    User.findAll({ where: { organisationId: actor.organisationId }, order: [['name', 'ASC']] }),
    Invitation.findAll({
      where: { organisationId: actor.organisationId, acceptedAt: null, expiresAt: { [Op.gt]: new Date() } },
      order: [['createdAt', 'DESC']],
    }),
  ]);
  return [...users.map((u) => memberOf(u, u.active, false)), ...invitations.map((i) => memberOf(i, false, true))];
}

/** A member (or an invitation not yet taken up) as the members page shows it. */
function memberOf(who: User | Invitation, active: boolean, pending: boolean): Member {
  const { id, name, email, role } = who;
  return { id, name, email, role, active, pending, createdAt: who.createdAt.toISOString() };
}

/**
 * Records an invitation and queues its e-mail with a one-time link. The token is sent
 * once and stored only as a hash.
 */
export async function inviteMember(actor: Actor, input: InviteInput): Promise<{ id: string }> {
  const existing = await User.findOne({ where: { email: input.email } });
  if (existing) throw conflict('Someone with this e-mail address already has an account.');
  const token = crypto.randomBytes(32).toString('base64url');
  const org = await Organisation.findByPk(actor.organisationId);
  return db().transaction(async (transaction) => {
    const invitation = await Invitation.create(
      {
        organisationId: actor.organisationId,
        email: input.email,
        name: input.name,
        role: input.role,
        tokenHash: hashToken(token),
        expiresAt: new Date(Date.now() + INVITATION_TTL_MS),
        invitedById: actor.userId,
      },
      { transaction },
    );
    const content = invitationMail({
      organisationName: org?.name ?? null,
      inviteeName: input.name,
      inviterName: actor.name,
      role: input.role,
      link: `${env().APP_URL}/invite/${token}`,
    });
    await enqueueMail({ organisationId: actor.organisationId, to: input.email, ...content }, transaction);
    await audit(actor, 'member.invited', { email: input.email, role: input.role }, { transaction });
    return { id: invitation.id };
  });
}

/** The invitation behind a token, if it is still open. */
export async function findOpenInvitation(token: string) {
  const invitation = await Invitation.findOne({ where: { tokenHash: hashToken(token) } });
  if (!invitation || invitation.acceptedAt || invitation.expiresAt < new Date()) return null;
  return { email: invitation.email, name: invitation.name, role: invitation.role };
}

/** Takes up an invitation: creates the account with the chosen password, once. */
export async function acceptInvitation(input: AcceptInviteInput): Promise<{ email: string }> {
  return db().transaction(async (transaction) => {
    const invitation = await Invitation.findOne({
      where: { tokenHash: hashToken(input.token) },
      transaction,
      lock: transaction.LOCK.UPDATE,
    });
    if (!invitation || invitation.acceptedAt || invitation.expiresAt < new Date()) {
      throw new HttpError(410, 'This invitation link has been used or has expired. Ask for a new one.');
    }
    const taken = await User.findOne({ where: { email: invitation.email }, transaction });
    if (taken) throw conflict('Someone with this e-mail address already has an account.');
    await User.create(
      {
        organisationId: invitation.organisationId,
        email: invitation.email,
        name: invitation.name,
        role: invitation.role,
        passwordHash: await bcrypt.hash(input.password, 10),
      },
      { transaction },
    );
    await invitation.update({ acceptedAt: new Date() }, { transaction });
    return { email: invitation.email };
  });
}

/** Changes a member's role or deactivates them. An admin cannot lock themselves out. */
export async function updateMember(actor: Actor, userId: string, input: MemberUpdate): Promise<Member> {
  const user = await User.findOne({ where: { id: userId, organisationId: actor.organisationId } });
  if (!user) throw notFound('The member');
  if (user.id === actor.userId && (input.active === false || (input.role && input.role !== 'admin'))) {
    throw conflict('You cannot remove your own admin access; ask another admin.');
  }
  await db().transaction(async (transaction) => {
    await user.update(input, { transaction });
    await audit(actor, 'member.changed', { userId, ...input }, { transaction });
  });
  return memberOf(user, user.active, false);
}

/** The names of these members by id (only of `organisationId` when given); ids may repeat or be null. */
export async function memberNames(ids: (string | null)[], organisationId?: string): Promise<Map<string, string>> {
  const wanted = [...new Set(ids.filter((id): id is string => !!id))];
  if (!wanted.length) return new Map();
  const where = { id: { [Op.in]: wanted }, ...(organisationId ? { organisationId } : {}) };
  return new Map((await User.findAll({ where, attributes: ['id', 'name'] })).map((u) => [u.id, u.name]));
}
