import 'server-only';

import { Op, type Transaction } from 'sequelize';

import type { Actor } from '@/lib/auth/session';
import { mayRestore, siteRemoval } from '@/lib/boards/record-rules';
import { db } from '@/lib/db';
import { audit, auditMany } from '@/lib/dal/audit';
import { countBoardsBySite, raiseSiteBoardVersions, readSiteBoardRecords } from '@/lib/dal/board-repository';
import { memberNames } from '@/lib/dal/members';
import { ARCHIVED_SITE } from '@/lib/dal/site-tree';
import { conflict, forbidden, HttpError, notFound } from '@/lib/errors';
import type { SiteInput } from '@/lib/sites/schemas';
import { BoardRevision, Site } from '@/models';
import type { SiteSummary } from '@/lib/sites/types';

function toSummary(site: Site, boardCount: number, archivedByName = 'A former member'): SiteSummary {
  return {
    id: site.id,
    name: site.name,
    address: site.address,
    client: site.client,
    boardCount,
    updatedAt: site.updatedAt.toISOString(),
    archived: site.archivedAt ? { at: site.archivedAt.toISOString(), byName: archivedByName } : null,
  };
}

/** The organisation's live sites (or, with `archived`, the archived ones) with their board counts. */
export async function listSites(actor: Actor, opts: { archived?: boolean } = {}): Promise<SiteSummary[]> {
  const sites = await Site.findAll({
    where: { organisationId: actor.organisationId, archivedAt: opts.archived ? { [Op.ne]: null } : null },
    order: [['name', 'ASC']],
  });
  const bySite = await countBoardsBySite({ organisationId: actor.organisationId }, !!opts.archived);
  const names = await memberNames(sites.map((s) => s.archivedById));
  return sites.map((s) => toSummary(s, bySite.get(s.id) ?? 0, names.get(s.archivedById ?? '')));
}

/** One site of the caller's organisation, or 404. */
export async function findSite(actor: Actor, siteId: string): Promise<Site> {
  const site = await Site.findOne({ where: { id: siteId, organisationId: actor.organisationId } });
  if (!site) throw notFound('The site');
  return site;
}

export async function getSite(actor: Actor, siteId: string): Promise<SiteSummary> {
  const site = await findSite(actor, siteId);
  const count = (await countBoardsBySite({ siteId: site.id }, !!site.archivedAt)).get(site.id) ?? 0;
  return toSummary(site, count, (await memberNames([site.archivedById])).get(site.archivedById ?? ''));
}

export async function createSite(actor: Actor, input: SiteInput): Promise<SiteSummary> {
  const site = await db().transaction(async (transaction) => {
    const created = await Site.create({ ...input, organisationId: actor.organisationId }, { transaction });
    await audit(actor, 'site.created', { siteId: created.id, name: input.name }, { transaction });
    return created;
  });
  return toSummary(site, 0);
}

export async function updateSite(actor: Actor, siteId: string, input: Partial<SiteInput>): Promise<SiteSummary> {
  const site = await findSite(actor, siteId);
  if (site.archivedAt) throw conflict(ARCHIVED_SITE);
  await db().transaction(async (transaction) => {
    await site.update(input, { transaction });
    await audit(actor, 'site.renamed', { siteId, ...input }, { transaction });
  });
  return getSite(actor, siteId);
}

/** The site row of the caller's organisation, locked for the rest of the transaction. */
function lockedSite(actor: Actor, siteId: string, transaction: Transaction): Promise<Site | null> {
  return Site.findOne({
    where: { id: siteId, organisationId: actor.organisationId },
    transaction,
    lock: transaction.LOCK.UPDATE,
  });
}

/**
 * Archives a site: it and its boards leave the lists and become read-only, nothing is
 * removed (lib/boards/record-rules.ts siteRemoval: a site holding an issued board, admins
 * only). The site row is locked, and so are its boards, so that no save lands half-way.
 */
export async function archiveSite(actor: Actor, siteId: string): Promise<SiteSummary> {
  await db().transaction(async (transaction) => {
    const site = await lockedSite(actor, siteId, transaction);
    if (!site) throw notFound('The site');
    const boards = await readSiteBoardRecords(siteId, { transaction, lock: true });
    const issued = await BoardRevision.count({ where: { boardId: boards.map((b) => b.id) }, transaction });
    const rule = siteRemoval(actor.role, { holdsIssued: issued > 0, archived: !!site.archivedAt });
    if (rule.refused) throw new HttpError(rule.status, rule.message);
    await site.update({ archivedAt: new Date(), archivedById: actor.userId }, { transaction });
    // Every board's version moves on: an editor still open cannot save into an archived site
    if (boards.length) await raiseSiteBoardVersions(siteId, transaction);
    const live = boards.filter((b) => !b.deletedAt && !b.archivedAt);
    const boardNames = live.map((b) => ({ id: b.id, name: b.name }));
    // The site's trail, and each board's own trail too
    const events = [
      { action: 'site.archived' as const, details: { siteId, name: site.name, boards: boardNames }, boardId: null },
      ...live.map((b) => ({
        action: 'board.archived' as const,
        details: { name: b.name, revision: b.revision, siteId, site: site.name },
        boardId: b.id,
      })),
    ];
    await auditMany(actor, events, { transaction });
  });
  return getSite(actor, siteId);
}

/** Brings an archived site, and the boards it held, back into the lists (admins). */
export async function restoreSite(actor: Actor, siteId: string): Promise<SiteSummary> {
  if (!mayRestore(actor.role, 'archived')) throw forbidden('restore archived sites');
  await findSite(actor, siteId);
  await db().transaction(async (transaction) => {
    const site = await lockedSite(actor, siteId, transaction);
    if (!site?.archivedAt) throw conflict('This site is not archived.');
    await site.update({ archivedAt: null, archivedById: null }, { transaction });
    const boards = await readSiteBoardRecords(siteId, { transaction, live: true });
    const events = [
      { action: 'site.restored' as const, details: { siteId, name: site.name }, boardId: null },
      ...boards.map((b) => ({
        action: 'board.restored' as const,
        details: { name: b.name, siteId, site: site.name },
        boardId: b.id,
      })),
    ];
    await auditMany(actor, events, { transaction });
  });
  return getSite(actor, siteId);
}
