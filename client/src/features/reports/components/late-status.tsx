import { StatusText } from '@client/components/ui/status-text';
import type { LateStatus } from '@shared/api/reports';
import { durationText } from '../lib/series';

/** "On time" or "Late by 2 days 3 h — 30% off", with a shape as well as a colour. */
export function LateStatusText({ late }: { late: LateStatus }) {
  if (!late.late) return <StatusText tone="good">On time</StatusText>;
  return (
    <StatusText tone="caution">
      Late by {durationText(late.minutesLate)}
      {late.penaltyPercent > 0 ? ` — ${late.penaltyPercent}% off` : ' (within the grace period)'}
    </StatusText>
  );
}
