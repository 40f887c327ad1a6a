/**
 * Every API route of Boardwright in one typed list: method, path, who may call it (from the
 * permissions table), whether it takes a body, and how to build a valid call. The
 * authorisation and fuzz tests (tests/integration) are generated from it, and a route file or
 * method missing from it fails them. Not a route itself: Next only serves `route.ts` files.
 */
import { PERMISSIONS, type Action } from '@/lib/auth/permissions';
import { saveInputOf } from '@/lib/boards/schemas';
import type { BoardDto } from '@/lib/boards/types';
import { ROLES, type Role } from '@/lib/domain';

export type HttpMethod = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE' | 'HEAD' | 'OPTIONS';
export const HTTP_METHODS: readonly HttpMethod[] = ['GET', 'POST', 'PUT', 'PATCH', 'DELETE', 'HEAD', 'OPTIONS'];

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

/**
 * Who may call a route: a permission of lib/auth/permissions.ts, any signed-in member,
 * or anybody (with the reason it is public).
 */
export type RouteAccess =
  | {
      kind: 'action';
      action: Action;
      /** The DAL lets fewer roles through than the route's permission, and why. */
      narrowedTo?: { roles: readonly Role[]; by: string };
    }
  | { kind: 'signed-in' }
  | { kind: 'public'; reason: string };

/**
 * How the organisation boundary shows in a route:
 * - `path`: the params name an object; another organisation's is 404;
 * - `body`: the body names an object (a site for a new board); another organisation's is 404;
 * - `list`: the answer lists the caller's organisation only;
 * - `none`: no organisation data (the caller's own identity, pure sizing, public routes).
 */
export type RouteScope = 'path' | 'body' | 'list' | 'none';

