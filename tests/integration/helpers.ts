import crypto from 'node:crypto';

import bcrypt from 'bcryptjs';

import { db } from '@/lib/db';
import { Board, Organisation, Site, User, Way } from '@/models';
import type { Role } from '@/models/user';
import { demoWays, FLAT_BOARD, WORKSHOP_BOARD } from '@/scripts/demo-data';

const state = globalThis as unknown as { testSessionUserId?: string | null; testSessionName?: string };

/** Makes the next route calls run as this user (null: signed out). */
export function signInAs(user: { id: string; name?: string } | null): void {
  state.testSessionUserId = user?.id ?? null;
  state.testSessionName = user?.name ?? '';
}

/** The name of who is signed in, as an issuer types it in the declaration. */
export function signedInName(): string {
  return state.testSessionName ?? '';
}

/** A fresh organisation with one member of each role. */
export async function makeOrganisation(label = 'Test') {
  db();
  const org = await Organisation.create({ name: `${label} ${crypto.randomUUID().slice(0, 8)}` });
  const passwordHash = await bcrypt.hash('test-password-1', 4);
  const users = {} as Record<Role, User>;
  for (const role of ['admin', 'designer', 'inspector', 'installer'] as Role[]) {
    users[role] = await User.create({
      organisationId: org.id,
      email: `${role}-${crypto.randomUUID().slice(0, 8)}@example.test`,
      name: `${label} ${role}`,
      role,
      passwordHash,
    });
  }
  return { org, users };
}

/** A site with a copy of one of the demo boards in it. */
export async function makeBoard(organisationId: string, which: 'flat' | 'workshop' = 'flat') {
  const demo = which === 'flat' ? FLAT_BOARD : WORKSHOP_BOARD;
  const site = await Site.create({ organisationId, name: 'Test site' });
  const board = await Board.create({ ...demo.settings, organisationId, siteId: site.id });
  await Way.bulkCreate(demoWays(demo).map((w) => ({ ...w, boardId: board.id })));
  return { site, board };
}

/** Builds the context a Next route handler receives. */
export function ctx<P extends Record<string, string>>(params: P) {
  return { params: Promise.resolve(params) };
}

/** A JSON request to a route handler. */
export function jsonRequest(method: string, body?: unknown, url = 'http://127.0.0.1/api'): Request {
  return new Request(url, {
    method,
    headers: { 'content-type': 'application/json' },
    body: body === undefined ? undefined : typeof body === 'string' ? body : JSON.stringify(body),
  });
}

/** Messages the local mail catcher has received, newest first. */
export async function caughtMail(): Promise<
  { to: string[]; subject: string; text: string; attachments: { filename: string }[] }[]
> {
  const res = await fetch(new URL('/messages', process.env.MAIL_CATCHER_URL));
  return res.json();
}
