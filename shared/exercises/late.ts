/**
 * Due moments and late penalties. A due date is written as a wall-clock time
 * in the exercise's time zone (what a lecturer means by "Friday 17:00"), so
 * the instant is found with the zone's own offset on that day, daylight
 * saving included (IANA tz database through Intl).
 */
import type { LatePolicy } from './spec';

function offsetMinutesAt(instantMs: number, timeZone: string): number {
  const parts = new Intl.DateTimeFormat('en-US', {
    timeZone,
    hourCycle: 'h23',
    year: 'numeric',
    month: '2-digit',
    day: '2-digit',
    hour: '2-digit',
    minute: '2-digit',
    second: '2-digit',
  }).formatToParts(new Date(instantMs));
  const get = (t: string) => Number(parts.find((p) => p.type === t)!.value);
  const asUtc = Date.UTC(get('year'), get('month') - 1, get('day'), get('hour'), get('minute'), get('second'));
  return Math.round((asUtc - Math.floor(instantMs / 1000) * 1000) / 60_000);
}

/**
 * The instant of a wall-clock time `YYYY-MM-DDTHH:MM` in `timeZone`. A time in
 * the hour skipped by a spring-forward change moves forward by the gap; in the
 * repeated autumn hour the first (earlier) occurrence is taken — the
 * 'compatible' rule of the TC39 Temporal proposal.
 */
export function zonedWallTimeToInstant(local: string, timeZone: string): Date {
  const m = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})$/.exec(local);
  if (!m) throw new RangeError(`"${local}" is not a YYYY-MM-DDTHH:MM wall-clock time`);
  const wallAsUtc = Date.UTC(+m[1], +m[2] - 1, +m[3], +m[4], +m[5]);
  // Two passes settle the offset except across a change, handled below.
  let guess = wallAsUtc - offsetMinutesAt(wallAsUtc, timeZone) * 60_000;
  guess = wallAsUtc - offsetMinutesAt(guess, timeZone) * 60_000;
  const earlier = wallAsUtc - offsetMinutesAt(guess - 3 * 3600_000, timeZone) * 60_000;
  // Prefer the earlier reading when it maps back to the same wall time (autumn overlap).
  if (earlier !== guess && earlier + offsetMinutesAt(earlier, timeZone) * 60_000 === wallAsUtc) return new Date(Math.min(earlier, guess));
  return new Date(guess);
}

export interface LateOutcome {
  /** minutes after the effective due moment (0 when on time) */
  minutesLate: number;
  /** started days late, counted after the grace period */
  daysLate: number;
  /** percentage of the total taken off */
  penaltyPercent: number;
  onTime: boolean;
}

/**
 * Lateness of an upload: due moment plus any per-student extension plus the
 * grace period; each started 24 h after that costs `penaltyPerDayPercent`, up
 * to `capPercent`.
 */
export function latePenalty(args: { submittedAt: Date; dueAt: Date; extensionMinutes?: number; policy: LatePolicy }): LateOutcome {
  const effectiveDue = args.dueAt.getTime() + (args.extensionMinutes ?? 0) * 60_000;
  const lateMs = args.submittedAt.getTime() - effectiveDue;
  if (lateMs <= 0) return { minutesLate: 0, daysLate: 0, penaltyPercent: 0, onTime: true };
  const minutesLate = Math.ceil(lateMs / 60_000);
  const afterGraceMs = lateMs - args.policy.graceMinutes * 60_000;
  if (afterGraceMs <= 0) return { minutesLate, daysLate: 0, penaltyPercent: 0, onTime: true };
  const daysLate = Math.ceil(afterGraceMs / 86_400_000);
  return { minutesLate, daysLate, penaltyPercent: Math.min(args.policy.capPercent, daysLate * args.policy.penaltyPerDayPercent), onTime: false };
}
