/** A site as the sites list shows it: plain data, safe for the browser. */
export type SiteSummary = {
  id: string;
  name: string;
  address: string;
  client: string;
  boardCount: number;
  updatedAt: string;
  /** When the site was archived, and by whom; null for a live site. */
  archived: { at: string; byName: string } | null;
};
