import { Link } from 'react-router';
import type { ExerciseSummary } from '@shared/api/exercises';
import { Num } from '@client/components/ui/num';
import { StatusText } from '@client/components/ui/status-text';
import { SkeletonRows, Table, Td, Th } from '@client/components/ui/table';
import { formatDueLocal } from '../lib/due';
import { familyLabel } from '../lib/spec-defaults';
import { stateLabel } from './exercise-editor';

const tone = { draft: 'neutral', published: 'good', closed: 'caution' } as const;

/** A course's exercises: state, due time in the exercise's zone and, for staff, the counts. */
export function ExerciseList({ exercises, loading, staff }: { exercises: ExerciseSummary[] | undefined; loading: boolean; staff: boolean }) {
  const columns = staff ? 8 : 4;
  return (
    <Table label="Exercises" busy={loading} testId="exercises-table">
      <thead>
        <tr>
          <Th>Title</Th>
          <Th>Model</Th>
          <Th>State</Th>
          <Th>Due</Th>
          {staff ? (
            <>
              <Th className="text-right">Revision</Th>
              <Th className="text-right">Variants drawn</Th>
              <Th className="text-right">Handed in</Th>
              <Th className="text-right">Checks</Th>
            </>
          ) : null}
        </tr>
      </thead>
      <tbody>
        {loading || !exercises ? (
          <SkeletonRows columns={columns} rows={4} label="Loading exercises" />
        ) : (
          exercises.map((e) => (
            <tr key={e.id} data-testid="exercise-row" data-exercise-id={e.id} className="hover:bg-paper">
              <Td className="min-w-[14rem]">
                <Link to={`/exercises/${e.id}`} className="font-medium text-reference underline-offset-2 hover:underline">
                  {e.title}
                </Link>
              </Td>
              <Td className="whitespace-nowrap">{familyLabel[e.family]}</Td>
              <Td>
                <StatusText tone={tone[e.state]}>{stateLabel[e.state]}</StatusText>
              </Td>
              <Td className="whitespace-nowrap">
                <time dateTime={e.dueAt} title={`${e.dueAt} (UTC)`}>
                  <Num>{formatDueLocal(e.dueLocal, e.timeZone, e.dueAt)}</Num>
                </time>
              </Td>
              {staff && e.counts ? (
                <>
                  <Td className="text-right"><Num>{e.revisionNo}</Num></Td>
                  <Td className="text-right">
                    <Num>{e.counts.withVariant}</Num> / <Num>{e.counts.students}</Num>
                    <span className="text-graphite"> ({e.counts.distinctVariants} distinct)</span>
                  </Td>
                  <Td className="text-right"><Num>{e.counts.reported}</Num></Td>
                  <Td className="text-right"><Num>{e.counts.checks}</Num></Td>
                </>
              ) : null}
            </tr>
          ))
        )}
      </tbody>
    </Table>
  );
}
