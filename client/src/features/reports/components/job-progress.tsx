import { Num } from '@client/components/ui/num';
import { StatusText } from '@client/components/ui/status-text';
import { useJob } from '../api/get-job';
import { ProgressBar } from './progress-bar';

const kindLabel: Record<string, string> = {
  'remark-exercise': 'Re-marking the reports',
  'similarity-exercise': 'Looking for similar reports',
};

/**
 * Progress of a background job (GET /api/v1/jobs/:id, polled each second
 * until it is done). Used after an exercise is re-published with re-marking.
 */
export function JobProgress({ jobId, label }: { jobId: number; label?: string }) {
  const job = useJob(jobId);
  const title = label ?? kindLabel[job.data?.kind ?? ''] ?? 'Background work';
  if (job.isError) return <p className="text-antibonding">Could not read the progress of job {jobId}: {job.error.message}</p>;
  const data = job.data;
  if (!data) return <ProgressBar label={title} fraction={null} testId="job-progress" />;
  if (data.state === 'failed') {
    return (
      <div data-testid="job-progress" data-state="failed" className="flex flex-col gap-1">
        <ProgressBar label={`${title}: stopped`} fraction={data.total > 0 ? data.done / data.total : 0} tone="antibonding" detail={`${data.done} of ${data.total}`} />
        <p role="status">
          <StatusText tone="bad">{title} stopped</StatusText> <span className="text-[0.85rem] text-graphite">{data.error}</span>
        </p>
      </div>
    );
  }
  const fraction = data.total > 0 ? data.done / data.total : data.state === 'done' ? 1 : null;
  return (
    <div data-testid="job-progress" data-state={data.state}>
      <ProgressBar
        label={data.state === 'done' ? `${title}: done` : data.state === 'queued' ? `${title}: waiting to start` : title}
        fraction={fraction}
        tone={data.state === 'done' ? 'bonding' : 'reference'}
        detail={`${data.done} of ${data.total}`}
      />
      {data.state === 'done' ? (
        <p className="mt-1 text-[0.85rem] text-graphite" role="status">
          <Num>{data.total}</Num> {data.total === 1 ? 'report' : 'reports'} processed.
        </p>
      ) : null}
    </div>
  );
}
