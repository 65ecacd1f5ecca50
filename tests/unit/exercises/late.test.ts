import { describe, expect, it } from 'vitest';
import { latePenalty, zonedWallTimeToInstant } from '@shared/exercises/late';

const policy = { graceMinutes: 15, penaltyPerDayPercent: 10, capPercent: 30 };

describe('due moments in the exercise time zone', () => {
  it('reads winter and summer wall-clock times with the right offset', () => {
    // Europe/London is UTC+0 in winter and UTC+1 (BST) in summer (IANA tz database)
    expect(zonedWallTimeToInstant('2026-12-04T17:00', 'Europe/London').toISOString()).toBe('2026-12-04T17:00:00.000Z');
    expect(zonedWallTimeToInstant('2026-06-05T17:00', 'Europe/London').toISOString()).toBe('2026-06-05T16:00:00.000Z');
    // America/New_York is UTC−5 (EST) in winter (IANA tz database)
    expect(zonedWallTimeToInstant('2026-12-04T17:00', 'America/New_York').toISOString()).toBe('2026-12-04T22:00:00.000Z');
    expect(zonedWallTimeToInstant('2026-10-16T09:30', 'Asia/Kolkata').toISOString()).toBe('2026-10-16T04:00:00.000Z'); // UTC+5:30, no DST
  });

  it('handles the days the clocks change', () => {
    // 2026: UK clocks go back at 02:00 BST on 25 October, forward at 01:00 GMT on 29 March (EU rule: last Sundays)
    expect(zonedWallTimeToInstant('2026-10-25T17:00', 'Europe/London').toISOString()).toBe('2026-10-25T17:00:00.000Z');
    expect(zonedWallTimeToInstant('2026-10-24T17:00', 'Europe/London').toISOString()).toBe('2026-10-24T16:00:00.000Z');
    // 01:30 happens twice on 25 October: the first (BST) occurrence is taken
    expect(zonedWallTimeToInstant('2026-10-25T01:30', 'Europe/London').toISOString()).toBe('2026-10-25T00:30:00.000Z');
    // 01:30 does not exist on 29 March: it is moved forward by the gap to 02:30 BST
    // (the 'compatible' disambiguation of the TC39 Temporal proposal)
    expect(zonedWallTimeToInstant('2026-03-29T01:30', 'Europe/London').toISOString()).toBe('2026-03-29T01:30:00.000Z');
    expect(zonedWallTimeToInstant('2026-03-29T03:00', 'Europe/London').toISOString()).toBe('2026-03-29T02:00:00.000Z');
  });
});

describe('late penalties', () => {
  const due = new Date('2026-10-16T16:00:00Z');
  const at = (iso: string) => latePenalty({ submittedAt: new Date(iso), dueAt: due, policy });
  it('on time at the due second, inside the grace period, and late just after it', () => {
    expect(at('2026-10-16T16:00:00Z')).toMatchObject({ onTime: true, penaltyPercent: 0 });
    expect(at('2026-10-16T16:15:00Z')).toMatchObject({ onTime: true, penaltyPercent: 0, minutesLate: 15 });
    expect(at('2026-10-16T16:15:01Z')).toMatchObject({ onTime: false, daysLate: 1, penaltyPercent: 10 });
  });
  it('counts started days and stops at the cap', () => {
    expect(at('2026-10-17T16:15:00Z')).toMatchObject({ daysLate: 1, penaltyPercent: 10 });
    expect(at('2026-10-17T16:15:01Z')).toMatchObject({ daysLate: 2, penaltyPercent: 20 });
    expect(at('2026-10-30T12:00:00Z')).toMatchObject({ penaltyPercent: 30 });
  });
  it('a per-student extension moves the due moment', () => {
    const r = latePenalty({ submittedAt: new Date('2026-10-18T12:00:00Z'), dueAt: due, extensionMinutes: 3 * 24 * 60, policy });
    expect(r).toMatchObject({ onTime: true, penaltyPercent: 0 });
  });
});
