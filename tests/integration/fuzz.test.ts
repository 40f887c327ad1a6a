/**
 * Generated junk to every API route that declares a body or params (`defineRoute` in
 * lib/api/handler.ts), derived from its sample call (./api-routes.ts): wrong types, huge and
 * negative numbers, NaN and Infinity as strings, 1 MB strings, unknown fields, malformed and
 * empty JSON, and junk ids. The answer is always a 4xx naming the bad fields, never a 500, and
 * the organisation's stored rows are the same afterwards.
 */
import fc from 'fast-check';
import { QueryTypes } from 'sequelize';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { z } from 'zod';

import { db } from '@/lib/db';
import type { Role } from '@/lib/domain';

import { bodyKind, callableRoutes, declaredRoutes, makeFixture, rolesAllowed, type CallableRoute } from './api-routes';
import { ctx, makeOrganisation, signInAs } from './helpers';

type Org = Awaited<ReturnType<typeof makeOrganisation>>;
type Json = null | boolean | number | string | Json[] | { [k: string]: Json };
type Node = { path: (string | number)[]; value: Json };

const RUNS_PER_ROUTE = Number(process.env.FUZZ_RUNS ?? 150);
const ONE_MB = 1024 * 1024;

let team: Org;
let photoPng: Uint8Array;
const sent = { body: 0, ids: 0, query: 0 };

/** Every stored row of the organisation that a route could change. */
async function snapshot(): Promise<unknown> {
  const q = (sql: string) => db().query(sql, { type: QueryTypes.SELECT, replacements: { org: team.org.id } });
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
function rawRequest(route: CallableRoute, body: string | FormData | undefined, json = true): Request {
  return new Request(`http://127.0.0.1${route.path}`, {
    method: route.method,
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

/** The role the junk is sent as: an admin where allowed. */
function roleFor(route: CallableRoute): Role {
  const roles = rolesAllowed(route.declaration);
  return roles.includes('admin') ? 'admin' : roles[0];
}

/** Signs in as a role the route allows, or signs out for public routes. */
function signInFor(route: CallableRoute) {
  if (route.declaration.action === 'public') return signInAs(null);
  signInAs(team.users[roleFor(route)]);
}

const callable = await callableRoutes();
const withBody = callable.filter((r) => bodyKind(r.declaration) !== 'none');
const withParams = callable.filter((r) => r.declaration.params);

beforeAll(async () => {
  team = await makeOrganisation('Fuzz');
  photoPng = new Uint8Array(
    await sharp({ create: { width: 16, height: 16, channels: 3, background: '#445566' } })
      .png()
      .toBuffer(),
  );
});

afterAll(() => {
  console.log(
    `fuzz: ${sent.body} junk bodies to ${withBody.length} routes, ${sent.ids} junk ids to ` +
      `${withParams.length} routes, ${sent.query} junk queries: ${sent.body + sent.ids + sent.query} junk requests`,
  );
});

describe('junk bodies', () => {
  it('covers every route that declares a body', async () => {
    expect(withBody.length).toBeGreaterThanOrEqual(15);
    const called = new Set(callable.map((r) => r.name));
    const missed = (await declaredRoutes()).filter((r) => bodyKind(r.declaration) !== 'none' && !called.has(r.name));
    expect(missed.map((r) => r.name)).toEqual([]);
  });

  it.each(withBody.map((r) => [r.name, r] as const))('%s refuses junk and keeps the data', async (_n, route) => {
    const { handler } = route;
    const fx = await makeFixture(team, 'fuzz', photoPng, route.sample);
    const valid = route.sample.call(fx, roleFor(route));
    signInFor(route);
    const before = await snapshot();
    const send = async (body: string | FormData, json = true) => {
      sent.body += 1;
      return handler(rawRequest(route, body, json), ctx(valid.params));
    };

    if (bodyKind(route.declaration) === 'multipart') {
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
        fc.asyncProperty(junkBodies(body, bodyKind(route.declaration) === 'optional'), async ({ kind, text }) => {
          await expectRefusal(await send(text), [400, 413, 422], `${kind}: ${text.slice(0, 200)}`);
        }),
        { numRuns: RUNS_PER_ROUTE },
      );
      // 1 MB strings in each text field (at most six of them)
      const strings = nodesOf(body)
        .filter((n) => typeof n.value === 'string')
        .slice(0, 6);
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

  it.each(withParams.map((r) => [r.name, r] as const))('%s answers 404 to a junk id', async (_n, route) => {
    const { handler } = route;
    const fx = await makeFixture(team, 'fuzz', photoPng, route.sample);
    const valid = route.sample.call(fx, roleFor(route));
    signInFor(route);
    const before = await snapshot();
    for (const key of Object.keys(valid.params)) {
      // A revision param takes numbers and 'current': those are not junk there
      const junk =
        key === 'revision' ? junkId.filter((id) => id.trim() !== 'current' && !Number.isFinite(Number(id))) : junkId;
      await fc.assert(
        fc.asyncProperty(junk, async (id) => {
          sent.ids += 1;
          const body = valid.body === undefined ? undefined : JSON.stringify(valid.body);
          const res = await handler(rawRequest(route, body), ctx({ ...valid.params, [key]: id }));
          await expectRefusal(res, [404], `${key}=${id.slice(0, 60)}`);
        }),
        { numRuns: Math.ceil(RUNS_PER_ROUTE / 4) },
      );
    }
    expect(await snapshot()).toEqual(before);
  });
});

describe('junk queries', () => {
  const withQuery = callable.filter((r) => r.declaration.query);

  it('covers every route that declares a query', () => {
    expect(withQuery.map((r) => r.name).sort()).toEqual([
      'DELETE /api/boards/[boardId]',
      'GET /api/boards/[boardId]/audit',
      'GET /api/boards/[boardId]/revisions/[revision]',
      'GET /api/sites/[siteId]/pack',
      'POST /api/boards/[boardId]/archive',
    ]);
  });

  it.each(withQuery.map((r) => [r.name, r] as const))('%s answers 400 naming the field', async (_n, route) => {
    const schema = route.declaration.query as z.ZodObject;
    const fx = await makeFixture(team, 'fuzz', photoPng, route.sample);
    const valid = route.sample.call(fx, roleFor(route));
    signInFor(route);
    const before = await snapshot();
    for (const [key, field] of Object.entries(schema.shape)) {
      // Only values the field refuses: a valid cursor or revision is not junk
      const junk = fc
        .oneof(fc.string({ maxLength: 40 }), fc.constantFrom('NaN', '-1', '1e999', '0x10', ' ', 'x'.repeat(5_000)))
        .filter((v) => !(field as z.ZodType).safeParse(v).success);
      await fc.assert(
        fc.asyncProperty(junk, async (value) => {
          sent.query += 1;
          const url = new URL(`http://127.0.0.1${route.path}`);
          url.searchParams.set(key, value);
          const res = await route.handler(new Request(url), ctx(valid.params));
          const answer = res.clone();
          await expectRefusal(res, [400], `${key}=${value.slice(0, 60)}`);
          const { issues } = (await answer.json()) as { issues: { path: string }[] };
          expect(issues.map((i) => i.path)).toContain(key);
        }),
        { numRuns: Math.ceil(RUNS_PER_ROUTE / 4) },
      );
    }
    expect(await snapshot()).toEqual(before);
  });
});
