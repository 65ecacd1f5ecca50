/**
 * The job queue: rows in `jobs`, enqueued inside the caller's transaction so
 * that a job exists exactly when the change that asked for it was committed.
 * Workers (worker.ts) claim them with SELECT … FOR UPDATE SKIP LOCKED, so any
 * number of app servers can run workers against one MariaDB.
 */
import type { Knex } from 'knex';

export type JobState = 'queued' | 'running' | 'done' | 'failed';

export interface JobRecord {
  id: number;
  kind: string;
  payload: Record<string, unknown>;
  state: JobState;
  progressDone: number;
  progressTotal: number;
  attempts: number;
  claimedBy: string | null;
  leaseUntil: Date | null;
  error: string | null;
  runAfter: Date;
  createdAt: Date;
  updatedAt: Date;
}

export interface JobRow {
  id: number | string;
  kind: string;
  payload_json: string | Record<string, unknown>;
  state: JobState;
  progress_done: number;
  progress_total: number;
  attempts: number;
  claimed_by: string | null;
  lease_until: Date | null;
  error: string | null;
  run_after: Date;
  created_at: Date;
  updated_at: Date;
}

export function jobFromRow(row: JobRow): JobRecord {
  return {
    id: Number(row.id),
    kind: row.kind,
    payload: typeof row.payload_json === 'string' ? JSON.parse(row.payload_json) : row.payload_json,
    state: row.state,
    progressDone: row.progress_done,
    progressTotal: row.progress_total,
    attempts: row.attempts,
    claimedBy: row.claimed_by,
    leaseUntil: row.lease_until,
    error: row.error,
    runAfter: row.run_after,
    createdAt: row.created_at,
    updatedAt: row.updated_at,
  };
}

/**
 * Adds a job in the caller's transaction and returns its id. `total` is the
 * number of items the job expects to process (the progress bar's length); the
 * worker may correct it when it starts.
 */
export async function enqueue(trx: Knex | Knex.Transaction, kind: string, payload: Record<string, unknown>, total = 0): Promise<number> {
  const [id] = await trx('jobs').insert({ kind, payload_json: JSON.stringify(payload), progress_total: total });
  return Number(id);
}

/**
 * Enqueues unless a job of the same kind with the same `key` value in its
 * payload is still waiting (queued, not yet claimed) — for work where one run
 * covers every request made before it starts (e.g. similarity over an exercise).
 * Returns the id of the new or the waiting job.
 */
export async function enqueueOnce(trx: Knex | Knex.Transaction, kind: string, key: string, payload: Record<string, unknown>, total = 0): Promise<number> {
  const waiting = await trx('jobs')
    .where({ kind, state: 'queued' })
    .whereRaw('JSON_VALUE(payload_json, ?) = ?', [`$.${key}`, String(payload[key])])
    .first('id');
  if (waiting) return Number(waiting.id);
  return enqueue(trx, kind, payload, total);
}

export async function getJob(db: Knex | Knex.Transaction, id: number): Promise<JobRecord | null> {
  const row = (await db('jobs').where({ id }).first()) as JobRow | undefined;
  return row ? jobFromRow(row) : null;
}
