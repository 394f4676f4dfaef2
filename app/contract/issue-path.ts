import type { z } from 'zod';

/** `request.trials[3].onset`: the path style every validator error in Gazeloom uses. */
export function formatPath(root: string, path: ReadonlyArray<PropertyKey>): string {
  let out = root;
  for (const key of path) {
    out += typeof key === 'number' ? `[${key}]` : `.${String(key)}`;
  }
  return out;
}

export function describeIssues(root: string, error: z.ZodError): { message: string; path: string } {
  const first = error.issues[0];
  if (!first) return { message: `${root} is invalid`, path: root };
  const path = formatPath(root, first.path);
  const more = error.issues.length > 1 ? ` (and ${error.issues.length - 1} more)` : '';
  return { message: `${path}: ${first.message}${more}`, path };
}
