import { fieldIssues } from '@/lib/api/handler';
import { badRequest } from '@/lib/errors';

import { printQuerySchema, type PrintQuery } from '../types/schemas';

/** The schedule and label routes' query (`?revision=N&download=1`); junk is a 400 naming the field. */
export function parsePrintQuery(url: string): PrintQuery {
  const parsed = printQuerySchema.safeParse(Object.fromEntries(new URL(url).searchParams));
  if (!parsed.success) throw badRequest(fieldIssues(parsed.error));
  return parsed.data;
}
