/** "2026-10-16 17:00 BST" — a due time as written in the exercise's own time zone. */
export function formatDueLocal(dueLocal: string, timeZone: string, dueAt?: string): string {
  const text = dueLocal.replace('T', ' ');
  if (!dueAt) return `${text} (${timeZone})`;
  try {
    const name = new Intl.DateTimeFormat('en-GB', { timeZone, timeZoneName: 'short' })
      .formatToParts(new Date(dueAt))
      .find((p) => p.type === 'timeZoneName')?.value;
    return `${text} ${name ?? timeZone}`;
  } catch {
    return `${text} (${timeZone})`;
  }
}
