import 'server-only';

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
 * Members read in the last few seconds, by id. A role change or a deactivation reaches
 * every instance within ACTOR_CACHE_MS (default 5 s), and at once on the instance that made
 * it; meanwhile a burst of API calls costs one lookup instead of one each.
 */
const recent = new Map<string, { actor: Actor | null; until: number }>();

function cacheMs(): number {
  const ms = Number(process.env.ACTOR_CACHE_MS ?? 5_000);
  return Number.isFinite(ms) && ms >= 0 ? ms : 5_000;
}

/** Forgets a member's cached record (after a role change or deactivation). */
export function forgetActor(userId: string): void {
  recent.delete(userId);
}

/**
 * Reads the session and the member's current record, so that a role change or a
 * deactivation takes effect within seconds, not when the token expires.
 */
export async function getActor(): Promise<Actor | null> {
  const id = await sessionUserId();
  if (!id) return null;
  const hit = recent.get(id);
  if (hit && hit.until > Date.now()) return hit.actor;
  const actor = await loadActor(id);
  const ttl = cacheMs();
  if (ttl > 0) {
    if (recent.size > 10_000) recent.clear();
    recent.set(id, { actor, until: Date.now() + ttl });
  }
  return actor;
}

async function loadActor(id: string): Promise<Actor | null> {
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
}

/** The actor, or a 401 when signed out and a 403 when the role may not perform `action`. */
export async function requireActor(action?: Action): Promise<Actor> {
  const actor = await getActor();
  if (!actor) throw unauthorized();
  if (action && !can(actor.role, action)) throw forbidden(ACTION_WORDS[action]);
  return actor;
}
