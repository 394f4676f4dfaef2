import type { z } from 'zod';

/** The first issue of a zod error as `path: message`, in the `trials[3].onset` style of the contract. */
export function firstIssue(error: z.ZodError, root = ''): string {
  const issue = error.issues[0];
  if (!issue) return 'invalid';
  let path = root;
  for (const key of issue.path) path += typeof key === 'number' ? `[${key}]` : path === '' ? String(key) : `.${String(key)}`;
  const more = error.issues.length > 1 ? ` (and ${error.issues.length - 1} more)` : '';
  return `${path === '' ? '' : `${path}: `}${issue.message}${more}`;
}
