/**
 * Generated junk to every API route that takes a body (from app/api/route-table.ts): wrong
 * types, huge and negative numbers, NaN and Infinity as strings, 1 MB strings, unknown fields,
 * malformed and empty JSON, and junk ids. The answer is always a 4xx naming the bad fields,
 * never a 500, and the organisation's stored rows are the same afterwards.
 */
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';

import fc from 'fast-check';
import { QueryTypes } from 'sequelize';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

import {
  HTTP_METHODS,
  ROUTES,
  rolesAllowed,
  routeName,
  type RouteFixture,
  type RouteSpec,
} from '@/app/api/route-table';
import type { Actor } from '@/lib/auth/session';
import { submitBoard } from '@/lib/dal/board-status';
import { archiveBoard, getBoard, removeBoard } from '@/lib/dal/boards';
import { archiveSite } from '@/lib/dal/sites';
import { addComment } from '@/lib/dal/comments';
import { approveBoard } from '@/lib/dal/issue-and-return';
import { db } from '@/lib/db';
import { ROLES, type Role } from '@/lib/domain';
import { Invitation, User } from '@/models';

import { ctx, makeBoard, makeOrganisation, signInAs } from './helpers';

type Org = Awaited<ReturnType<typeof makeOrganisation>>;
type Handler = (req: Request, context: { params: Promise<Record<string, string>> }) => Promise<Response>;
type Json = null | boolean | number | string | Json[] | { [k: string]: Json };
type Node = { path: (string | number)[]; value: Json };

const RUNS_PER_ROUTE = Number(process.env.FUZZ_RUNS ?? 150);
const ONE_MB = 1024 * 1024;
const API_DIR = path.resolve(import.meta.dirname, '../../app/api');

let team: Org;
let photoPng: Uint8Array;
const sent = { body: 0, ids: 0 };

