/**
 * `npm run bench -- marking [--reports 500] [--uploads 120] [--rounds 7]`: speed of report marking
 * (issue 5, "Speed"), from one run against a private MariaDB this benchmark starts
 * itself (scripts/lib/mariadb.ts, in a temporary directory on a free loopback port).
 *
 * Builds 500 reports of 500 students — half 200-point CSV files, half personal
 * templates made by the template generator and filled in — each the student's own
 * reference curves with a little noise. Then, through the service layer
 * (server/src/modules/reports):
 *   - bare parse: readReport over the same files (the baseline);
 *   - marking without the database write: readUpload (the reader with the confirmed
 *     choice) + markWithReference, per report; ratio to the bare parse (target ≤ 1.5);
 *   - marking with the write: the whole upload path (read, template check, variant,
 *     mark, files + report + mark + audit + job in one transaction) — reports/s
 *     (target ≥ 50);
 *   - a single upload over loopback HTTP (sign-in through the stand-in identity
 *     provider, multipart POST with the CSRF token): p95 latency (target ≤ 300 ms).
 * References are cached per (revision, variant) by the service; their one-off cost is
 * printed separately.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import http from 'node:http';
import net from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import pino from 'pino';
import type { Knex } from 'knex';
import { readReport } from '@shared/marking/read';
import { ENGINE_VERSION } from '@shared/exercises/reference';
import type { ReportChoice } from '@shared/api/reports';
import { createDb, migrateLatest } from '../server/src/platform/db';
import { buildConfig, readEnv } from '../server/src/platform/config';
import { discoverOidc } from '../server/src/platform/auth/discovery';
import { createApp } from '../server/src/app';
import { startIdentityProvider } from '../server/src/dev/identity-provider';
import { studentTemplate } from '../server/src/modules/templates/service';
import { checkTemplate, readUpload, resolveTarget, storeUpload } from '../server/src/modules/reports/service';
import { markWithReference, referenceFor } from '../server/src/modules/reports/marking';
import type { ReceivedFile } from '../server/src/modules/reports/uploads';
import { ensureVariant } from '../server/src/modules/exercises/variants';
import { startPrivateMariadb } from '../scripts/lib/mariadb';
import { CookieClient } from '../tests/support/cookie-client';
import { curveReferenceOf, curveSpec, fillTemplate, referenceCsv, uploadForm, variantOf } from '../tests/integration/reports-fixtures';
import { createHash } from 'node:crypto';
import type { BenchOutcome } from './run';
import { formatTable, machineLine, median } from './lib/measure';

const flag = (args: string[], name: string, fallback: number) => {
  const i = args.indexOf(`--${name}`);
  return i >= 0 && args[i + 1] ? Number(args[i + 1]) : fallback;
};

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const port = (s.address() as net.AddressInfo).port;
      s.close(() => resolve(port));
    });
  });
}

/** 200 points: 0.50, 0.55, … 10.45 bohr; four variants (ζ = 1.0 … 1.3) of the LCAO one-electron bond */
const spec = curveSpec({
  title: 'Benchmark: the one-electron bond on 200 points',
  model: {
    family: 'one-electron',
    method: 'lcao',
    za: { kind: 'fixed', value: 1 },
    zb: { kind: 'fixed', value: 1 },
    zeta: { kind: 'list', values: [1, 1.1, 1.2, 1.3] },
    states: ['bonding', 'antibonding'],
    grid: { unit: 'bohr', start: 0.5, end: 10.45, step: 0.05 },
  },
});

interface BenchReport {
  enrolmentId: number;
  studentNumber: string;
  kind: 'csv' | 'template';
  file: ReceivedFile;
  choice: ReportChoice;
}

function received(name: string, bytes: Buffer): ReceivedFile {
  return { fileName: name, bytes, sizeBytes: bytes.length, sha256: createHash('sha256').update(bytes).digest('hex') };
}

const percentile = (values: number[], p: number) => {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
};
const ms = (x: number) => `${x.toFixed(x < 10 ? 2 : 1)} ms`;

