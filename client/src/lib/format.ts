const pad = (n: number) => String(n).padStart(2, '0');

function parse(iso: string): Date | null {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? null : date;
}

/** "2026-12-01", in the browser's time zone; unparseable input comes back unchanged. */
export function formatDate(iso: string): string {
  // A calendar date has no time zone; do not shift it.
  if (/^\d{4}-\d{2}-\d{2}$/.test(iso)) return iso;
  const d = parse(iso);
  if (!d) return iso;
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}`;
}

/** "2026-12-01 14:05", in the browser's time zone; unparseable input comes back unchanged. */
export function formatDateTime(iso: string): string {
  const d = parse(iso);
  if (!d) return iso;
  return `${formatDate(iso)} ${pad(d.getHours())}:${pad(d.getMinutes())}`;
}

/** A whole count with thin grouping ("1 204"), the way lab notebooks write it. */
export function formatCount(n: number): string {
  return new Intl.NumberFormat('en-GB', { useGrouping: true, maximumFractionDigits: 0 })
    .format(n)
    .replace(/,/g, '\u2009');
}
