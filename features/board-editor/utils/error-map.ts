import type { z } from 'zod';

import { formErrorMap } from '@/lib/forms/zod-messages';

/**
 * The app's plain-words messages, with strict bounds said as such ("more than 0", not "0 or
 * more") for the engine's `gt` and `lt` limits.
 */
export const editorErrorMap: z.core.$ZodErrorMap = (issue) => {
  if (issue.code === 'too_small' && issue.origin === 'number' && issue.inclusive === false) {
    return `Use more than ${String(issue.minimum)}.`;
  }
  if (issue.code === 'too_big' && issue.origin === 'number' && issue.inclusive === false) {
    return `Use less than ${String(issue.maximum)}.`;
  }
  return formErrorMap(issue);
};