async function seed(k: Knex, issuer: string, students: number) {
  const [lecturer] = await k('users').insert({ oidc_issuer: issuer, oidc_subject: 'bench-lecturer', email: 'bench-lecturer@bench.example', display_name: 'Bench Lecturer' });
  const [term] = await k('terms').insert({ name: 'Bench term', starts_on: '2026-09-01', ends_on: '2026-12-20' });
  const [courseId] = await k('courses').insert({ term_id: term, code: 'BENCH 1', title: 'Benchmark course' });
  await k('course_staff').insert({ course_id: courseId, user_id: lecturer, role: 'lecturer' });
  const [section] = await k('sections').insert({ course_id: courseId, name: 'Bench section' });
  const users = Array.from({ length: students }, (_, i) => ({ oidc_issuer: issuer, oidc_subject: `bench-s${i}`, email: `s${i}@bench.example`, display_name: `Student ${i}` }));
  for (let i = 0; i < users.length; i += 200) await k('users').insert(users.slice(i, i + 200));
  const userRows = await k('users').where('oidc_subject', 'like', 'bench-s%').orderBy('id').select('id', 'oidc_subject');
  const enrolments = userRows.map((u, i) => ({ course_id: courseId, user_id: u.id, student_number: `25${String(i).padStart(5, '0')}`, section_id: section }));
  for (let i = 0; i < enrolments.length; i += 200) await k('enrolments').insert(enrolments.slice(i, i + 200));
  const enrolled = await k('enrolments').where({ course_id: courseId }).orderBy('id').select('id', 'student_number');
  const [exerciseId] = await k('exercises').insert({ course_id: courseId, state: 'published', created_by: lecturer });
  const [revisionId] = await k('exercise_revisions').insert({ exercise_id: exerciseId, revision_no: 1, spec_json: JSON.stringify(spec), engine_version: ENGINE_VERSION, created_by: lecturer, published_at: new Date() });
  await k('exercises').where({ id: exerciseId }).update({ current_revision_id: revisionId });
  return { lecturer: { id: Number(lecturer), isAdmin: false }, courseId, exerciseId: Number(exerciseId), revisionId: Number(revisionId), enrolled: enrolled as { id: number; student_number: string }[] };
}

async function buildReports(k: Knex, setup: Awaited<ReturnType<typeof seed>>, count: number): Promise<BenchReport[]> {
  const reports: BenchReport[] = [];
  const csvChoice: ReportChoice = { distanceColumn: 'A', energyColumns: ['B', 'C'], distanceUnit: 'angstrom', energyUnit: 'ev' };
  for (let i = 0; i < count; i++) {
    const e = setup.enrolled[i];
    const reference = curveReferenceOf(spec, variantOf(spec, e.student_number));
    if (i % 2 === 0) {
      const csv = referenceCsv(reference, { distanceUnit: 'angstrom', energyUnit: 'ev', noiseHartree: 3e-5, seed: i + 1, decimals: 6 });
      reports.push({ enrolmentId: e.id, studentNumber: e.student_number, kind: 'csv', file: received(`s${i}.csv`, Buffer.from(csv)), choice: csvChoice });
    } else {
      const template = await studentTemplate(k, setup.lecturer, setup.exerciseId, e.id);
      const filled = await fillTemplate(template.buffer, reference, { noiseHartree: 3e-5, seed: i + 1 });
      const read = await readReport(filled, { fileName: template.fileName });
      if (!read.ok) throw new Error(`a filled template could not be read: ${read.error.message}`);
      reports.push({
        enrolmentId: e.id,
        studentNumber: e.student_number,
        kind: 'template',
        file: received(template.fileName, filled),
        choice: { sheet: read.choice.sheet, distanceColumn: read.choice.distanceColumn, energyColumns: [...read.choice.energyColumns], distanceUnit: read.units.distance, energyUnit: read.units.energy },
      });
    }
  }
  return reports;
}