export type RouteSpec = {
  method: HttpMethod;
  /** The folder under app/, as in the file system: `/api/boards/[boardId]`. */
  path: string;
  access: RouteAccess;
  /** `optional`: an empty body is a valid call; `required`: it is not; `multipart`: an upload. */
  body: 'none' | 'optional' | 'required' | 'multipart';
  scope: RouteScope;
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

/** The body the board editor sends to save a board unchanged at its current version. */
export function saveBodyOf(board: BoardDto) {
  return saveInputOf(board);
}

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
const act = (action: Action): RouteAccess => ({ kind: 'action', action });

export const ROUTES: readonly RouteSpec[] = [
  {
    method: 'GET',
    path: '/api/auth/[...nextauth]',
    access: {
      kind: 'public',
      reason: 'next-auth’s own endpoints (CSRF token, sign-in, sign-out, session) must answer signed-out callers.',
    },
    body: 'none',
    scope: 'none',
    mutates: false,
    call: null,
    notCalled: 'next-auth reads the request through next/headers; the browser tests drive it for real.',
  },
  {
    method: 'POST',
    path: '/api/auth/[...nextauth]',
    access: {
      kind: 'public',
      reason: 'the credentials sign-in itself; limited per account and per address (lib/auth/sign-in-limiter.ts).',
    },
    body: 'none',
    scope: 'none',
    mutates: false,
    call: null,
    notCalled: 'next-auth reads the request through next/headers; the browser tests drive it for real.',
  },
  {
    method: 'GET',
    path: '/api/boards',
    access: act('boards.read'),
    body: 'none',
    scope: 'list',
    mutates: false,
    call: (fx) => ({ params: {}, query: { siteId: fx.siteId } }),
  },
  {
    method: 'POST',
    path: '/api/boards',
    access: act('boards.edit'),
    body: 'required',
    scope: 'body',
    mutates: false,
    call: (fx) => {
      const { settings } = saveBodyOf(fx.board);
      return { params: {}, body: { ...settings, name: 'A new board', siteId: fx.siteId } };
    },
  },
  {
    method: 'GET',
    path: '/api/boards/[boardId]',
    access: act('boards.read'),
    body: 'none',
    scope: 'path',
    mutates: false,
    call: (fx) => ({ params: byBoard(fx) }),
  },
  {
    method: 'PUT',
    path: '/api/boards/[boardId]',
    access: act('boards.edit'),
    body: 'required',
    scope: 'path',
    mutates: true,
    call: (fx) => ({ params: byBoard(fx), body: saveBodyOf(fx.board) }),
  },
  {
    method: 'PATCH',
    path: '/api/boards/[boardId]',
    access: act('boards.edit'),
    body: 'required',
    scope: 'path',
    mutates: true,
    call: (fx) => ({ params: byBoard(fx), body: { name: 'Renamed board', location: 'Under the stairs' } }),
  },
  {
    method: 'DELETE',
    path: '/api/boards/[boardId]',
    access: act('boards.discard'),
    body: 'none',
    scope: 'path',
    mutates: true,
    call: (fx) => ({ params: byBoard(fx) }),
  },
  {
    method: 'POST',
    path: '/api/boards/[boardId]/archive',
    access: act('records.archive'),
    body: 'none',
    scope: 'path',
    mutates: true,
    stage: 'issued',
    call: (fx) => ({ params: byBoard(fx) }),
  },
  {
    method: 'POST',
    path: '/api/boards/[boardId]/restore',
    access: act('records.archive'),
    body: 'none',
    scope: 'path',
    mutates: true,
    stage: 'archived',
    call: (fx) => ({ params: byBoard(fx) }),
  },
  {
    method: 'POST',
    path: '/api/boards/[boardId]/undo-delete',
    access: act('boards.discard'),
    body: 'none',
    scope: 'path',
    mutates: true,
    stage: 'deleted',
    call: (fx) => ({ params: byBoard(fx) }),
  },
  {
    method: 'GET',
    path: '/api/boards/[boardId]/audit',
    access: act('boards.read'),
    body: 'none',
    scope: 'path',
    mutates: false,
    call: (fx) => ({ params: byBoard(fx) }),
  },
  {
    method: 'POST',
    path: '/api/boards/[boardId]/sizing',
    access: act('sizing.run'),
    body: 'optional',
    scope: 'path',
    mutates: false,
    call: (fx) => {
      const { settings, ways } = saveBodyOf(fx.board);
      return { params: byBoard(fx), body: { draft: { settings, ways } } };
    },
  },
  {
    method: 'POST',
    path: '/api/boards/[boardId]/submit',
    access: act('boards.submit'),
    body: 'optional',
    scope: 'path',
    mutates: true,
    call: (fx) => ({ params: byBoard(fx), body: { version: fx.board.version } }),
  },
  {
    method: 'GET',
    path: '/api/boards/[boardId]/attachments',
    access: act('boards.read'),
    body: 'none',
    scope: 'path',
    mutates: false,
    call: (fx) => ({ params: byBoard(fx) }),
  },
  {
    method: 'POST',
    path: '/api/boards/[boardId]/attachments',
    access: act('walk.record'),
    body: 'multipart',
    scope: 'path',
    mutates: false,
    call: (fx) => ({
      params: byBoard(fx),
      form: {
        file: { bytes: fx.photoPng, name: 'board-front.png', type: 'image/png' },
        wayId: fx.board.ways[1].id,
      },
    }),
  },
  {
    method: 'GET',
    path: '/api/boards/[boardId]/comments',
    access: act('boards.read'),
    body: 'none',
    scope: 'path',
    mutates: false,
    call: (fx) => ({ params: byBoard(fx) }),
  },
  {
    method: 'POST',
    path: '/api/boards/[boardId]/comments',
    access: {
      kind: 'action',
      action: 'boards.read',
      narrowedTo: {
        roles: ['admin', 'designer', 'inspector'],
        by: 'lib/dal/review.ts addComment: reviewers, and the designers answering them',
      },
    },
    body: 'required',
    scope: 'path',
    mutates: false,
    call: (fx) => ({
      params: byBoard(fx),
      body: { wayId: fx.board.ways[1].id, body: 'Check the cable route here.' },
    }),
  },
  {
    method: 'POST',
    path: '/api/boards/[boardId]/comments/answered',
    access: act('comments.answer'),
    body: 'required',
    scope: 'path',
    mutates: true,
    needs: ['comment'],
    call: (fx) => ({ params: byBoard(fx), body: { commentIds: [fx.commentId] } }),
  },
  {
    method: 'GET',
    path: '/api/boards/[boardId]/labels',
    access: act('schedule.print'),
    body: 'none',
    scope: 'path',
    mutates: false,
    stage: 'issued',
    call: (fx) => ({ params: byBoard(fx), query: { revision: String(fx.board.revision) } }),
  },
  {
    method: 'GET',
    path: '/api/boards/[boardId]/review',
    access: act('boards.read'),
    body: 'none',
    scope: 'path',
    mutates: false,
    call: (fx) => ({ params: byBoard(fx) }),
  },
  {
    method: 'POST',
    path: '/api/boards/[boardId]/review/approve',
    access: act('boards.review'),
    body: 'required',
    scope: 'path',
    mutates: true,
    stage: 'in-review',
    call: (fx, as) => ({
      params: byBoard(fx),
      body: { acknowledgeFailures: true, declaration: fx.names[as], revision: fx.board.revision },
    }),
  },
  {
    method: 'POST',
    path: '/api/boards/[boardId]/review/return',
    access: act('boards.review'),
    body: 'optional',
    scope: 'path',
    mutates: true,
    stage: 'in-review',
    call: (fx) => ({ params: byBoard(fx), body: { comment: 'Way 2 needs a 30 mA RCD.' } }),
  },
  {
    method: 'GET',
    path: '/api/boards/[boardId]/revisions',
    access: act('boards.read'),
    body: 'none',
    scope: 'path',
    mutates: false,
    call: (fx) => ({ params: byBoard(fx) }),
  },
  {
    method: 'GET',
    path: '/api/boards/[boardId]/revisions/[revision]',
    access: act('boards.read'),
    body: 'none',
    scope: 'path',
    mutates: false,
    stage: 'issued',
    call: (fx) => ({ params: { ...byBoard(fx), revision: String(fx.board.revision) }, query: { from: 'current' } }),
  },
  {
    method: 'GET',
    path: '/api/boards/[boardId]/schedule',
    access: act('schedule.print'),
    body: 'none',
    scope: 'path',
    mutates: false,
    stage: 'issued',
    call: (fx) => ({ params: byBoard(fx) }),
  },
  {
    method: 'GET',
    path: '/api/boards/[boardId]/schedule/email',
    access: act('schedule.print'),
    body: 'none',
    scope: 'path',
    mutates: false,
    call: (fx) => ({ params: byBoard(fx) }),
  },
  {
    method: 'POST',
    path: '/api/boards/[boardId]/schedule/email',
    access: act('schedule.print'),
    body: 'required',
    scope: 'path',
    mutates: false,
    stage: 'issued',
    call: (fx) => ({ params: byBoard(fx), body: { to: 'client@example.test', message: 'The schedule as issued.' } }),
  },
  {
    method: 'GET',
    path: '/api/boards/[boardId]/ways/walk',
    access: act('boards.read'),
    body: 'none',
    scope: 'path',
    mutates: false,
    call: (fx) => ({ params: byBoard(fx) }),
  },
  {
    method: 'POST',
    path: '/api/boards/[boardId]/ways/[wayId]/label',
    access: act('walk.record'),
    body: 'required',
    scope: 'path',
    mutates: true,
    stage: 'issued',
    call: (fx) => ({
      params: { ...byBoard(fx), wayId: fx.board.ways[1].id },
      body: { status: 'matches', note: 'Legible.' },
    }),
  },
  {
    method: 'GET',
    path: '/api/attachments/[attachmentId]',
    access: act('boards.read'),
    body: 'none',
    scope: 'path',
    mutates: false,
    needs: ['attachment'],
    call: (fx) => ({ params: { attachmentId: fx.attachmentId } }),
  },
  {
    method: 'DELETE',
    path: '/api/attachments/[attachmentId]',
    access: act('walk.record'),
    body: 'none',
    scope: 'path',
    mutates: true,
    needs: ['attachment'],
    call: (fx) => ({ params: { attachmentId: fx.attachmentId } }),
  },
  {
    method: 'GET',
    path: '/api/attachments/[attachmentId]/thumb',
    access: act('boards.read'),
    body: 'none',
    scope: 'path',
    mutates: false,
    needs: ['attachment'],
    call: (fx) => ({ params: { attachmentId: fx.attachmentId } }),
  },
  {
    method: 'GET',
    path: '/api/dev/mailbox',
    access: act('mailbox.read'),
    body: 'none',
    scope: 'list',
    mutates: false,
    call: () => ({ params: {} }),
  },
  {
    method: 'POST',
    path: '/api/invitations/accept',
    access: {
      kind: 'public',
      reason: 'the invited person has no account yet; the one-time token from the e-mail is the credential.',
    },
    body: 'required',
    scope: 'none',
    mutates: true,
    call: (fx) => ({ params: {}, body: { token: fx.invitationToken, password: 'wiring-plan-2026' } }),
  },
  {
    method: 'GET',
    path: '/api/me',
    access: { kind: 'signed-in' },
    body: 'none',
    scope: 'none',
    mutates: false,
    call: () => ({ params: {} }),
  },
  {
    method: 'GET',
    path: '/api/members',
    access: act('members.manage'),
    body: 'none',
    scope: 'list',
    mutates: false,
    call: () => ({ params: {} }),
  },
  {
    method: 'POST',
    path: '/api/members',
    access: act('members.manage'),
    body: 'required',
    scope: 'list',
    mutates: false,
    call: (fx) => ({
      params: {},
      body: { email: `new-${globalThis.crypto.randomUUID()}@example.test`, name: 'New member', role: 'installer' },
    }),
  },
  {
    method: 'PATCH',
    path: '/api/members/[userId]',
    access: act('members.manage'),
    body: 'required',
    scope: 'path',
    mutates: true,
    call: (fx) => ({ params: { userId: fx.memberId }, body: { role: 'inspector' } }),
  },
  {
    method: 'GET',
    path: '/api/organisation',
    access: act('organisation.manage'),
    body: 'none',
    scope: 'list',
    mutates: false,
    call: () => ({ params: {} }),
  },
  {
    method: 'PATCH',
    path: '/api/organisation',
    access: act('organisation.manage'),
    body: 'required',
    scope: 'list',
    mutates: true,
    call: () => ({ params: {}, body: { allowSelfIssue: false } }),
  },
  {
    method: 'GET',
    path: '/api/sites',
    access: act('boards.read'),
    body: 'none',
    scope: 'list',
    mutates: false,
    call: () => ({ params: {} }),
  },
  {
    method: 'POST',
    path: '/api/sites',
    access: act('boards.edit'),
    body: 'required',
    scope: 'list',
    mutates: false,
    call: () => ({ params: {}, body: { name: 'Mill Cottage', address: '2 Weir Lane', client: 'R. Hartley' } }),
  },
  {
    method: 'GET',
    path: '/api/sites/[siteId]',
    access: act('boards.read'),
    body: 'none',
    scope: 'path',
    mutates: false,
    call: (fx) => ({ params: bySite(fx) }),
  },
  {
    method: 'PATCH',
    path: '/api/sites/[siteId]',
    access: act('boards.edit'),
    body: 'required',
    scope: 'path',
    mutates: true,
    call: (fx) => ({ params: bySite(fx), body: { name: 'Renamed site' } }),
  },
  {
    method: 'DELETE',
    path: '/api/sites/[siteId]',
    access: act('boards.discard'),
    body: 'none',
    scope: 'path',
    mutates: true,
    call: (fx) => ({ params: bySite(fx) }),
  },
  {
    method: 'POST',
    path: '/api/sites/[siteId]/restore',
    access: act('records.archive'),
    body: 'none',
    scope: 'path',
    mutates: true,
    stage: 'site-archived',
    call: (fx) => ({ params: bySite(fx) }),
  },
  {
    method: 'POST',
    path: '/api/sizing',
    access: act('sizing.run'),
    body: 'required',
    scope: 'none',
    mutates: false,
    call: () => ({ params: {}, body: QUICK_SIZE_BODY }),
  },
];

/** The roles that may call a route (every role for signed-in and public routes). */
export function rolesAllowed(spec: RouteSpec): readonly Role[] {
  if (spec.access.kind !== 'action') return ROLES;
  const roles: readonly Role[] = PERMISSIONS[spec.access.action];
  const narrowed = spec.access.narrowedTo?.roles;
  return narrowed ? roles.filter((r) => narrowed.includes(r)) : roles;
}

/** `GET /api/boards/[boardId]`: how a route is named in test titles and reports. */
export function routeName(spec: Pick<RouteSpec, 'method' | 'path'>): string {
  return `${spec.method} ${spec.path}`;
}
