/**
 * Validation messages keyed by field path ("model.grid.end"), from the shared
 * zod schema in the browser or from the server's `details` — the same paths.
 */
import type { ZodError } from 'zod';

export type IssueMap = Map<string, string>;

const friendly = (message: string) =>
  /received NaN|expected number, received (undefined|string)/.test(message) ? 'enter a number' : message;

export function issuesFromZod(error: ZodError | undefined): IssueMap {
  const out: IssueMap = new Map();
  for (const issue of error?.issues ?? []) {
    const key = issue.path.join('.');
    if (!out.has(key)) out.set(key, friendly(issue.message));
  }
  return out;
}

export function issuesFromDetails(details: unknown): IssueMap {
  const out: IssueMap = new Map();
  if (!Array.isArray(details)) return out;
  for (const d of details) {
    if (d && typeof d === 'object' && typeof (d as { path?: unknown }).path === 'string') {
      const { path, message } = d as { path: string; message?: string };
      if (!out.has(path)) out.set(path, friendly(String(message ?? 'not valid')));
    }
  }
  return out;
}

/** The message for a field or any of its children (a list's items report on the list). */
export function issueAt(issues: IssueMap, path: string, deep = false): string | undefined {
  const exact = issues.get(path);
  if (exact || !deep) return exact;
  for (const [k, v] of issues) if (k.startsWith(`${path}.`)) return v;
  return undefined;
}

/** A DOM id for a field path, for aria-describedby and the error summary's links. */
export const fieldId = (path: string) => `field-${path.replace(/[^a-zA-Z0-9]+/g, '-')}`;
