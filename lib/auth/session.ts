import 'server-only';

import cluster from 'node:cluster';

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
 * Members read in the last few seconds, by id. A role change or a deactivation reaches the
 * other workers of this server at once (scripts/serve.mjs relays the message) and other
 * servers within ACTOR_CACHE_MS (default 5 s); meanwhile a burst of API calls costs one
 * lookup instead of one each. The map lives on globalThis: route handlers and pages are
 * bundled apart, and a change made from one must clear the other's entry too.
 */
type Recent = Map<string, { actor: Actor | null; until: number }>;
const holder = globalThis as unknown as { boardwrightRecentActors?: Recent };
const recent: Recent = (holder.boardwrightRecentActors ??= listenForForgets(new Map()));

const FORGET = 'boardwright:broadcast';

/** Clears entries that another worker of this server asks to forget. */
function listenForForgets(map: Recent): Recent {
  if (cluster.isWorker) {
    process.on('message', (message: { type?: string; forgetActor?: unknown }) => {
      if (message?.type === FORGET && typeof message.forgetActor === 'string') map.delete(message.forgetActor);
    });
  }
  return map;
}

function cacheMs(): number {
  const ms = Number(process.env.ACTOR_CACHE_MS ?? 5_000);
  return Number.isFinite(ms) && ms >= 0 ? ms : 5_000;
}

/** Forgets a member's cached record (after a role change or deactivation), in every worker. */
export function forgetActor(userId: string): void {
  recent.delete(userId);
  if (cluster.isWorker) process.send?.({ type: FORGET, forgetActor: userId });
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
