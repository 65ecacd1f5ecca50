/**
 * The job queue against MariaDB: SKIP LOCKED claims, leases, progress,
 * retries, take-over of a dead worker's job and clean stop.
 */
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { createTestDatabase, type TestDatabase } from '../support/database';
import { claimJob, createJobWorker, enqueue, enqueueOnce, getJob, type JobContext } from '@server/platform/jobs';

let db: TestDatabase;

beforeAll(async () => {
  db = await createTestDatabase();
});
afterAll(async () => {
  await db?.drop();
});
beforeEach(async () => {
  await db.knex('jobs').delete();
});

describe('job queue', () => {
  it('enqueues inside a transaction: a rolled-back change leaves no job', async () => {
    await expect(
      db.knex.transaction(async (trx) => {
        await enqueue(trx, 'noop', { n: 1 });
        throw new Error('rolled back');
      }),
    ).rejects.toThrow('rolled back');
    expect(await db.knex('jobs').count({ n: '*' }).first()).toMatchObject({ n: 0 });
    const id = await db.knex.transaction((trx) => enqueue(trx, 'noop', { n: 2 }, 7));
    const job = await getJob(db.knex, id);
    expect(job).toMatchObject({ kind: 'noop', state: 'queued', payload: { n: 2 }, progressTotal: 7, attempts: 0 });
  });

  it('two workers claiming at once never get the same job (SKIP LOCKED)', async () => {
    for (let i = 0; i < 6; i++) await enqueue(db.knex, 'noop', { i });
    const claims = await Promise.all(Array.from({ length: 8 }, (_, w) => claimJob(db.knex, ['noop'], `w${w}`, 30_000)));
    const ids = claims.filter((c) => c !== null).map((c) => c!.id);
    expect(ids).toHaveLength(6);
    expect(new Set(ids).size).toBe(6);
    const rows = await db.knex('jobs').select('state', 'claimed_by', 'attempts');
    expect(rows.every((r) => r.state === 'running' && r.claimed_by && r.attempts === 1)).toBe(true);
  });

  it('runs a job to done with progress, and ignores kinds it has no handler for', async () => {
    const seen: number[] = [];
    const id = await enqueue(db.knex, 'count', { upTo: 5 });
    const other = await enqueue(db.knex, 'someone-elses', {});
    const worker = createJobWorker({
      db: db.knex,
      handlers: {
        async count(ctx: JobContext) {
          const upTo = ctx.payload.upTo as number;
          for (let i = 1; i <= upTo; i++) {
            seen.push(i);
            await ctx.progress(i, upTo);
          }
        },
      },
    });
    expect(await worker.runOnce()).toBe('done');
    expect(await worker.runOnce()).toBe('idle');
    expect(seen).toEqual([1, 2, 3, 4, 5]);
    expect(await getJob(db.knex, id)).toMatchObject({ state: 'done', progressDone: 5, progressTotal: 5, leaseUntil: null });
    expect(await getJob(db.knex, other)).toMatchObject({ state: 'queued' });
  });

  it('retries a failing job later, then fails it for good with the error kept', async () => {
    const id = await enqueue(db.knex, 'broken', {});
    const worker = createJobWorker({
      db: db.knex,
      maxAttempts: 2,
      retryDelayMs: 0,
      handlers: {
        async broken() {
          throw new Error('reference could not be computed');
        },
      },
    });
    expect(await worker.runOnce()).toBe('retry');
    expect(await getJob(db.knex, id)).toMatchObject({ state: 'queued', attempts: 1, error: 'reference could not be computed' });
    expect(await worker.runOnce()).toBe('failed');
    expect(await getJob(db.knex, id)).toMatchObject({ state: 'failed', attempts: 2, error: 'reference could not be computed' });
    expect(await worker.runOnce()).toBe('idle');
  });

  it('takes over a running job whose lease has expired, and the old worker can no longer write to it', async () => {
    const id = await enqueue(db.knex, 'count', { upTo: 3 });
    // the first worker claims with a very short lease and then "dies"
    const dead = await claimJob(db.knex, ['count'], 'dead-worker', 1);
    expect(dead?.id).toBe(id);
    // a live lease is not taken over
    await db.knex('jobs').where({ id }).update({ lease_until: db.knex.raw('CURRENT_TIMESTAMP(3) + INTERVAL 1 HOUR') });
    expect(await claimJob(db.knex, ['count'], 'live-worker', 30_000)).toBeNull();
    await db.knex('jobs').where({ id }).update({ lease_until: db.knex.raw('CURRENT_TIMESTAMP(3) - INTERVAL 1 SECOND') });

    const worker = createJobWorker({
      db: db.knex,
      workerId: 'live-worker',
      handlers: {
        async count(ctx) {
          for (let i = 1; i <= 3; i++) await ctx.progress(i, 3);
        },
      },
    });
    expect(await worker.runOnce()).toBe('done');
    expect(await getJob(db.knex, id)).toMatchObject({ state: 'done', attempts: 2, claimedBy: 'live-worker', progressDone: 3 });
    // the dead worker's late writes are refused
    const n = await db.knex('jobs').where({ id, claimed_by: 'dead-worker', state: 'running' }).update({ progress_done: 0 });
    expect(n).toBe(0);
  });

  it('a handler that loses its lease mid-way stops without marking the job', async () => {
    const id = await enqueue(db.knex, 'slow', {});
    const worker = createJobWorker({
      db: db.knex,
      workerId: 'slow-one',
      handlers: {
        async slow(ctx) {
          await ctx.progress(1, 2);
          // another worker takes the job over while this one is paused
          await db.knex('jobs').where({ id }).update({ claimed_by: 'other-worker' });
          await ctx.progress(2, 2);
        },
      },
    });
    expect(await worker.runOnce()).toBe('lost');
    expect(await getJob(db.knex, id)).toMatchObject({ state: 'running', claimedBy: 'other-worker', progressDone: 1 });
  });

  it('gives up on a job whose workers keep dying', async () => {
    const id = await enqueue(db.knex, 'count', {});
    for (let i = 0; i < 2; i++) {
      await claimJob(db.knex, ['count'], `dying-${i}`, 1);
      await db.knex('jobs').where({ id }).update({ lease_until: db.knex.raw('CURRENT_TIMESTAMP(3) - INTERVAL 1 SECOND') });
    }
    const worker = createJobWorker({ db: db.knex, maxAttempts: 2, handlers: { count: async () => {} } });
    expect(await worker.runOnce()).toBe('failed');
    expect((await getJob(db.knex, id))?.error).toMatch(/gave up after 2 attempts/);
  });

  it('enqueueOnce adds no second waiting job for the same key', async () => {
    const a = await enqueueOnce(db.knex, 'similarity-exercise', 'exerciseId', { exerciseId: 4 });
    const b = await enqueueOnce(db.knex, 'similarity-exercise', 'exerciseId', { exerciseId: 4 });
    const c = await enqueueOnce(db.knex, 'similarity-exercise', 'exerciseId', { exerciseId: 5 });
    expect(b).toBe(a);
    expect(c).not.toBe(a);
    await claimJob(db.knex, ['similarity-exercise'], 'w', 30_000); // a is running now
    const d = await enqueueOnce(db.knex, 'similarity-exercise', 'exerciseId', { exerciseId: 4 });
    expect(d).not.toBe(a);
  });

  it('the polling loop picks up new jobs and stops cleanly', async () => {
    const done: number[] = [];
    const worker = createJobWorker({ db: db.knex, pollIntervalMs: 20, handlers: { note: async (ctx) => void done.push(ctx.payload.n as number) } });
    worker.start();
    await enqueue(db.knex, 'note', { n: 1 });
    await enqueue(db.knex, 'note', { n: 2 });
    await expect.poll(() => done.length, { timeout: 5000 }).toBe(2);
    await worker.stop();
    await enqueue(db.knex, 'note', { n: 3 });
    await new Promise((r) => setTimeout(r, 100));
    expect(done).toEqual([1, 2]);
  });
});
