import 'server-only';

import { cache } from 'react';

import { ACTION_WORDS, can, type Action } from '@/lib/auth/permissions';
import { sessionUserId } from '@/lib/auth/session-cookie';
import { db } from '@/lib/db';
import { forbidden, unauthorized } from '@/lib/errors';
import { User } from '@/models';
import type { Role } from '@/lib/domain';

/** The signed-in person behind a request, as the server knows them now. */
export type Actor = {
  userId: string;
  organisationId: string;
  role: Role;
  name: string;
  email: string;
};

/**
 * Reads the session and the member's current record, once per request: a role change or a
 * deactivation takes effect on the member's next request, on every instance. React's `cache`
 * shares the answer between the layout and the page of one page render; outside a render
 * (a route handler, a test) each call reads the record again, which is still one read per request.
 */
export const getActor = cache(async (): Promise<Actor | null> => {
  const id = await sessionUserId();
  if (!id) return null;
  db();
  const user = await User.findByPk(id, {
    attributes: ['id', 'organisationId', 'role', 'name', 'email', 'active'],
  });
  if (!user || !user.active) return null;
  return {
    userId: user.id,
    organisationId: user.organisationId,
    role: user.role,
    name: user.name,
    email: user.email,
  };
});

/** The actor, or a 401 when signed out and a 403 when the role may not perform `action`. */
export async function requireActor(action?: Action): Promise<Actor> {
  const actor = await getActor();
  if (!actor) throw unauthorized();
  if (action && !can(actor.role, action)) throw forbidden(ACTION_WORDS[action]);
  return actor;
}
