export { enqueue, enqueueOnce, getJob, jobFromRow, type JobRecord, type JobState } from './queue';
export { claimJob, createJobWorker, LeaseLostError, type JobContext, type JobHandler, type JobWorker, type RunOutcome, type WorkerOptions } from './worker';
export { jobRoutes } from './routes';
