/**
 * The API routes as they declare themselves, for the generated tests (authorisation, fuzz,
 * roles and scope): every `route.ts` under app/api is imported and each exported HTTP method is
 * read with the declaration `defineRoute` attached to it (its action, params, query, body and
 * scope). What a route cannot say about itself is here: how to make one valid call of it
 * (`ROUTE_CALLS`) and the objects such a call names (`makeFixture`).
 */
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';

import type { DeclaredRoute, RouteDeclaration } from '@/lib/api/handler';
import { saveBodyOf } from '@/lib/api/save-body';
import { PERMISSIONS } from '@/lib/auth/permissions';
import type { Actor } from '@/lib/auth/session';
import type { BoardDto } from '@/lib/boards/types';
import { addAttachment } from '@/lib/dal/attachments';
import { submitBoard } from '@/lib/dal/board-status';
import { readBoard } from '@/lib/dal/board-repository';
import { archiveBoard, removeBoard } from '@/lib/dal/boards';
import { addComment } from '@/lib/dal/comments';
import { approveBoard } from '@/lib/dal/issue-and-return';
import { archiveSite } from '@/lib/dal/sites';
import { ROLES, type Role } from '@/lib/domain';
import { Invitation, User } from '@/models';

import { makeBoard, type makeOrganisation } from './helpers';

export const HTTP_METHODS = ['GET', 'POST', 'PUT', 'PATCH', 'DELETE', 'HEAD', 'OPTIONS'] as const;
export type HttpMethod = (typeof HTTP_METHODS)[number];

type Handler = (req: Request, context: { params: Promise<Record<string, string>> }) => Promise<Response>;

/** One exported method of one route file, with what it declares (undefined: nothing). */
export type ApiRoute = {
  method: HttpMethod;
  /** The folder under app/, as in the file system: `/api/boards/[boardId]`. */
  path: string;
  /** `GET /api/boards/[boardId]`: how a route is named in test titles and in `ROUTE_CALLS`. */
  name: string;
  handler: Handler;
  declaration: RouteDeclaration | undefined;
};

/** A route that declares itself. */
export type DeclaredApiRoute = ApiRoute & { declaration: RouteDeclaration };

const API_DIR = path.resolve(import.meta.dirname, '../../app/api');

/** Every `route.ts` under app/api, imported, with each HTTP method it exports and its declaration. */
export async function apiRoutes(): Promise<ApiRoute[]> {
  const files = (fs.readdirSync(API_DIR, { recursive: true }) as string[])
    .filter((f) => path.basename(f) === 'route.ts' || path.basename(f) === 'route.tsx')
    .sort();
  const found: ApiRoute[] = [];
  for (const file of files) {
    const mod = (await import(/* @vite-ignore */ path.join(API_DIR, file))) as Record<string, unknown>;
    const routePath = `/api/${path.dirname(file).split(path.sep).join('/')}`.replace(/\/\.$/, '');
    for (const method of HTTP_METHODS.filter((m) => m in mod)) {
      const handler = mod[method] as Handler & Partial<Pick<DeclaredRoute, 'declaration'>>;
      found.push({
        method,
        path: routePath,
        name: `${method} ${routePath}`,
        handler,
        declaration: handler.declaration,
      });
    }
  }
  return found;
}

/** The routes that declare themselves (the table test fails on any that does not). */
export async function declaredRoutes(): Promise<DeclaredApiRoute[]> {
  return (await apiRoutes()).filter((r): r is DeclaredApiRoute => !!r.declaration);
}

/** The roles that may call a route (every role for signed-in and public routes). */
export function rolesAllowed(declaration: RouteDeclaration): readonly Role[] {
  const { action, narrowedTo } = declaration;
  if (action === 'public' || action === 'signed-in') return ROLES;
  const roles: readonly Role[] = PERMISSIONS[action];
  return narrowedTo ? roles.filter((r) => narrowedTo.roles.includes(r)) : roles;
}

