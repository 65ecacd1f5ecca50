/**
 * A compact reading of an audit entry's before/after records: one line per
 * field that changed, with both values as short JSON.
 */
export type ChangeKind = 'added' | 'removed' | 'changed';

export interface ChangeLine {
  /** Field name; '' when the record itself is not an object. */
  key: string;
  kind: ChangeKind;
  before?: string;
  after?: string;
}

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

/** JSON of a value, cut to `maxLength` characters with an ellipsis. */
export function shortJson(value: unknown, maxLength = 48): string {
  let text: string;
  try {
    text = JSON.stringify(value) ?? 'undefined';
  } catch {
    text = String(value);
  }
  return text.length > maxLength ? `${text.slice(0, Math.max(1, maxLength - 1))}…` : text;
}

const same = (a: unknown, b: unknown) => shortJson(a, Infinity) === shortJson(b, Infinity);

/** The fields that differ between `before` and `after` (null/undefined mean "no record"). */
export function compactChange(before: unknown, after: unknown, maxLength = 48): ChangeLine[] {
  const hasBefore = before !== null && before !== undefined;
  const hasAfter = after !== null && after !== undefined;
  if (!hasBefore && !hasAfter) return [];

  if ((hasBefore && !isRecord(before)) || (hasAfter && !isRecord(after))) {
    if (hasBefore && hasAfter && same(before, after)) return [];
    return [
      {
        key: '',
        kind: !hasBefore ? 'added' : !hasAfter ? 'removed' : 'changed',
        before: hasBefore ? shortJson(before, maxLength) : undefined,
        after: hasAfter ? shortJson(after, maxLength) : undefined,
      },
    ];
  }

  const b = (before ?? {}) as Record<string, unknown>;
  const a = (after ?? {}) as Record<string, unknown>;
  const keys = [...Object.keys(b), ...Object.keys(a).filter((k) => !(k in b))];
  const lines: ChangeLine[] = [];
  for (const key of keys) {
    const inBefore = hasBefore && key in b;
    const inAfter = hasAfter && key in a;
    if (inBefore && inAfter) {
      if (!same(b[key], a[key])) {
        lines.push({ key, kind: 'changed', before: shortJson(b[key], maxLength), after: shortJson(a[key], maxLength) });
      }
    } else if (inAfter) {
      lines.push({ key, kind: 'added', after: shortJson(a[key], maxLength) });
    } else if (inBefore) {
      lines.push({ key, kind: 'removed', before: shortJson(b[key], maxLength) });
    }
  }
  return lines;
}