export default async function markingBench(args: string[]): Promise<BenchOutcome> {
  const count = flag(args, 'reports', 500);
  const uploads = flag(args, 'uploads', 120);
  const rounds = flag(args, 'rounds', 7);
  console.log('Bondmark marking benchmark (issue 5, "Speed")');
  console.log(machineLine());

  const dir = mkdtempSync(path.join(tmpdir(), 'bondmark-bench-db-'));
  const mariadb = await startPrivateMariadb({ dataDir: dir, port: await freePort(), database: 'bondmark_bench', log: () => {} });
  const knex = createDb(mariadb.url);
  const cleanups: (() => Promise<void> | void)[] = [() => rmSync(dir, { recursive: true, force: true }), () => mariadb.stop(), () => knex.destroy()];
  try {
    await migrateLatest(knex);
    const server = http.createServer();
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', () => resolve()));
    const baseUrl = `http://127.0.0.1:${(server.address() as net.AddressInfo).port}`;
    const idp = await startIdentityProvider({
      port: 0,
      accounts: [{ login: 'bench-lecturer', email: 'bench-lecturer@bench.example', givenName: 'Bench', familyName: 'Lecturer' }],
      clients: [{ clientId: 'bondmark-bench', clientSecret: 'bench-secret-not-for-production', redirectUris: [`${baseUrl}/auth/callback`], postLogoutRedirectUris: [`${baseUrl}/signin`] }],
    });
    cleanups.push(() => idp.close());
    const setup = await seed(knex, idp.issuer, count);

    process.stdout.write(`building ${count} reports (${Math.ceil(count / 2)} CSV, ${Math.floor(count / 2)} filled templates, 200 points each)… `);
    let t0 = performance.now();
    const reports = await buildReports(knex, setup, count);
    console.log(`${((performance.now() - t0) / 1000).toFixed(1)} s`);

    // variants of every student (the templates drew half of them; the upload path would draw the rest)
    const variants = new Map<number, Awaited<ReturnType<typeof ensureVariant>>>();
    for (const r of reports) variants.set(r.enrolmentId, await knex.transaction((trx) => ensureVariant(trx, { id: setup.exerciseId, course_id: setup.courseId }, setup.revisionId, r.enrolmentId)));

    // the one-off cost of the references (4 variants), then they are cached
    t0 = performance.now();
    const distinct = new Set<string>();
    for (const v of variants.values()) {
      if (distinct.has(v.variantKey)) continue;
      distinct.add(v.variantKey);
      referenceFor(setup.revisionId, spec, v.variant);
    }
    const referenceMs = (performance.now() - t0) / distinct.size;

    const bareParse = async () => {
      for (const r of reports) {
        const result = await readReport(r.file.bytes, { fileName: r.file.fileName });
        if (!result.ok) throw new Error(result.error.message);
      }
    };
    const markWithoutWrite = async () => {
      for (const r of reports) {
        const read = await readUpload(spec, r.file, null, r.choice);
        const mark = markWithReference({
          revisionId: setup.revisionId,
          spec,
          variant: variants.get(r.enrolmentId)!.variant,
          reading: read.reading,
          answers: read.answers,
          submittedAt: new Date(),
          extensionMinutes: 0,
        });
        if (!(mark.max > 0)) throw new Error('no mark');
      }
    };
    // warm-up (JIT, lazily loaded XLSX reader)
    await bareParse();
    await markWithoutWrite();
    const parseTimes: number[] = [];
    const markTimes: number[] = [];
    for (let round = 0; round < rounds; round++) {
      t0 = performance.now();
      await bareParse();
      parseTimes.push(performance.now() - t0);
      t0 = performance.now();
      await markWithoutWrite();
      markTimes.push(performance.now() - t0);
    }
    const ratios = markTimes.map((m, i) => m / parseTimes[i]);
    const ratio = median(ratios);
    const parseMs = median(parseTimes);
    const markMs = median(markTimes);

    // split by kind, one pass each, for the table
    const byKind = async (kind: 'csv' | 'template') => {
      const subset = reports.filter((r) => r.kind === kind);
      let p = 0;
      let m = 0;
      for (let round = 0; round < 3; round++) {
        t0 = performance.now();
        for (const r of subset) await readReport(r.file.bytes, { fileName: r.file.fileName });
        p += performance.now() - t0;
        t0 = performance.now();
        for (const r of subset) {
          const read = await readUpload(spec, r.file, null, r.choice);
          markWithReference({ revisionId: setup.revisionId, spec, variant: variants.get(r.enrolmentId)!.variant, reading: read.reading, answers: read.answers, submittedAt: new Date(), extensionMinutes: 0 });
        }
        m += performance.now() - t0;
      }
      return { parsePer: p / 3 / subset.length, markPer: m / 3 / subset.length };
    };
    const csvSplit = await byKind('csv');
    const templateSplit = await byKind('template');

    // with the database write: the whole service path, one transaction per report
    t0 = performance.now();
    for (const r of reports) {
      const forStudent = await resolveTarget(knex, setup.lecturer, setup.exerciseId, r.enrolmentId, true);
      const read = await readUpload(spec, r.file, null, r.choice);
      const warnings = await checkTemplate(knex, read.template, setup.exerciseId, forStudent.enrolment, forStudent.onBehalf);
      await storeUpload(knex, setup.lecturer, forStudent, read, warnings);
    }
    const writeMs = performance.now() - t0;
    const stored = Number((await knex('marks').count({ n: '*' }).first())?.n ?? 0);
    if (stored !== reports.length) throw new Error(`expected ${reports.length} marks, found ${stored}`);

    // a single upload over loopback HTTP
    const env = readEnv({
      NODE_ENV: 'test',
      PUBLIC_URL: baseUrl,
      SESSION_SECRET: 'bench-session-secret-0123456789abcdef0123456789',
      OIDC_ISSUER: idp.issuer,
      OIDC_CLIENT_ID: 'bondmark-bench',
      OIDC_CLIENT_SECRET: 'bench-secret-not-for-production',
      SIGNIN_RATE_LIMIT_PER_MINUTE: '1000',
      LOG_LEVEL: 'silent',
    });
    const built = await createApp({ db: knex, databaseUrl: mariadb.url, config: buildConfig(env), oidc: await discoverOidc(idp.issuer), logger: pino({ level: 'silent' }), client: 'none' });
    server.on('request', built.app);
    cleanups.push(async () => {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await built.close();
    });
    const client = new CookieClient();
    const page = (await client.follow(`${baseUrl}/auth/login?returnTo=/`)).at(-1)!;
    const action = /action="(\/interaction\/[^"]+\/login)"/.exec(page.body)?.[1];
    if (!action) throw new Error('no sign-in form at the stand-in identity provider');
    await client.follow(new URL(action, idp.issuer).toString(), { method: 'POST', headers: { 'content-type': 'application/x-www-form-urlencoded' }, body: 'login=bench-lecturer' });
    const token = (await client.json<{ token: string }>(`${baseUrl}/api/v1/csrf-token`)).body.token;
    const latencies: Record<'csv' | 'template', number[]> = { csv: [], template: [] };
    for (let i = 0; i < uploads + 10; i++) {
      const r = reports[i % reports.length];
      const form = uploadForm({ name: r.file.fileName, bytes: r.file.bytes }, { choice: r.choice });
      t0 = performance.now();
      const res = await client.json<{ report: { id: number } }>(`${baseUrl}/api/v1/exercises/${setup.exerciseId}/reports?enrolmentId=${r.enrolmentId}`, { method: 'POST', headers: { 'x-csrf-token': token }, body: form });
      const elapsed = performance.now() - t0;
      if (res.status !== 201) throw new Error(`upload answered ${res.status}: ${JSON.stringify(res.body)}`);
      if (i >= 10) latencies[r.kind].push(elapsed); // the first ten warm the server up
    }
    const all = [...latencies.csv, ...latencies.template];
    const p95 = percentile(all, 95);

    const withoutWritePerSecond = (reports.length / markMs) * 1000;
    const withWritePerSecond = (reports.length / writeMs) * 1000;
    const targets = {
      ratio: ratio <= 1.5,
      write: withWritePerSecond >= 50,
      p95: p95 <= 300,
    };
    console.log('');
    console.log(
      formatTable(
        ['measure', 'value', 'target', 'result'],
        [
          ['bare parse (readReport), 500 files', `${ms(parseMs)} (${ms(parseMs / reports.length)} a file)`, '', ''],
          ['marking without the write (read with choice + mark)', `${ms(markMs)} (${ms(markMs / reports.length)} a report)`, '', ''],
          ['  ratio marking / bare parse (median of rounds)', `${ratio.toFixed(2)} (rounds: ${ratios.map((x) => x.toFixed(2)).join(', ')})`, '≤ 1.5', targets.ratio ? 'PASS' : 'MISS'],
          ['  CSV: parse / mark a report', `${ms(csvSplit.parsePer)} / ${ms(csvSplit.markPer)} (× ${(csvSplit.markPer / csvSplit.parsePer).toFixed(2)})`, '', ''],
          ['  template: parse / mark a report', `${ms(templateSplit.parsePer)} / ${ms(templateSplit.markPer)} (× ${(templateSplit.markPer / templateSplit.parsePer).toFixed(2)})`, '', ''],
          ['reports per second without the write', withoutWritePerSecond.toFixed(0), '', ''],
          ['reports per second with the write (whole service path)', withWritePerSecond.toFixed(0), '≥ 50', targets.write ? 'PASS' : 'MISS'],
          [`one upload over loopback HTTP, p95 of ${all.length}`, `${ms(p95)} (median ${ms(median(all))}; CSV p95 ${ms(percentile(latencies.csv, 95))}, template p95 ${ms(percentile(latencies.template, 95))})`, '≤ 300 ms', targets.p95 ? 'PASS' : 'MISS'],
          ['(info) a reference, computed once per variant', ms(referenceMs), '', ''],
        ],
      ),
    );
    return { passed: targets.ratio && targets.write && targets.p95 };
  } finally {
    for (const c of cleanups.reverse()) await c();
  }
}
