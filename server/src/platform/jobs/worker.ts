/**
 * A job worker: claims one job at a time with SELECT … FOR UPDATE SKIP LOCKED
 * (queued jobs whose run_after has come, and running jobs whose lease has
 * expired — a dead worker's), holds it with a lease it renews as it reports
 * progress, and marks it done or failed. Handlers are written to be resumable:
 * a job taken over from a dead worker starts its handler again, and the
 * handler skips what is already done (see the re-marking job in
 * modules/reports/jobs.ts).
 *
 * Nothing here keeps state another server would need: the lease, the progress
 * and the attempts are in the jobs row.
 */
import type { Knex } from 'knex';
import { hostname } from 'node:os';
import { randomBytes } from 'node:crypto';
import { jobFromRow, type JobRecord, type JobRow } from './queue';

export class LeaseLostError extends Error {
  constructor(jobId: number) {
    super(`job ${jobId} was taken over by another worker (lease expired)`);
  }
}

export interface JobContext {
  job: JobRecord;
  payload: Record<string, unknown>;
  db: Knex;
  workerId: string;
  /**
   * Records progress and renews the lease. Throws LeaseLostError when the job
   * is no longer this worker's (its lease ran out and another worker claimed it).
   */
  progress(done: number, total?: number): Promise<void>;
  /** true once stop() was called: a handler may return early; the job is then re-queued */
  stopping(): boolean;
}

export type JobHandler = (ctx: JobContext) => Promise<void>;

export interface WorkerOptions {
  db: Knex;
  handlers: Record<string, JobHandler>;
  workerId?: string;
  /** how long to sleep when there is nothing to do */
  pollIntervalMs?: number;
  /** how long a claim holds without a progress report */
  leaseMs?: number;
  /** after this many attempts a failing job stays failed */
  maxAttempts?: number;
  /** delay before a failed attempt is retried (multiplied by the attempt number) */
  retryDelayMs?: number;
  log?: { info(obj: object, msg?: string): void; error(obj: object, msg?: string): void };
}

export type RunOutcome = 'idle' | 'done' | 'retry' | 'failed' | 'lost' | 'stopped';

export interface JobWorker {
  readonly workerId: string;
  /** starts the polling loop */
  start(): void;
  /** stops after the current job (the current handler sees stopping() = true) */
  stop(): Promise<void>;
  /** claims and runs at most one job */
  runOnce(): Promise<RunOutcome>;
  /** claims one job without running it (tests use this to stand for a worker that dies) */
  claim(): Promise<JobRecord | null>;
  /** runs jobs until none is ready */
  drain(): Promise<void>;
}

/** Claims the oldest ready job of the given kinds in one short transaction; null when there is none. */
export async function claimJob(db: Knex, kinds: string[], workerId: string, leaseMs: number): Promise<JobRecord | null> {
  if (kinds.length === 0) return null;
  return db.transaction(async (trx) => {
    const [rows] = (await trx.raw(
      `SELECT id FROM jobs
        WHERE kind IN (${kinds.map(() => '?').join(',')})
          AND ((state = 'queued' AND run_after <= CURRENT_TIMESTAMP(3))
            OR (state = 'running' AND lease_until < CURRENT_TIMESTAMP(3)))
        ORDER BY id
        LIMIT 1
        FOR UPDATE SKIP LOCKED`,
      kinds,
    )) as [{ id: number }[]];
    if (rows.length === 0) return null;
    const id = rows[0].id;
    await trx.raw(
      `UPDATE jobs SET state = 'running', claimed_by = ?, attempts = attempts + 1,
              lease_until = CURRENT_TIMESTAMP(3) + INTERVAL ? MICROSECOND, updated_at = CURRENT_TIMESTAMP(3)
        WHERE id = ?`,
      [workerId, Math.round(leaseMs * 1000), id],
    );
    return jobFromRow((await trx('jobs').where({ id }).first()) as JobRow);
  });
}

