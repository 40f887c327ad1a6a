import 'server-only';

import type { WhereOptions } from 'sequelize';

import type { Actor } from '@/lib/auth/session';
import { db } from '@/lib/db';
import { audit } from '@/lib/dal/audit';
import { notFound } from '@/lib/errors';
import type { SiteInput } from '@/lib/sites/schemas';
import { Board, Site } from '@/models';

// The schema lives in lib/sites/schemas.ts so the browser form can share it.
export { siteInputSchema, type SiteInput } from '@/lib/sites/schemas';

export type SiteSummary = {
  id: string;
  name: string;
  address: string;
  client: string;
  boardCount: number;
  updatedAt: string;
};

function toSummary(site: Site, boardCount: number): SiteSummary {
  return {
    id: site.id,
    name: site.name,
    address: site.address,
    client: site.client,
    boardCount,
    updatedAt: site.updatedAt.toISOString(),
  };
}

/** The organisation's sites with their board counts. */
export async function listSites(actor: Actor): Promise<SiteSummary[]> {
  db();
  const sites = await Site.findAll({
    where: { organisationId: actor.organisationId },
    order: [['name', 'ASC']],
  });
  const counts = (await Board.count({
    where: { organisationId: actor.organisationId },
    group: ['siteId'],
  })) as unknown as { siteId: string; count: number }[];
  const bySite = new Map(counts.map((c) => [c.siteId, Number(c.count)]));
  return sites.map((s) => toSummary(s, bySite.get(s.id) ?? 0));
}

/** One site of the caller's organisation, or 404. */
export async function findSite(actor: Actor, siteId: string): Promise<Site> {
  db();
  const where: WhereOptions = { id: siteId, organisationId: actor.organisationId };
  const site = await Site.findOne({ where });
  if (!site) throw notFound('The site');
  return site;
}

export async function getSite(actor: Actor, siteId: string): Promise<SiteSummary> {
  const site = await findSite(actor, siteId);
  const count = await Board.count({ where: { siteId: site.id } });
  return toSummary(site, count);
}

export async function createSite(actor: Actor, input: SiteInput): Promise<SiteSummary> {
  const site = await db().transaction(async (transaction) => {
    const created = await Site.create(
      { ...input, organisationId: actor.organisationId },
      { transaction },
    );
    await audit(actor, 'site.created', { siteId: created.id, name: input.name }, { transaction });
    return created;
  });
  return toSummary(site, 0);
}

export async function updateSite(
  actor: Actor,
  siteId: string,
  input: Partial<SiteInput>,
): Promise<SiteSummary> {
  const site = await findSite(actor, siteId);
  await db().transaction(async (transaction) => {
    await site.update(input, { transaction });
    await audit(actor, 'site.renamed', { siteId, ...input }, { transaction });
  });
  return getSite(actor, siteId);
}

export async function deleteSite(actor: Actor, siteId: string): Promise<void> {
  const site = await findSite(actor, siteId);
  await db().transaction(async (transaction) => {
    await site.destroy({ transaction });
    await audit(actor, 'site.deleted', { siteId, name: site.name }, { transaction });
  });
}

