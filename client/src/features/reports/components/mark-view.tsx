import type { MarkView as Mark } from '@shared/api/reports';
import { Num } from '@client/components/ui/num';
import { StatusText } from '@client/components/ui/status-text';
import { Table, Td, Th } from '@client/components/ui/table';
import { formatPoints } from '../lib/series';

/**
 * The checks of a mark with their feedback sentences; adjustments (if any) beside the automatic points.
 * `provisional`: a student's automatic mark before the report is returned, labelled as such.
 */
export function MarkView({ mark, showRevision = false, provisional = false, title }: { mark: Mark; showRevision?: boolean; provisional?: boolean; title?: string }) {
  const adjusted = new Map(mark.adjustments.map((a) => [a.checkId, a]));
  const hasAdjustments = mark.adjustments.length > 0;
  return (
    <section aria-labelledby="mark-heading" className="flex flex-col gap-3" data-testid="mark-view" data-provisional={provisional ? 'true' : undefined}>
      <div className="flex flex-wrap items-baseline justify-between gap-3">
        <h2 id="mark-heading" className="flex flex-wrap items-baseline gap-x-3 font-serif text-xl font-semibold">
          {title ?? (provisional ? 'Automatic mark' : 'Mark')}
          {provisional ? (
            <span className="font-sans text-[0.85rem] font-normal">
              <StatusText tone="caution">Provisional</StatusText>
            </span>
          ) : null}
        </h2>
        <p className="text-[0.95rem]" data-testid="mark-total">
          <Num className="text-lg font-semibold">{formatPoints(hasAdjustments ? mark.adjustedTotal : mark.total)}</Num>
          <span className="text-graphite"> of </span>
          <Num>{formatPoints(mark.max)}</Num>
          <span className="text-graphite"> points</span>
          {mark.latePenaltyPercent > 0 ? <span className="ml-2 text-caution">(late: −{mark.latePenaltyPercent}%)</span> : null}
        </p>
      </div>
      {provisional ? (
        <p className="text-[0.9rem] text-graphite" data-testid="mark-provisional-note">
          The automatic mark of this version, given when it was uploaded. It is provisional until an assistant returns the report, and may still be adjusted.
        </p>
      ) : null}
      <Table label="Checks of the automatic marking">
        <thead>
          <tr>
            <Th>Check</Th>
            <Th className="text-right">Points</Th>
            {hasAdjustments ? <Th className="text-right">Adjusted</Th> : null}
            <Th>Feedback</Th>
          </tr>
        </thead>
        <tbody>
          {mark.checks.map((c) => {
            const a = adjusted.get(c.id);
            return (
              <tr key={c.id} data-testid="check-row" data-check-id={c.id}>
                <Td className="font-medium">{c.label}</Td>
                <Td className="text-right whitespace-nowrap">
                  <Num>
                    {formatPoints(c.points)} / {formatPoints(c.max)}
                  </Num>
                </Td>
                {hasAdjustments ? (
                  <Td className="text-right whitespace-nowrap">
                    {a ? (
                      <span title={`${a.reason} — ${a.adjustedBy.displayName}`}>
                        <Num>{formatPoints(a.points)}</Num>
                      </span>
                    ) : (
                      <span className="text-graphite">—</span>
                    )}
                  </Td>
                ) : null}
                <Td className="max-w-[60ch]">
                  {c.message}
                  {a ? <p className="mt-1 text-[0.85rem] text-graphite">Adjusted by {a.adjustedBy.displayName}: {a.reason}</p> : null}
                </Td>
              </tr>
            );
          })}
        </tbody>
      </Table>
      <p className="text-[0.8rem] text-graphite">
        Automatic points <Num>{formatPoints(mark.points)}</Num>
        {hasAdjustments ? (
          <>
            , after adjustments <Num>{formatPoints(mark.adjustedPoints)}</Num>
          </>
        ) : null}
        {mark.latePenaltyPercent > 0 ? (
          <>
            , late penalty <Num>{mark.latePenaltyPercent}%</Num>
          </>
        ) : null}
        {showRevision ? (
          <>
            {' '}
            · marked against revision <Num>{mark.revisionNo}</Num> (engine <Num>{mark.engineVersion}</Num>)
          </>
        ) : null}
      </p>
    </section>
  );
}