export function createJobWorker(options: WorkerOptions): JobWorker {
  const db = options.db;
  const workerId = options.workerId ?? `${hostname()}:${process.pid}:${randomBytes(3).toString('hex')}`;
  const pollIntervalMs = options.pollIntervalMs ?? 1000;
  const leaseMs = options.leaseMs ?? 30_000;
  const maxAttempts = options.maxAttempts ?? 3;
  const retryDelayMs = options.retryDelayMs ?? 5_000;
  const kinds = Object.keys(options.handlers);
  let stopping = false;
  let loop: Promise<void> | null = null;
  let wake: (() => void) | null = null;

  /** Writes an outcome only while the job is still ours; false when another worker holds it. */
  async function finish(job: JobRecord, change: Record<string, unknown>, leaseSql?: string): Promise<boolean> {
    const n = await db('jobs')
      .where({ id: job.id, claimed_by: workerId, state: 'running' })
      .update({ ...change, lease_until: leaseSql ? db.raw(leaseSql) : null, updated_at: db.raw('CURRENT_TIMESTAMP(3)') });
    return n === 1;
  }

  async function run(job: JobRecord): Promise<RunOutcome> {
    const handler = options.handlers[job.kind];
    if (job.attempts > maxAttempts) {
      await finish(job, { state: 'failed', error: `gave up after ${maxAttempts} attempts (the last worker stopped without finishing)` });
      return 'failed';
    }
    const ctx: JobContext = {
      job,
      payload: job.payload,
      db,
      workerId,
      stopping: () => stopping,
      async progress(done, total) {
        const change: Record<string, unknown> = {
          progress_done: done,
          lease_until: db.raw('CURRENT_TIMESTAMP(3) + INTERVAL ? MICROSECOND', [Math.round(leaseMs * 1000)]),
          updated_at: db.raw('CURRENT_TIMESTAMP(3)'),
        };
        if (total !== undefined) change.progress_total = total;
        const n = await db('jobs').where({ id: job.id, claimed_by: workerId, state: 'running' }).update(change);
        if (n !== 1) throw new LeaseLostError(job.id);
      },
    };
    try {
      await handler(ctx);
      if (stopping) {
        // The handler returned early because we are stopping: hand the job back untouched.
        await finish(job, { state: 'queued', claimed_by: null, attempts: db.raw('GREATEST(attempts - 1, 0)') });
        return 'stopped';
      }
      const ok = await finish(job, { state: 'done', error: null });
      return ok ? 'done' : 'lost';
    } catch (err) {
      if (err instanceof LeaseLostError) {
        options.log?.info({ jobId: job.id }, err.message);
        return 'lost';
      }
      const message = String((err as Error)?.message ?? err).slice(0, 1900);
      options.log?.error({ jobId: job.id, kind: job.kind, err }, 'job attempt failed');
      if (job.attempts < maxAttempts) {
        await db('jobs')
          .where({ id: job.id, claimed_by: workerId })
          .update({
            state: 'queued',
            claimed_by: null,
            lease_until: null,
            error: message,
            run_after: db.raw('CURRENT_TIMESTAMP(3) + INTERVAL ? MICROSECOND', [retryDelayMs * job.attempts * 1000]),
            updated_at: db.raw('CURRENT_TIMESTAMP(3)'),
          });
        return 'retry';
      }
      await finish(job, { state: 'failed', error: message });
      return 'failed';
    }
  }

  async function runOnce(): Promise<RunOutcome> {
    const job = await claimJob(db, kinds, workerId, leaseMs);
    if (!job) return 'idle';
    return run(job);
  }

  async function drain() {
    while (!stopping && (await runOnce()) !== 'idle') {
      /* next */
    }
  }

  async function poll() {
    while (!stopping) {
      let outcome: RunOutcome = 'idle';
      try {
        outcome = await runOnce();
      } catch (err) {
        options.log?.error({ err }, 'job worker could not claim a job');
      }
      if (outcome === 'idle' && !stopping) {
        await new Promise<void>((resolve) => {
          const timer = setTimeout(resolve, pollIntervalMs);
          wake = () => {
            clearTimeout(timer);
            resolve();
          };
        });
        wake = null;
      }
    }
  }

  return {
    workerId,
    start() {
      if (loop) return;
      stopping = false;
      loop = poll();
    },
    async stop() {
      stopping = true;
      wake?.();
      await loop;
      loop = null;
    },
    runOnce,
    claim: () => claimJob(db, kinds, workerId, leaseMs),
    drain,
  };
}