/** The handler of a route, imported from its file. */
async function handlerOf(spec: RouteSpec): Promise<Handler> {
  const file = path.join(API_DIR, spec.path.replace(/^\/api\//, ''), 'route.ts');
  const mod = (await import(/* @vite-ignore */ file)) as Record<string, Handler>;
  if (!HTTP_METHODS.includes(spec.method) || !mod[spec.method]) throw new Error(`no ${routeName(spec)}`);
  return mod[spec.method];
}

const actorOf = (role: Role): Actor => {
  const u = team.users[role];
  return { userId: u.id, organisationId: team.org.id, role, name: u.name, email: u.email };
};

/** The members' names by role, for calls where the caller types their own name. */
const namesOf = (o: Org) => Object.fromEntries(ROLES.map((r) => [r, o.users[r].name])) as Record<Role, string>;

/** A board at the route's stage with a spare member and an open invitation. */
async function makeFixture(spec: RouteSpec): Promise<RouteFixture> {
  const { site, board } = await makeBoard(team.org.id, 'flat');
  const tag = crypto.randomUUID().slice(0, 8);
  const member = await User.create({
    organisationId: team.org.id,
    email: `spare-${tag}@example.test`,
    name: 'Spare member',
    role: 'installer',
  });
  const token = crypto.randomBytes(32).toString('base64url');
  await Invitation.create({
    organisationId: team.org.id,
    email: `invitee-${tag}@example.test`,
    name: 'Invitee',
    role: 'designer',
    tokenHash: crypto.createHash('sha256').update(token).digest('hex'),
    expiresAt: new Date(Date.now() + 86_400_000),
    invitedById: team.users.admin.id,
  });
  const at = spec.stage ?? 'draft';
  if (at === 'in-review' || at === 'issued') await submitBoard(actorOf('designer'), board.id);
  if (at === 'issued') {
    const inspector = actorOf('inspector');
    await approveBoard(inspector, board.id, { acknowledgeFailures: true, declaration: inspector.name });
  }
  // The board as GET /api/boards/:id shows it, before an archive or delete hides or changes it
  const dto = await getBoard(actorOf('admin'), board.id);
  if (at === 'archived') await archiveBoard(actorOf('admin'), board.id);
  if (at === 'deleted') await removeBoard(actorOf('designer'), board.id);
  if (at === 'site-archived') await archiveSite(actorOf('admin'), site.id);
  const comment = spec?.needs?.includes('comment')
    ? await addComment(actorOf('inspector'), board.id, { wayId: null, body: 'Label the spare ways.' })
    : null;
  return {
    organisationId: team.org.id,
    siteId: site.id,
    board: dto,
    memberId: member.id,
    invitationToken: token,
    attachmentId: '',
    photoPng,
    names: namesOf(team),
    commentId: comment?.id ?? '',
  };
}

/** Every stored row of the organisation that a route could change. */
async function snapshot(): Promise<unknown> {
  const q = (sql: string) =>
    db().query(sql, { type: QueryTypes.SELECT, replacements: { org: team.org.id } });
  // Rows of the organisation's boards, in a child table
  const onBoards = (table: string) =>
    q(`select t.* from ${table} t join boards b on b.id = t.board_id where b.organisation_id = :org order by t.id`);
  return {
    sites: await q('select * from sites where organisation_id = :org order by id'),
    boards: await q('select * from boards where organisation_id = :org order by id'),
    ways: await onBoards('ways'),
    users: await q('select * from users where organisation_id = :org order by id'),
    invitations: await q('select * from invitations where organisation_id = :org order by id'),
    comments: await onBoards('comments'),
    revisions: await onBoards('board_revisions'),
    attachments: await q('select * from attachments where organisation_id = :org order by id'),
    mail: await q('select id from outgoing_mail where organisation_id = :org order by id'),
  };
}

/** Every node of a JSON value (the root too), with its path. */
function nodesOf(value: Json, at: (string | number)[] = []): Node[] {
  const here: Node = { path: at, value };
  if (Array.isArray(value)) return [here, ...value.flatMap((v, i) => nodesOf(v, [...at, i]))];
  if (value && typeof value === 'object') {
    return [here, ...Object.entries(value).flatMap(([k, v]) => nodesOf(v, [...at, k]))];
  }
  return [here];
}

/** A copy of `value` with the node at `at` replaced. */
function replaceAt(value: Json, at: (string | number)[], next: Json | undefined): Json {
  if (!at.length) return next as Json;
  const copy = structuredClone(value) as Record<string | number, Json>;
  let parent = copy;
  for (const key of at.slice(0, -1)) parent = parent[key] as Record<string | number, Json>;
  parent[at[at.length - 1]] = next as Json;
  return copy as Json;
}

const parsesAsJson = (text: string) => {
  try {
    JSON.parse(text);
    return true;
  } catch {
    return false;
  }
};

const kindOf = (v: unknown) => (v === null ? 'null' : Array.isArray(v) ? 'array' : typeof v);

/** Values of another JSON type than `original` that no schema field of that type accepts. */
function wrongType(original: Json): fc.Arbitrary<Json> {
  const byKind: Record<string, fc.Arbitrary<Json>> = {
    // Finite doubles only: JSON turns NaN and Infinity into null, which a nullable field takes
    string: fc.oneof(
      fc.integer(),
      fc.double({ noNaN: true, noDefaultInfinity: true }),
      fc.boolean(),
      fc.constant<Json>([]),
      fc.constant<Json>({}),
    ),
    number: fc.oneof(
      fc.constantFrom('NaN', 'Infinity', '-Infinity', '1e999', '12', '0x10', ''),
      fc.boolean(),
      fc.constant<Json>([]),
      fc.constant<Json>({}),
    ),
    boolean: fc.oneof(fc.constantFrom('true', 'false', 'yes'), fc.integer({ min: 0, max: 1 }), fc.constant<Json>([])),
    // A null field is nullable: a number or object might be a valid value, a string or boolean is not
    null: fc.oneof(fc.constantFrom('null', 'none', ''), fc.boolean()),
    // Not null: an object field may be nullable (a spare way's circuit)
    object: fc.oneof(fc.string(), fc.integer(), fc.array(fc.integer(), { maxLength: 3 })),
    array: fc.oneof(fc.string(), fc.integer(), fc.constant<Json>({})),
  };
  return byKind[kindOf(original)];
}

/**
 * Junk bodies derived from a valid one: each is a raw request body that the route must refuse.
 * `optionalBody`: an empty body is a valid call there, so it is not junk.
 */
function junkBodies(valid: Json, optionalBody: boolean): fc.Arbitrary<{ kind: string; text: string }> {
  const text = JSON.stringify(valid);
  const nodes = nodesOf(valid);
  const numbers = nodes.filter((n) => typeof n.value === 'number');
  const objects = nodes.filter((n) => kindOf(n.value) === 'object');
  const mutate = (kind: string, arb: fc.Arbitrary<Json>) => arb.map((j) => ({ kind, text: JSON.stringify(j) }));
  const options: fc.Arbitrary<{ kind: string; text: string }>[] = [
    // Malformed JSON: a truncated valid body, stray text, JavaScript-only literals
    fc
      .integer({ min: 1, max: Math.max(1, text.length - 1) })
      .map((n) => ({ kind: 'truncated JSON', text: text.slice(0, n) })),
    fc
      .string({ minLength: 1, maxLength: 40 })
      .map((s) => `{${s}`)
      .filter((t) => !parsesAsJson(t))
      .map((t) => ({ kind: 'malformed JSON', text: t })),
    fc
      .constantFrom(
        '{"a":1,}',
        "{'a':1}",
        '[1,2',
        'NaN',
        '{"version": NaN}',
        '{"x": Infinity}',
        'undefined',
        '\u0000',
        '{}}',
      )
      .map((t) => ({ kind: 'malformed JSON', text: t })),
    // The wrong type for the whole body
    mutate(
      'wrong body type',
      fc.oneof(
        fc.integer(),
        fc.double(),
        fc.boolean(),
        fc.constant(null),
        fc.string(),
        fc.array(fc.jsonValue(), { maxLength: 4 }),
      ) as fc.Arbitrary<Json>,
    ),
    // The wrong type at any field
    fc
      .constantFrom(...nodes.filter((n) => n.path.length))
      .chain((n) => wrongType(n.value).map((v) => replaceAt(valid, n.path, v)))
      .map((j) => ({ kind: 'wrong field type', text: JSON.stringify(j) })),
    // Unknown fields, at the top or in any nested object
    fc
      .tuple(fc.constantFrom(...objects), fc.string({ minLength: 1, maxLength: 12 }), fc.jsonValue())
      .filter(([o, k]) => !(k in (o.value as object)))
      .map(([o, k, v]) => ({
        kind: 'unknown field',
        text: JSON.stringify(replaceAt(valid, o.path, { ...(o.value as object), [`x_${k}`]: v as Json })),
      })),
  ];
  if (numbers.length) {
    // Huge numbers, and negative quantities (every number but a temperature is non-negative)
    options.push(
      fc
        .tuple(fc.constantFrom(...numbers), fc.constantFrom(1e308, -1e308, 2 ** 60, Number.MAX_VALUE))
        .map(([n, v]) => ({ kind: 'huge number', text: JSON.stringify(replaceAt(valid, n.path, v)) })),
    );
    const nonNegative = numbers.filter((n) => !/ambient/i.test(String(n.path[n.path.length - 1])));
    if (nonNegative.length) {
      options.push(
        fc
          .tuple(fc.constantFrom(...nonNegative), fc.constantFrom(-1, -0.5, -1e9))
          .map(([n, v]) => ({ kind: 'negative number', text: JSON.stringify(replaceAt(valid, n.path, v)) })),
      );
    }
  }
  if (!optionalBody) options.push(fc.constant({ kind: 'empty body', text: '' }));
  return fc.oneof(...options);
}

/** A raw request to a route with a text body. */
function rawRequest(spec: RouteSpec, body: string | FormData | undefined, json = true): Request {
  return new Request(`http://127.0.0.1${spec.path}`, {
    method: spec.method,
    headers: json ? { 'content-type': 'application/json' } : undefined,
    body,
  });
}

/** The answer to junk: a 4xx naming what is wrong; 400 and 422 name the fields. */
async function expectRefusal(res: Response, allowed: number[], what: string) {
  const text = await res.text();
  expect(allowed, `${what} → ${res.status} ${text.slice(0, 300)}`).toContain(res.status);
  const json = JSON.parse(text) as { error?: unknown; issues?: { path: unknown; message: unknown }[] };
  expect(typeof json.error, what).toBe('string');
  if (res.status === 400 || res.status === 422) {
    expect(Array.isArray(json.issues) && json.issues.length > 0, `${what}: issues`).toBe(true);
    for (const issue of json.issues!) {
      expect(typeof issue.path === 'string' && issue.path.length > 0, what).toBe(true);
      expect(typeof issue.message === 'string' && issue.message.length > 0, what).toBe(true);
    }
  }
}

/** Signs in as a role the route allows (an admin when it may), or signs out for public routes. */
/** The role the junk is sent as: an admin where allowed. */
function roleFor(spec: RouteSpec): Role {
  const roles = rolesAllowed(spec);
  return roles.includes('admin') ? 'admin' : roles[0];
}

function signInFor(spec: RouteSpec) {
  if (spec.access.kind === 'public') return signInAs(null);
  signInAs(team.users[roleFor(spec)]);
}

const withBody = ROUTES.filter((r) => r.call && r.body !== 'none');
const withParams = ROUTES.filter((r) => r.call && /\[\w+\]/.test(r.path));

beforeAll(async () => {
  team = await makeOrganisation('Fuzz');
  photoPng = new Uint8Array(
    await sharp({ create: { width: 16, height: 16, channels: 3, background: '#445566' } }).png().toBuffer(),
  );
});

afterAll(() => {
  console.log(
    `fuzz: ${sent.body} junk bodies to ${withBody.length} routes, ` +
      `${sent.ids} junk ids to ${withParams.length} routes: ${sent.body + sent.ids} junk requests`,
  );
});

describe('junk bodies', () => {
  it('covers every route that takes a body', () => {
    expect(withBody.length).toBeGreaterThanOrEqual(15);
    expect(ROUTES.filter((r) => r.body !== 'none' && !r.call).map(routeName)).toEqual([]);
  });

  it.each(withBody.map((r) => [routeName(r), r] as const))('%s refuses junk and keeps the data', async (_n, spec) => {
    const handler = await handlerOf(spec);
    const fx = await makeFixture(spec);
    const valid = spec.call!(fx, roleFor(spec));
    signInFor(spec);
    const before = await snapshot();
    const send = async (body: string | FormData, json = true) => {
      sent.body += 1;
      return handler(rawRequest(spec, body, json), ctx(valid.params));
    };

    if (spec.body === 'multipart') {
      // JSON instead of a form, a form without the file, and bytes that are no image
      await expectRefusal(await send(JSON.stringify({ file: 'x' })), [400], 'JSON instead of a form');
      await expectRefusal(await send('--x\r\nnot a form'), [400], 'not a form');
      await fc.assert(
        fc.asyncProperty(fc.uint8Array({ minLength: 1, maxLength: 4096 }), fc.string(), async (bytes, wayId) => {
          const form = new FormData();
          form.set('file', new File([bytes as BlobPart], 'junk.jpg', { type: 'image/jpeg' }));
          if (wayId) form.set('wayId', wayId);
          await expectRefusal(await send(form, false), [400, 413, 415, 422], 'junk file');
        }),
        { numRuns: RUNS_PER_ROUTE },
      );
    } else {
      const body = valid.body as Json;
      // Generated junk
      await fc.assert(
        fc.asyncProperty(junkBodies(body, spec.body === 'optional'), async ({ kind, text }) => {
          await expectRefusal(await send(text), [400, 413, 422], `${kind}: ${text.slice(0, 200)}`);
        }),
        { numRuns: RUNS_PER_ROUTE },
      );
      // 1 MB strings in each text field (at most six of them)
      const strings = nodesOf(body).filter((n) => typeof n.value === 'string').slice(0, 6);
      for (const n of strings) {
        const big = JSON.stringify(replaceAt(body, n.path, 'Ω'.repeat(ONE_MB / 2)));
        await expectRefusal(await send(big), [400, 413, 422], `1 MB string at ${n.path.join('.')}`);
      }
      // A body over the 2 MB limit
      await expectRefusal(await send(`{"pad":"${'x'.repeat(3 * ONE_MB)}"}`), [413], 'a 3 MB body');
    }
    // Nothing stored changed
    expect(await snapshot()).toEqual(before);
  });
});

describe('junk ids', () => {
  const junkId = fc.oneof(
    fc.string({ maxLength: 60 }),
    fc.constantFrom('0', '-1', 'NaN', 'Infinity', '1e999', 'null', 'undefined', '../..', "'; drop table boards; --"),
    fc.constantFrom('00000000-0000-0000-0000-00000000000g', '{}', '%00', 'x'.repeat(10_000)),
  );

  it.each(withParams.map((r) => [routeName(r), r] as const))('%s answers 404 to a junk id', async (_n, spec) => {
    const handler = await handlerOf(spec);
    const fx = await makeFixture(spec);
    const valid = spec.call!(fx, roleFor(spec));
    signInFor(spec);
    const before = await snapshot();
    for (const key of Object.keys(valid.params)) {
      // A revision param takes numbers and 'current': those are not junk there
      const junk =
        key === 'revision'
          ? junkId.filter((id) => id.trim() !== 'current' && !Number.isFinite(Number(id)))
          : junkId;
      await fc.assert(
        fc.asyncProperty(junk, async (id) => {
          sent.ids += 1;
          const body = valid.body === undefined ? undefined : JSON.stringify(valid.body);
          const res = await handler(rawRequest(spec, body), ctx({ ...valid.params, [key]: id }));
          await expectRefusal(res, [404], `${key}=${id.slice(0, 60)}`);
        }),
        { numRuns: Math.ceil(RUNS_PER_ROUTE / 4) },
      );
    }
    expect(await snapshot()).toEqual(before);
  });
});
