import type { z } from 'zod';

/**
 * Plain-words messages for the checks a schema does not word itself (a number left empty,
 * a value out of range). Messages written in the schema still win. Pass it to `zodResolver`
 * as `{ error: formErrorMap }`.
 */
export const formErrorMap: z.core.$ZodErrorMap = (issue) => {
  switch (issue.code) {
    case 'invalid_type':
      if (issue.expected === 'number') return 'Enter a number.';
      if (issue.expected === 'string') return 'Fill in this field.';
      return undefined;
    case 'too_small':
      if (issue.origin === 'number') return `Use ${String(issue.minimum)} or more.`;
      if (issue.origin === 'string') {
        return Number(issue.minimum) <= 1 ? 'Fill in this field.' : `Use at least ${String(issue.minimum)} characters.`;
      }
      return undefined;
    case 'too_big':
      if (issue.origin === 'number') return `Use ${String(issue.maximum)} or less.`;
      if (issue.origin === 'string') return `Use at most ${String(issue.maximum)} characters.`;
      return undefined;
    case 'invalid_format':
      if (issue.format === 'uuid') return 'Choose one from the list.';
      return undefined;
    case 'invalid_value':
    case 'invalid_union':
      return 'Choose one of the options.';
    default:
      return undefined;
  }
};
