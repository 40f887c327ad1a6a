/** One entry of a board's change history, as the audit trail shows it: plain data, safe for the browser. */
export type AuditEntry = {
  id: string;
  action: string;
  details: Record<string, unknown>;
  userName: string | null;
  createdAt: string;
  /** The way's printed reference now ("7", "3L2"), when the event names a way that still has one. */
  wayLabel: string | null;
};

/** One page of a board's trail, newest first; `nextBefore` asks for the page after it. */
export type AuditPage = { entries: AuditEntry[]; nextBefore: string | null };
