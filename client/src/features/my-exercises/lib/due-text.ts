/**
 * Due moments as a student reads them: absolute in the exercise's own time
 * zone ("Fri 16 Oct 2026, 17:00 BST") and relative to now ("in 3 days").
 */

/** "Fri 16 Oct 2026, 17:00 BST" in `timeZone`. */
export function formatInZone(iso: string, timeZone: string): string {
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return iso;
  const parts = new Intl.DateTimeFormat('en-GB', {
    timeZone,
    weekday: 'short',
    day: 'numeric',
    month: 'short',
    year: 'numeric',
    hour: '2-digit',
    minute: '2-digit',
    hourCycle: 'h23',
    timeZoneName: 'short',
  }).formatToParts(date);
  const get = (type: Intl.DateTimeFormatPartTypes) => parts.find((p) => p.type === type)?.value ?? '';
  return `${get('weekday')} ${get('day')} ${get('month')} ${get('year')}, ${get('hour')}:${get('minute')} ${get('timeZoneName')}`.trim();
}

const UNITS: [Intl.RelativeTimeFormatUnit, number][] = [
  ['year', 365 * 86_400_000],
  ['month', 30 * 86_400_000],
  ['week', 7 * 86_400_000],
  ['day', 86_400_000],
  ['hour', 3_600_000],
  ['minute', 60_000],
];

/** "in 3 days", "2 hours ago", "now" — the largest unit that fits, rounded toward zero. */
export function relativeToNow(iso: string, nowMs: number): string {
  const diff = new Date(iso).getTime() - nowMs;
  if (!Number.isFinite(diff)) return '';
  const format = new Intl.RelativeTimeFormat('en-GB', { numeric: 'auto' });
  for (const [unit, ms] of UNITS) {
    const amount = Math.trunc(diff / ms);
    if (amount !== 0) return format.format(amount, unit);
  }
  return 'now';
}

/** "2 d 3 h" for an extension in minutes. */
export function extensionText(minutes: number): string {
  const days = Math.floor(minutes / 1440);
  const hours = Math.floor((minutes % 1440) / 60);
  const rest = minutes % 60;
  return [days ? `${days} d` : '', hours ? `${hours} h` : '', rest ? `${rest} min` : ''].filter(Boolean).join(' ') || '0 min';
}
