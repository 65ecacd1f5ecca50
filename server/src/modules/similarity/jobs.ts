/**
 * The 'similarity-exercise' job: queued by every upload (one waiting job per
 * exercise — enqueueOnce), it runs the similarity over the exercise's newest
 * reports and stores new flags. Rerunning it is harmless: flags are unique per
 * pair and kind.
 */
import type { JobContext } from '../../platform/jobs';
import { SIMILARITY_JOB } from '../reports/service';
import { runSimilarity } from './service';

export { SIMILARITY_JOB };

export async function similarityJob(ctx: JobContext): Promise<void> {
  const exerciseId = Number(ctx.payload.exerciseId);
  const run = await runSimilarity(ctx.db, exerciseId, (done, total) => ctx.progress(done, total));
  await ctx.progress(run.compared, run.compared);
}