/** `optional`: an empty body is a valid call; `required`: it is not; `multipart`: an upload. */
export function bodyKind(declaration: RouteDeclaration): 'none' | 'optional' | 'required' | 'multipart' {
  const { body } = declaration;
  if (!body) return 'none';
  if (body === 'multipart') return 'multipart';
  return body.safeParse(undefined).success ? 'optional' : 'required';
}

/** Objects of one organisation that a call can name; the tests build a fresh set as needed. */
export type RouteFixture = {
  organisationId: string;
  siteId: string;
  /** A draft board of the organisation, as GET /api/boards/:id returns it. */
  board: BoardDto;
  /** A member it is safe to change (not one of the members the tests sign in as). */
  memberId: string;
  /** The one-time token of an open invitation to the organisation. */
  invitationToken: string;
  /** A photo of the board, when the route's `needs` asks for one (else ''). */
  attachmentId: string;
  /** A small valid PNG, for uploads. */
  photoPng: Uint8Array;
  /** The names of the members the tests sign in as (an issuer types their own). */
  names: Record<Role, string>;
  /** A reviewer's comment on the board, when the route's `needs` asks for one (else ''). */
  commentId: string;
};

/** A file field of a multipart form. */
export type UploadFile = { bytes: Uint8Array; name: string; type: string };

/** One call of a route: its params, an optional JSON body and query. */
export type RouteCall = {
  params: Record<string, string>;
  body?: unknown;
  /** A multipart/form-data body instead of JSON. */
  form?: Record<string, string | UploadFile>;
  query?: Record<string, string>;
};

/** How to call a route validly, and what the call needs and does. */
export type RouteSample = {
  /** The call changes or removes what it names, so each call needs fresh objects. */
  mutates: boolean;
  /**
   * The stage the fixture's board must be at for a valid call (default draft): `archived` is
   * archived by an admin, `deleted` deleted by a designer, `site-archived` its site archived.
   */
  stage?: 'draft' | 'in-review' | 'issued' | 'archived' | 'deleted' | 'site-archived';
  /** Extra objects the call names. */
  needs?: readonly ('attachment' | 'comment')[];
  /**
   * A valid call against the fixture's objects, made by a member of role `as` (null: not
   * callable in-process, with why).
   */
  call: ((fx: RouteFixture, as: Role) => RouteCall) | null;
  /** Why `call` is null. */
  notCalled?: string;
};

/** A small, valid quick-size input: a 32 A radial in 2.5 mm² twin and earth, 20 m. */
const QUICK_SIZE_BODY = {
  supply: { earthing: 'TN-C-S', uoV: 230, zeOhm: 0.35, pfcKa: 1.5, source: 'public' },
  circuit: {
    cable: 'te-70',
    phases: 1,
    use: 'sockets',
    method: 'C',
    ambientC: 30,
    csaMm2: null,
    lengthM: 20,
    load: { kind: 'socket-arrangement', arrangement: 'radial-32', floorAreaM2: 40 },
    device: { kind: 'rcbo', curve: 'B', ratingA: null, rcdMa: 30 },
  },
};

const byBoard = (fx: RouteFixture) => ({ boardId: fx.board.id });
const bySite = (fx: RouteFixture) => ({ siteId: fx.siteId });
const NEXT_AUTH = 'next-auth reads the request through next/headers; the browser tests drive it for real.';

