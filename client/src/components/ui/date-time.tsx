import { formatDate, formatDateTime } from '@client/lib/format';

/** A timestamp shown as "YYYY-MM-DD HH:mm" (local time) in the number face; the full ISO value is in the tooltip. */
export function DateTime({ iso, dateOnly = false }: { iso: string; dateOnly?: boolean }) {
  return (
    <time dateTime={iso} title={iso} className="num whitespace-nowrap">
      {dateOnly ? formatDate(iso) : formatDateTime(iso)}
    </time>
  );
}
