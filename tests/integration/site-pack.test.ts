import { PDFDocument } from 'pdf-lib';
import { beforeAll, describe, expect, it } from 'vitest';

import * as feedRoute from '@/app/api/boards/[boardId]/feed/route';
import * as scheduleRoute from '@/app/api/boards/[boardId]/schedule/route';
import * as originRoute from '@/app/api/sites/[siteId]/origin/route';
import * as emailRoute from '@/app/api/sites/[siteId]/pack/email/route';
import * as packRoute from '@/app/api/sites/[siteId]/pack/route';
import { renderSitePackPdf } from '@/features/schedule/site-pack/render-site-pack';
import { sizeSite } from '@/lib/supply';

import { twoLevel } from '../unit/supply/fixtures';
import { caughtMail, ctx, jsonRequest, makeOrganisation, signInAs } from './helpers';
import { storeTree } from './site-fixtures';

type Org = Awaited<ReturnType<typeof makeOrganisation>>;
let team: Org;
let other: Org;

beforeAll(async () => {
  team = await makeOrganisation('Pack');
  other = await makeOrganisation('Other pack');
});

async function linked() {
  const fx = twoLevel();
  const t = await storeTree(team.org.id, fx, { siteName: 'Hollin Lane Joinery pack' });
  signInAs(team.users.designer);
  expect((await originRoute.PUT(jsonRequest('PUT', fx.origin), ctx({ siteId: t.site.id }))).status).toBe(200);
  const feed = { from: 'way', boardId: t.id('db1'), wayId: t.id('w-sub') };
  expect((await feedRoute.PUT(jsonRequest('PUT', { feed }), ctx({ boardId: t.id('fin') }))).status).toBe(200);
  return { fx, t };
}

const pages = async (bytes: ArrayBuffer | Uint8Array) => (await PDFDocument.load(bytes)).getPageCount();

describe('the site pack', () => {
  it('is one PDF: the pack’s own pages, then each board’s schedule', async () => {
    const { fx, t } = await linked();
    signInAs(team.users.inspector);
    const res = await packRoute.GET(jsonRequest('GET'), ctx({ siteId: t.site.id }));
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('application/pdf');
    const pack = await res.arrayBuffer();
    // Its parts, each printed alone: the pack's pages and the two schedules (drafts)
    const own = await renderSitePackPdf(sizeSite(fx), 'Hollin Lane Joinery pack');
    const schedulePages = [];
    for (const id of ['db1', 'fin']) {
      const s = await scheduleRoute.GET(jsonRequest('GET'), ctx({ boardId: t.id(id) }));
      expect(s.status).toBe(200);
      schedulePages.push(await pages(await s.arrayBuffer()));
    }
    expect(await pages(pack)).toBe((await pages(own.pdf)) + schedulePages[0] + schedulePages[1]);
    expect(schedulePages.every((n) => n >= 1)).toBe(true);
  });

  it('installers may not print it (it prints drafts); another organisation’s site is 404', async () => {
    const { t } = await linked();
    signInAs(team.users.installer);
    expect((await packRoute.GET(jsonRequest('GET'), ctx({ siteId: t.site.id }))).status).toBe(403);
    signInAs(other.users.inspector);
    expect((await packRoute.GET(jsonRequest('GET'), ctx({ siteId: t.site.id }))).status).toBe(404);
    const mail = await emailRoute.POST(jsonRequest('POST', { to: 'x@example.test' }), ctx({ siteId: t.site.id }));
    expect(mail.status).toBe(404);
  });

  it('is e-mailed through the outbox to the mail catcher, with the pack attached', async () => {
    const { t } = await linked();
    signInAs(team.users.inspector);
    const to = `client-${t.site.id.slice(0, 8)}@example.test`;
    const res = await emailRoute.POST(
      jsonRequest('POST', { to, message: 'The site pack for the workshop.' }),
      ctx({ siteId: t.site.id }),
    );
    expect(res.status).toBe(202);
    let found: Awaited<ReturnType<typeof caughtMail>>[number] | undefined;
    for (let i = 0; i < 50 && !found; i++) {
      found = (await caughtMail()).find((m) => m.to.includes(to));
      if (!found) await new Promise((r) => setTimeout(r, 200));
    }
    expect(found?.subject).toBe('Site pack: Hollin Lane Joinery pack');
    expect(found?.text).toContain('The site pack for the workshop.');
    expect(found?.text).toMatch(/design aid/i);
    expect(found?.attachments.map((a) => a.filename)).toEqual(['site-pack-hollin-lane-joinery-pack.pdf']);
  });
});