/** A valid call of every route, by name; a declared route missing here fails the table test. */
export const ROUTE_CALLS: Readonly<Record<string, RouteSample>> = {
  'GET /api/auth/[...nextauth]': { mutates: false, call: null, notCalled: NEXT_AUTH },
  'POST /api/auth/[...nextauth]': { mutates: false, call: null, notCalled: NEXT_AUTH },
  'GET /api/boards': { mutates: false, call: (fx) => ({ params: {}, query: { siteId: fx.siteId } }) },
  'POST /api/boards': {
    mutates: false,
    call: (fx) => {
      const { settings } = saveBodyOf(fx.board);
      return { params: {}, body: { ...settings, name: 'A new board', siteId: fx.siteId } };
    },
  },
  'GET /api/boards/[boardId]': { mutates: false, call: (fx) => ({ params: byBoard(fx) }) },
  'PUT /api/boards/[boardId]': {
    mutates: true,
    call: (fx) => ({ params: byBoard(fx), body: saveBodyOf(fx.board) }),
  },
  'PATCH /api/boards/[boardId]': {
    mutates: true,
    call: (fx) => ({ params: byBoard(fx), body: { name: 'Renamed board', location: 'Under the stairs' } }),
  },
  'DELETE /api/boards/[boardId]': { mutates: true, call: (fx) => ({ params: byBoard(fx) }) },
  'POST /api/boards/[boardId]/archive': { mutates: true, stage: 'issued', call: (fx) => ({ params: byBoard(fx) }) },
  'POST /api/boards/[boardId]/restore': { mutates: true, stage: 'archived', call: (fx) => ({ params: byBoard(fx) }) },
  'POST /api/boards/[boardId]/undo-delete': {
    mutates: true,
    stage: 'deleted',
    call: (fx) => ({ params: byBoard(fx) }),
  },
  'GET /api/boards/[boardId]/audit': { mutates: false, call: (fx) => ({ params: byBoard(fx) }) },
  'POST /api/boards/[boardId]/sizing': {
    mutates: false,
    call: (fx) => {
      const { settings, ways } = saveBodyOf(fx.board);
      return { params: byBoard(fx), body: { draft: { settings, ways } } };
    },
  },
  'POST /api/boards/[boardId]/submit': {
    mutates: true,
    call: (fx) => ({ params: byBoard(fx), body: { version: fx.board.version } }),
  },
  'GET /api/boards/[boardId]/attachments': { mutates: false, call: (fx) => ({ params: byBoard(fx) }) },
  'POST /api/boards/[boardId]/attachments': {
    mutates: false,
    call: (fx) => ({
      params: byBoard(fx),
      form: {
        file: { bytes: fx.photoPng, name: 'board-front.png', type: 'image/png' },
        wayId: fx.board.ways[1].id,
      },
    }),
  },
  'GET /api/boards/[boardId]/comments': { mutates: false, call: (fx) => ({ params: byBoard(fx) }) },
  'POST /api/boards/[boardId]/comments': {
    mutates: false,
    call: (fx) => ({
      params: byBoard(fx),
      body: { wayId: fx.board.ways[1].id, body: 'Check the cable route here.' },
    }),
  },
  'POST /api/boards/[boardId]/comments/answered': {
    mutates: true,
    needs: ['comment'],
    call: (fx) => ({ params: byBoard(fx), body: { commentIds: [fx.commentId] } }),
  },
  'GET /api/boards/[boardId]/labels': {
    mutates: false,
    stage: 'issued',
    call: (fx) => ({ params: byBoard(fx), query: { revision: String(fx.board.revision) } }),
  },
  'GET /api/boards/[boardId]/review': { mutates: false, call: (fx) => ({ params: byBoard(fx) }) },
  'POST /api/boards/[boardId]/review/approve': {
    mutates: true,
    stage: 'in-review',
    call: (fx, as) => ({
      params: byBoard(fx),
      body: { acknowledgeFailures: true, declaration: fx.names[as], revision: fx.board.revision },
    }),
  },
  'POST /api/boards/[boardId]/review/return': {
    mutates: true,
    stage: 'in-review',
    call: (fx) => ({ params: byBoard(fx), body: { comment: 'Way 2 needs a 30 mA RCD.' } }),
  },
  'GET /api/boards/[boardId]/revisions': { mutates: false, call: (fx) => ({ params: byBoard(fx) }) },
  'GET /api/boards/[boardId]/revisions/[revision]': {
    mutates: false,
    stage: 'issued',
    call: (fx) => ({ params: { ...byBoard(fx), revision: String(fx.board.revision) }, query: { from: 'current' } }),
  },
  'GET /api/boards/[boardId]/schedule': { mutates: false, stage: 'issued', call: (fx) => ({ params: byBoard(fx) }) },
  'GET /api/boards/[boardId]/schedule/email': { mutates: false, call: (fx) => ({ params: byBoard(fx) }) },
  'POST /api/boards/[boardId]/schedule/email': {
    mutates: false,
    stage: 'issued',
    call: (fx) => ({ params: byBoard(fx), body: { to: 'client@example.test', message: 'The schedule as issued.' } }),
  },
  'GET /api/boards/[boardId]/sizing/ways/[wayId]': {
    mutates: false,
    call: (fx) => ({ params: { ...byBoard(fx), wayId: fx.board.ways[1].id } }),
  },
  'GET /api/boards/[boardId]/ways/walk': { mutates: false, call: (fx) => ({ params: byBoard(fx) }) },
  'POST /api/boards/[boardId]/ways/[wayId]/label': {
    mutates: true,
    stage: 'issued',
    call: (fx) => ({
      params: { ...byBoard(fx), wayId: fx.board.ways[1].id },
      body: { status: 'matches', note: 'Legible.' },
    }),
  },
  'GET /api/attachments/[attachmentId]': {
    mutates: false,
    needs: ['attachment'],
    call: (fx) => ({ params: { attachmentId: fx.attachmentId } }),
  },
  'DELETE /api/attachments/[attachmentId]': {
    mutates: true,
    needs: ['attachment'],
    call: (fx) => ({ params: { attachmentId: fx.attachmentId } }),
  },
  'GET /api/attachments/[attachmentId]/thumb': {
    mutates: false,
    needs: ['attachment'],
    call: (fx) => ({ params: { attachmentId: fx.attachmentId } }),
  },
  'GET /api/dev/mailbox': { mutates: false, call: () => ({ params: {} }) },
  'POST /api/invitations/accept': {
    mutates: true,
    call: (fx) => ({ params: {}, body: { token: fx.invitationToken, password: 'wiring-plan-2026' } }),
  },
  'GET /api/me': { mutates: false, call: () => ({ params: {} }) },
  'GET /api/members': { mutates: false, call: () => ({ params: {} }) },
  'POST /api/members': {
    mutates: false,
    call: () => ({
      params: {},
      body: { email: `new-${crypto.randomUUID()}@example.test`, name: 'New member', role: 'installer' },
    }),
  },
  'PATCH /api/members/[userId]': {
    mutates: true,
    call: (fx) => ({ params: { userId: fx.memberId }, body: { role: 'inspector' } }),
  },
  'GET /api/organisation': { mutates: false, call: () => ({ params: {} }) },
  'PATCH /api/organisation': { mutates: true, call: () => ({ params: {}, body: { allowSelfIssue: false } }) },
  'GET /api/sites': { mutates: false, call: () => ({ params: {} }) },
  'POST /api/sites': {
    mutates: false,
    call: () => ({ params: {}, body: { name: 'Mill Cottage', address: '2 Weir Lane', client: 'R. Hartley' } }),
  },
  'GET /api/sites/[siteId]': { mutates: false, call: (fx) => ({ params: bySite(fx) }) },
  'PATCH /api/sites/[siteId]': {
    mutates: true,
    call: (fx) => ({ params: bySite(fx), body: { name: 'Renamed site' } }),
  },
  'DELETE /api/sites/[siteId]': { mutates: true, call: (fx) => ({ params: bySite(fx) }) },
  'POST /api/sites/[siteId]/restore': {
    mutates: true,
    stage: 'site-archived',
    call: (fx) => ({ params: bySite(fx) }),
  },
  'POST /api/sizing': { mutates: false, call: () => ({ params: {}, body: QUICK_SIZE_BODY }) },
  'GET /api/sites/[siteId]/tree': { mutates: false, call: (fx) => ({ params: bySite(fx) }) },
  'PUT /api/sites/[siteId]/origin': {
    mutates: true,
    call: (fx) => ({
      params: bySite(fx),
      body: { earthing: 'TN-C-S', uoV: 230, zeOhm: 0.3, pfcKa: 2.2, source: 'public' },
    }),
  },
  'PUT /api/boards/[boardId]/feed': {
    mutates: true,
    call: (fx) => ({ params: byBoard(fx), body: { version: fx.board.version, feed: { from: 'origin' } } }),
  },
  'GET /api/sites/[siteId]/pack': { mutates: false, call: (fx) => ({ params: bySite(fx) }) },
  'POST /api/sites/[siteId]/pack/email': {
    mutates: false,
    call: (fx) => ({ params: bySite(fx), body: { to: 'client@example.test', message: 'The site pack.' } }),
  },
};

