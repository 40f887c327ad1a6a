import type { Role } from '@/lib/domain';

/** A member (or pending invitation) as the members list shows it: plain data, safe for the browser. */
export type Member = {
  id: string;
  name: string;
  email: string;
  role: Role;
  active: boolean;
  pending: boolean;
  createdAt: string;
};
