import { Link } from 'react-router';
import type { ReportSummary } from '@shared/api/reports';
import { DateTime } from '@client/components/ui/date-time';
import { Num } from '@client/components/ui/num';
import { SkeletonRows, Table, Td, Th } from '@client/components/ui/table';
import { StatusText } from '@client/components/ui/status-text';
import { distanceUnitLabel, energyUnitLabel } from '@shared/chemistry/units';
import { formatBytes, formatPoints } from '../lib/series';
import { LateStatusText } from './late-status';

const stateWords: Record<ReportSummary['state'], { text: string; tone: 'neutral' | 'good' | 'caution' }> = {
  submitted: { text: 'Submitted', tone: 'neutral' },
  marked: { text: 'Being reviewed', tone: 'neutral' },
  returned: { text: 'Returned', tone: 'good' },
};

/** Every version of one student's report, newest first; nothing is ever overwritten. */
export function VersionsTable({ reports, loading, staff }: { reports: ReportSummary[] | undefined; loading: boolean; staff: boolean }) {
  return (
    <Table label="Versions of the report, newest first" busy={loading} testId="versions-table">
      <thead>
        <tr>
          <Th>Version</Th>
          <Th>Uploaded</Th>
          <Th>Data file</Th>
          <Th>Write-up</Th>
          <Th>Units</Th>
          <Th>Late status</Th>
          <Th>State</Th>
          <Th className="text-right">Mark</Th>
          <Th>
            <span className="sr-only">Open</span>
          </Th>
        </tr>
      </thead>
      <tbody>
        {loading || !reports ? (
          <SkeletonRows columns={9} rows={2} label="Loading the versions" />
        ) : (
          reports.map((r) => {
            const state = stateWords[r.state];
            // a student opens a version once its mark is theirs to see (at once or after the return, by the exercise)
            const open = staff || r.state === 'returned' || r.mark !== null;
            const provisional = !staff && r.state !== 'returned';
            return (
              <tr key={r.id} data-testid="version-row" data-version={r.versionNo} className="hover:bg-paper">
                <Td>
                  <Num>v{r.versionNo}</Num>
                </Td>
                <Td>
                  <DateTime iso={r.uploadedAt} />
                  {r.onBehalf ? <div className="text-[0.8rem] text-graphite">by {r.uploadedBy.displayName}</div> : null}
                </Td>
                <Td>
                  <span className="font-medium">{r.dataFile.fileName}</span>{' '}
                  <span className="num text-[0.8rem] text-graphite">{formatBytes(r.dataFile.sizeBytes)}</span>
                  <div className="text-[0.8rem] text-graphite">
                    <Num>{r.pointCount}</Num> points
                  </div>
                </Td>
                <Td>{r.writeup ? <span>{r.writeup.fileName}</span> : <span className="text-graphite">—</span>}</Td>
                <Td className="whitespace-nowrap">
                  {r.units ? (
                    <Num>
                      {distanceUnitLabel[r.units.distance]}, {energyUnitLabel[r.units.energy]}
                    </Num>
                  ) : (
                    <span className="text-graphite">answers only</span>
                  )}
                </Td>
                <Td>
                  <LateStatusText late={r.late} />
                </Td>
                <Td>
                  <StatusText tone={state.tone}>{state.text}</StatusText>
                </Td>
                <Td className="text-right whitespace-nowrap">
                  {r.mark ? (
                    <>
                      <Num>
                        {formatPoints(r.mark.adjustments.length ? r.mark.adjustedTotal : r.mark.total)} of {formatPoints(r.mark.max)}
                      </Num>
                      {provisional ? <div className="text-[0.8rem] text-graphite">automatic, provisional</div> : null}
                    </>
                  ) : (
                    <span className="text-graphite">{staff ? '—' : 'after return'}</span>
                  )}
                </Td>
                <Td>
                  {open ? (
                    <Link to={`/reports/${r.id}`} className="text-reference underline-offset-2 hover:underline" aria-label={`Open version ${r.versionNo}`}>
                      {staff ? 'Open' : 'Marks and feedback'}
                    </Link>
                  ) : null}
                </Td>
              </tr>
            );
          })
        )}
      </tbody>
    </Table>
  );
}