/** A declared route with its sample call (the routes in-process tests can call). */
export type CallableRoute = DeclaredApiRoute & { sample: RouteSample & { call: NonNullable<RouteSample['call']> } };

/** The declared routes that have a sample call. */
export async function callableRoutes(): Promise<CallableRoute[]> {
  return (await declaredRoutes())
    .map((r) => ({ ...r, sample: ROUTE_CALLS[r.name] }))
    .filter((r): r is CallableRoute => !!r.sample?.call);
}

type Org = Awaited<ReturnType<typeof makeOrganisation>>;

export const actorOf = (org: Org, role: Role): Actor => {
  const u = org.users[role];
  return { userId: u.id, organisationId: org.org.id, role, name: u.name, email: u.email };
};

/**
 * A fresh site and board (the demo flat) at the stage the route needs, a spare member, an
 * open invitation and, when asked, a comment and a photo, in an organisation.
 */
export async function makeFixture(
  org: Org,
  label: string,
  photoPng: Uint8Array,
  sample?: RouteSample,
): Promise<RouteFixture> {
  const tag = `${label}-${crypto.randomUUID().slice(0, 8)}`;
  const { site, board } = await makeBoard(org.org.id, 'flat');
  await site.update({ name: `${tag} site` });
  await board.update({ name: `${tag} board` });
  const member = await User.create({
    organisationId: org.org.id,
    email: `spare-${tag}@example.test`.toLowerCase(),
    name: `${tag} spare member`,
    role: 'installer',
  });
  const token = crypto.randomBytes(32).toString('base64url');
  await Invitation.create({
    organisationId: org.org.id,
    email: `invitee-${tag}@example.test`.toLowerCase(),
    name: `${tag} invitee`,
    role: 'designer',
    tokenHash: crypto.createHash('sha256').update(token).digest('hex'),
    expiresAt: new Date(Date.now() + 86_400_000),
    invitedById: org.users.admin.id,
  });
  // The board's stage, through the same steps as the app: submit, then approve
  const at = sample?.stage ?? 'draft';
  if (at === 'in-review' || at === 'issued') await submitBoard(actorOf(org, 'designer'), board.id);
  if (at === 'issued') {
    const inspector = actorOf(org, 'inspector');
    await approveBoard(inspector, board.id, { acknowledgeFailures: true, declaration: inspector.name });
  }
  // The board as GET /api/boards/:id shows it, before an archive or delete hides or changes it
  const dto = await readBoard(actorOf(org, 'admin'), board.id);
  if (at === 'archived') await archiveBoard(actorOf(org, 'admin'), board.id);
  if (at === 'deleted') await removeBoard(actorOf(org, 'designer'), board.id);
  if (at === 'site-archived') await archiveSite(actorOf(org, 'admin'), site.id);
  const comment = sample?.needs?.includes('comment')
    ? await addComment(actorOf(org, 'inspector'), board.id, { wayId: null, body: 'Label the spare ways.' })
    : null;
  const attachment = sample?.needs?.includes('attachment')
    ? await addAttachment(actorOf(org, 'installer'), board.id, { bytes: photoPng, fileName: `${tag}.png` })
    : null;
  return {
    organisationId: org.org.id,
    siteId: site.id,
    board: dto,
    memberId: member.id,
    invitationToken: token,
    attachmentId: attachment?.id ?? '',
    photoPng,
    names: Object.fromEntries(ROLES.map((r) => [r, org.users[r].name])) as Record<Role, string>,
    commentId: comment?.id ?? '',
  };
}
