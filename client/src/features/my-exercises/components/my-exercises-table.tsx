import { Link } from 'react-router';
import type { MyExercise } from '@shared/api/templates';
import { Button, buttonClasses } from '@client/components/ui/button';
import { Num } from '@client/components/ui/num';
import { StatusText } from '@client/components/ui/status-text';
import { SkeletonRows, Table, Td, Th } from '@client/components/ui/table';
import { useDownloadTemplate } from '../api/download-template';
import { extensionText, formatInZone, relativeToNow } from '../lib/due-text';

function WindowStatus({ exercise }: { exercise: MyExercise }) {
  if (exercise.window === 'open') return <StatusText tone="good">Open</StatusText>;
  if (exercise.window === 'late')
    return (
      <div>
        <StatusText tone="caution">Late</StatusText>
        <div className="text-[0.8rem] text-caution">
          <Num>−{exercise.penaltyNowPercent}%</Num> if uploaded now
        </div>
      </div>
    );
  return <StatusText tone="neutral">Closed</StatusText>;
}

function DownloadButton({ exercise }: { exercise: MyExercise }) {
  const download = useDownloadTemplate();
  return (
    <div>
      <Button
        size="sm"
        variant="secondary"
        aria-label={`Download template: ${exercise.title}`}
        disabled={download.isPending}
        onClick={() => download.mutate({ url: exercise.templateUrl, fallbackName: `template-${exercise.exerciseId}.xlsx` })}
        data-testid="download-template"
      >
        {download.isPending ? 'Preparing…' : 'Download template'}
      </Button>
      {download.isError ? (
        <p role="alert" className="mt-1 max-w-[28ch] text-[0.8rem] text-antibonding">
          {download.error.message}
        </p>
      ) : null}
    </div>
  );
}

/** One row per published exercise: due moment in the exercise's time zone, late status, template and upload. */
export function MyExercisesTable({ exercises, loading, nowMs }: { exercises: MyExercise[] | undefined; loading: boolean; nowMs: number }) {
  return (
    <Table label="My exercises" busy={loading} testId="my-exercises-table">
      <thead>
        <tr>
          <Th>Exercise</Th>
          <Th>Your variant</Th>
          <Th>Due</Th>
          <Th>State</Th>
          <Th>Template</Th>
          <Th>Report</Th>
        </tr>
      </thead>
      <tbody>
        {loading || !exercises ? (
          <SkeletonRows columns={6} rows={4} label="Loading your exercises" />
        ) : (
          exercises.map((exercise) => (
            <tr key={exercise.exerciseId} data-testid="my-exercise-row" data-exercise-id={exercise.exerciseId} className="hover:bg-paper">
              <Td className="min-w-[14rem]">
                <div className="font-medium">{exercise.title}</div>
                <div className="text-[0.8rem] text-graphite">
                  <Num>{exercise.course.code}</Num> · {exercise.course.title}
                </div>
              </Td>
              <Td>
                <Num>
                  {exercise.variant.parameters.length > 1
                    ? exercise.variant.parameters.map((p, i) => (
                        <span key={p.name} className="whitespace-nowrap">
                          {p.name} = {p.value}
                          {i < exercise.variant.parameters.length - 1 ? ', ' : ''}
                        </span>
                      ))
                    : exercise.variant.text}
                </Num>
              </Td>
              <Td className="whitespace-nowrap">
                <time dateTime={exercise.effectiveDueAt} title={`${exercise.effectiveDueAt} (${exercise.timeZone})`} className="num">
                  {formatInZone(exercise.effectiveDueAt, exercise.timeZone)}
                </time>
                <div className="text-[0.8rem] text-graphite">
                  {relativeToNow(exercise.effectiveDueAt, nowMs)}
                  {exercise.extensionMinutes > 0 ? (
                    <>
                      {' '}
                      · extension <Num>+{extensionText(exercise.extensionMinutes)}</Num>
                    </>
                  ) : null}
                </div>
                <div className="mt-1 max-w-[26ch] whitespace-normal text-[0.8rem] text-graphite">Late: {exercise.late.summary}</div>
              </Td>
              <Td>
                <WindowStatus exercise={exercise} />
              </Td>
              <Td>
                <DownloadButton exercise={exercise} />
              </Td>
              <Td>
                {exercise.window === 'closed' ? (
                  <Link to={`/my/exercises/${exercise.exerciseId}/upload`} className="text-reference underline" aria-label={`Your reports: ${exercise.title}`}>
                    Your reports
                  </Link>
                ) : (
                  <Link
                    to={`/my/exercises/${exercise.exerciseId}/upload`}
                    className={buttonClasses('primary', 'sm')}
                    aria-label={`Upload report: ${exercise.title}`}
                  >
                    Upload report
                  </Link>
                )}
              </Td>
            </tr>
          ))
        )}
      </tbody>
    </Table>
  );
}
