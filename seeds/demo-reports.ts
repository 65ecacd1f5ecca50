/**
 * The demo reports: for every published and closed demo exercise, uploads from
 * most students of its course, in every state a report can be in — on time,
 * late (the late penalty applies), resubmitted (two versions), flagged for
 * similarity, being reviewed ('marked'), returned — and a few human
 * adjustments with their reasons. Invented data, made for the demo only.
 *
 * The data files are made here from each student's own variant Reference
 * (computeReference, through the reports module's per-variant cache) with
 * seeded noise and a few deliberate mistakes, then go through the same path
 * as an upload: readUpload (the report reader; for curves the column and
 * unit choice the reader proposes is confirmed, as a student does),
 * markWithReference (markReport against the variant's Reference, with the
 * late penalty for the upload moment) and the reports repo's inserts. Upload
 * moments lie around each exercise's due moment (zonedWallTimeToInstant).
 * Similarity flags come from the similarity service (findSimilarReports).
 * Called from seeds/demo.ts after the demo exercises exist.
 */
import { createHash } from 'node:crypto';
import ExcelJS from 'exceljs';
import type { Knex } from 'knex';
import type { ReportChoice } from '../shared/api/reports';
import { distanceFromBohr, energyFromHartree, type DistanceUnit, type EnergyUnit } from '../shared/chemistry/units';
import { huckelChain, huckelRing } from '../shared/chemistry/huckel';
import { zonedWallTimeToInstant } from '../shared/exercises/late';
import { type CurveReference, type DiagramReference, type HuckelReference } from '../shared/exercises/reference';
import { exerciseSpecSchema, type ExerciseSpec } from '../shared/exercises/spec';
import { fnv1a32, mulberry32, type Variant } from '../shared/exercises/variants';
import type { ReportAnswers } from '../shared/marking/score';
import { recordAudit } from '../server/src/platform/audit';
import { ensureVariant } from '../server/src/modules/exercises/variants';
import { markWithReference, referenceFor, storedChecks } from '../server/src/modules/reports/marking';
import { insertMark, insertReport, insertStoredFile, parseJson } from '../server/src/modules/reports/repo';
import { markableOf, readUpload, storedReadingOf, type ReadUpload } from '../server/src/modules/reports/service';
import type { ReceivedFile } from '../server/src/modules/reports/uploads';
import { runSimilarity } from '../server/src/modules/similarity/service';

type Db = Knex | Knex.Transaction;
type ReportState = 'submitted' | 'marked' | 'returned';

/* ------------------------------------------------------------------ */
/* what happens to whom                                                 */
/* ------------------------------------------------------------------ */

/** A deliberate mistake in a version's data or answers. */
type Mistake =
  | 'wrong-unit' // distances written in another unit than the header says
  | 'shifted-minimum' // energies one grid step out of place, so the minimum moves
  | 'missing-antibonding' // the antibonding column left out
  | 'wrong-term'
  | 'wrong-bond-order'
  | 'wrong-unpaired'
  | 'wrong-configuration' // one electron short in the highest occupied level
  | 'rounded' // Hückel x values to one decimal
  | 'other-topology' // Hückel: the ring's energies for a chain or the chain's for a ring
  | 'missing-level'; // Hückel: one orbital left out

/** What a student does in one exercise. */
type Role =
  | 'honest'
  | 'grace' // a few minutes after the due moment, inside the grace period
  | 'late-short' // within the first day after the grace period
  | 'late-long' // more than a day late
  | 'extension' // after the due moment, inside an extension granted by the lecturer
  | 'on-behalf' // the assistant uploads for the student, days late
  | 'resubmit' // a first version with a mistake, then a corrected one before the due moment
  | 'resubmit-late' // the corrected version comes after the due moment
  | 'copy-source' // an honest report that another student copies
  | 'copy' // hands in the previous copy-source's file as it is
  | 'copy-errors' // puts the previous copy-source's deviations on their own Reference
  | Mistake;

interface ExercisePlan {
  /** given in order to the students sorted by student number (the demo student apart) */
  roles: Role[];
  /** the role of the demo student account (student number 2400001) */
  demoStudent: Role;
  /** share of the students without a scripted role who hand nothing in */
  absentShare: number;
  /** share of the reports that carry a PDF write-up, when the exercise takes one */
  writeupShare: number;
  /** sections whose newest reports are returned, and when (wall-clock in the exercise's zone) */
  returned: { sections: string[]; atLocal: string } | null;
  /** share of the other newest reports that have been looked at ('marked') */
  markedShare: number;
  /** roles whose reports stay 'marked' (a person still has to decide) rather than returned */
  holdRoles: Role[];
  /** roles whose reports nobody has looked at yet ('submitted') */
  untouchedRoles: Role[];
  /** a note the lecturer left on the exercise's similarity flags, if they have been reviewed */
  flagReview: string | null;
}

const DEMO_STUDENT_NUMBER = '2400001';

/** Plans by the exercise's variant seed (seeds/demo-exercises.ts); any other exercise gets the default. */
const plans: Record<string, ExercisePlan> = {
  // closed: everything returned a week after the due moment, except the copied pair
  'aldermere-2140-h2-vb': {
    roles: ['copy-source', 'copy', 'late-short', 'late-long', 'grace', 'resubmit', 'shifted-minimum', 'on-behalf', 'wrong-unit'],
    demoStudent: 'honest',
    absentShare: 0.08,
    writeupShare: 0.6,
    returned: { sections: ['Lab A', 'Lab B', 'Lab M'], atLocal: '2026-10-09T16:30' },
    markedShare: 0,
    holdRoles: ['copy-source', 'copy'],
    untouchedRoles: [],
    flagReview: 'Both students say they shared one spreadsheet while working in the lab. Discussed with them on 8 October; marks stand, a note is on file.',
  },
  // Lab A returned; Lab B partly reviewed; the late ones not looked at yet
  'aldermere-2140-one-electron': {
    roles: [
      'copy-source',
      'copy',
      'late-short',
      'late-long',
      'extension',
      'wrong-unit',
      'shifted-minimum',
      'missing-antibonding',
      'grace',
      'resubmit-late',
      'resubmit',
    ],
    demoStudent: 'resubmit',
    absentShare: 0.1,
    writeupShare: 1,
    returned: { sections: ['Lab A'], atLocal: '2026-10-20T12:00' },
    markedShare: 0.5,
    holdRoles: ['copy-source', 'copy'],
    untouchedRoles: ['late-long', 'resubmit-late'],
    flagReview: null,
  },
  // being reviewed
  'aldermere-2140-h2-mo': {
    roles: ['copy-source', 'copy-errors', 'late-short', 'late-long', 'late-long', 'resubmit', 'wrong-unit', 'shifted-minimum'],
    demoStudent: 'late-short',
    absentShare: 0.12,
    writeupShare: 0.5,
    returned: null,
    markedShare: 0.35,
    holdRoles: [],
    untouchedRoles: ['late-long'],
    flagReview: null,
  },
  // answers only (MO diagram), returned a week later
  'aldermere-3310-diatomics': {
    roles: ['wrong-term', 'wrong-bond-order', 'wrong-unpaired', 'wrong-configuration', 'late-short', 'late-long', 'resubmit', 'wrong-term'],
    demoStudent: 'honest',
    absentShare: 0.08,
    writeupShare: 0,
    returned: { sections: ['Lab M'], atLocal: '2026-10-23T15:00' },
    markedShare: 0,
    holdRoles: ['late-long'],
    untouchedRoles: [],
    flagReview: null,
  },
  // answers only (Hückel), half looked at
  'aldermere-3310-huckel': {
    roles: ['rounded', 'other-topology', 'missing-level', 'late-short', 'late-long', 'resubmit', 'rounded'],
    demoStudent: 'honest',
    absentShare: 0.1,
    writeupShare: 0.3,
    returned: null,
    markedShare: 0.5,
    holdRoles: [],
    untouchedRoles: ['late-long'],
    flagReview: null,
  },
};

const defaultPlan: ExercisePlan = {
  roles: ['late-short', 'resubmit'],
  demoStudent: 'honest',
  absentShare: 0.1,
  writeupShare: 0.5,
  returned: null,
  markedShare: 0,
  holdRoles: [],
  untouchedRoles: [],
  flagReview: null,
};

/** A seeded generator for one purpose: the same parts give the same numbers on every load. */
const rngOf = (...parts: (string | number)[]) => mulberry32(fnv1a32(parts.join('|')));
const pick = <T>(rng: () => number, items: readonly T[]): T => items[Math.floor(rng() * items.length) % items.length];

/* ------------------------------------------------------------------ */
/* times                                                                */
/* ------------------------------------------------------------------ */

const MINUTE = 60_000;

/** The upload moment of a version, relative to the due instant. */
function uploadMoment(due: Date, kind: 'on-time' | 'early' | Role, rng: () => number, spec: ExerciseSpec): Date {
  const grace = spec.late.graceMinutes;
  const seconds = Math.floor(rng() * 60) * 1000;
  const offsetMinutes = (() => {
    switch (kind) {
      case 'early': // a first version, two to four days ahead
        return -(2 * 1440 + rng() * 2 * 1440);
      case 'grace':
        return grace > 0 ? 1 + Math.floor(rng() * Math.max(1, grace - 2)) : -3;
      case 'late-short':
      case 'resubmit-late':
        return grace + 20 + rng() * 300;
      case 'late-long':
        return 1440 + grace + 60 + rng() * 1440;
      case 'extension':
        return 1200 + rng() * 300; // the extension is two days
      case 'on-behalf':
        return 3 * 1440 + 90 + rng() * 240;
      default:
        // most students hand in on the last day, a few earlier
        return -(8 + Math.pow(rng(), 2.2) * 4 * 1440);
    }
  })();
  return new Date(due.getTime() + Math.round(offsetMinutes) * MINUTE + seconds);
}

/* ------------------------------------------------------------------ */
/* the files                                                            */
/* ------------------------------------------------------------------ */

const unitLabel: Record<string, string> = { bohr: 'bohr', angstrom: 'Å', pm: 'pm', hartree: 'Eh', ev: 'eV' };

interface CurveStyle {
  energyUnit: EnergyUnit;
  decimals: number;
  /** noise amplitude, hartree */
  amplitude: number;
  header: 0 | 1 | 2;
}

function curveStyleOf(studentNumber: string, exerciseSeed: string): CurveStyle {
  const rng = rngOf('style', exerciseSeed, studentNumber);
  const energyUnit: EnergyUnit = rng() < 0.2 ? 'ev' : 'hartree';
  return {
    energyUnit,
    decimals: energyUnit === 'ev' ? 4 + Math.floor(rng() * 3) : 6 + Math.floor(rng() * 3),
    // from 3e-5 to 5e-3 Eh: from near-perfect to sloppy, so that the curve checks spread
    amplitude: Math.pow(10, -4.5 + 2.2 * rng()),
    header: Math.floor(rng() * 3) as 0 | 1 | 2,
  };
}

/**
 * A student's own deviations from the Reference, per curve and grid point (hartree): a smooth
 * wave of random phase and period (what a slip in an integral or a loose convergence leaves on a
 * computed curve) and a little point-to-point scatter.
 */
function deviationsOf(key: string, reference: CurveReference, amplitude: number): number[][] {
  const rng = rngOf('deviations', key);
  return reference.curves.map(() => {
    const phase = rng() * 2 * Math.PI;
    const period = 2 + rng() * 5;
    return reference.grid.bohr.map((r) => amplitude * (0.95 * Math.sin((2 * Math.PI * r) / period + phase) + 0.05 * (2 * rng() - 1)));
  });
}

function columnName(state: string, style: CurveStyle, family: string): string {
  const u = unitLabel[style.energyUnit];
  if (family === 'two-electron') return [`E / ${u}`, `E(H2) (${u})`, `Energy [${u}]`][style.header];
  const word = state === 'bonding' ? ['E bonding', 'E(sigma g)', 'bonding'][style.header] : ['E antibonding', 'E(sigma u*)', 'antibonding'][style.header];
  return style.header === 2 ? `${word} [${u}]` : `${word} / ${u}`;
}

/** A CSV of the Reference's curves plus `deviations`, with a deliberate mistake when asked. */
function curveCsv(reference: CurveReference, deviations: number[][], style: CurveStyle, family: string, mistake: Mistake | null): string {
  const gridUnit = reference.grid.unit as DistanceUnit;
  // wrong unit: the numbers are in another unit than the header names
  const writtenUnit: DistanceUnit = mistake === 'wrong-unit' ? (gridUnit === 'bohr' ? 'angstrom' : 'bohr') : gridUnit;
  const curves = reference.curves
    .map((c, k) => ({ c, k }))
    .filter(({ c }) => !(mistake === 'missing-antibonding' && c.state === 'antibonding'));
  const rHeader = [`R / ${unitLabel[gridUnit]}`, `R (${unitLabel[gridUnit]})`, `distance [${unitLabel[gridUnit]}]`][style.header];
  const lines = [[rHeader, ...curves.map(({ c }) => columnName(c.state, style, family))].join(',')];
  reference.grid.bohr.forEach((r, i) => {
    // shifted minimum: every energy one grid step out of place (the first point has none and is left out)
    const source = mistake === 'shifted-minimum' ? i - 1 : i;
    if (source < 0) return;
    const cells = [distanceFromBohr(r, writtenUnit).toFixed(4)];
    for (const { c, k } of curves) cells.push(energyFromHartree(c.energyHartree[source] + deviations[k][source], style.energyUnit).toFixed(style.decimals));
    lines.push(cells.join(','));
  });
  return lines.join('\n') + '\n';
}

const superscripts = '⁰¹²³⁴⁵⁶⁷⁸⁹';

/** Typed MO-diagram answers: the Reference's, in one of several notations, with a mistake when asked. */
function diagramAnswers(reference: DiagramReference, rng: () => number, mistake: Mistake | null): Record<string, string | number> {
  const a = reference.answers;
  let configuration = rng() < 0.3 ? a.configuration.replace('(1σg)²(1σu*)²', 'KK ') : a.configuration;
  if (mistake === 'wrong-configuration') {
    // one electron short in the highest occupied level
    configuration = configuration.replace(/\(([^()]+)\)([¹²³⁴])$/, (_, level: string, n: string) => {
      const count = superscripts.indexOf(n) - 1;
      return count > 0 ? `(${level})${superscripts[count]}` : '';
    });
  }
  let term = rng() < 0.5 ? a.termSymbol : a.termSymbol.replace('¹', '1').replace('²', '2').replace('³', '3').replace('⁺', '+').replace('⁻', '-');
  // a wrong count of unpaired electrons carries over into the multiplicity
  if (mistake === 'wrong-term' || mistake === 'wrong-unpaired') {
    const swap: Record<string, string> = { '¹': '³', '³': '¹', '²': '⁴', '1': '3', '3': '1', '2': '4' };
    term = (swap[term[0]] ?? term[0]) + term.slice(1);
  }
  const bondOrder = mistake === 'wrong-bond-order' ? a.bondOrder + (a.bondOrder >= 2 ? -0.5 : 0.5) : a.bondOrder;
  const unpaired = mistake === 'wrong-unpaired' ? (a.unpairedElectrons === 0 ? 2 : 0) : a.unpairedElectrons;
  return { configuration, 'bond order': bondOrder, 'unpaired electrons': unpaired, 'term symbol': term };
}

/** A workbook with an Answers sheet (question, answer), as the answer reader takes it. */
async function answersWorkbook(answers: Record<string, string | number>): Promise<Buffer> {
  const workbook = new ExcelJS.Workbook();
  const sheet = workbook.addWorksheet('Answers');
  sheet.addRow(['question', 'answer']);
  for (const [q, a] of Object.entries(answers)) sheet.addRow([q, a]);
  return Buffer.from(await workbook.xlsx.writeBuffer());
}

const formatBeta = (x: number, decimals: number) => {
  const v = Math.abs(x) < 0.5 * 10 ** -decimals ? 0 : x;
  if (v === 0) return 'α';
  return `α ${v > 0 ? '+' : '−'} ${Math.abs(v).toFixed(decimals)}β`;
};

/** The two-column question,answer CSV of a Hückel report, from the Reference's x values. */
function huckelCsv(reference: HuckelReference, variant: Variant, rng: () => number, mistake: Mistake | null): string {
  let x = [...reference.answers.x];
  const decimals = mistake === 'rounded' ? 1 : 3;
  if (mistake === 'other-topology' && variant.family === 'huckel' && (variant.system.kind === 'chain' || variant.system.kind === 'ring')) {
    // a mix-up: the energies of the other topology with the same number of centres
    x = [...(variant.system.kind === 'chain' ? huckelRing(variant.system.n) : huckelChain(variant.system.n)).xValues];
  }
  if (mistake === 'missing-level') x.splice(Math.floor(x.length / 2), 1);
  x.sort((p, q) => q - p); // from the lowest orbital up (β < 0)
  const energies = rng() < 0.7 ? x.map((v) => formatBeta(v, decimals)).join(', ') : x.map((v) => (Math.abs(v) < 5e-4 ? 0 : v).toFixed(decimals)).join(' ');
  const lines = ['question,answer', `huckel-energies,"${energies}"`];
  if (rng() < 0.7) {
    const a = reference.answers;
    lines.push(`pi-energy,"Eπ = ${reference.result.electronCount}α + ${a.piEnergyBeta.toFixed(3)}β; delocalization energy ${a.delocalizationBeta.toFixed(3)}β"`);
  }
  return lines.join('\n') + '\n';
}

/** ASCII for the PDF's standard font: accents dropped, subscripts as digits. */
const ascii = (text: string) =>
  text
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .replace(/[–—]/g, '-')
    .replace(/[^\x20-\x7e]/g, '')
    .replace(/([\\()])/g, '\\$1');

/** A one-page PDF with a few lines of text (PDF 1.4, Helvetica; offsets computed so readers accept it). */
function writeupPdf(lines: string[]): Buffer {
  const text = lines.map((l, i) => `${i === 0 ? '' : '0 -18 Td '}(${ascii(l)}) Tj`).join('\n');
  const stream = `BT /F1 11 Tf 64 770 Td\n${text}\nET`;
  const objects = [
    '<< /Type /Catalog /Pages 2 0 R >>',
    '<< /Type /Pages /Kids [3 0 R] /Count 1 >>',
    '<< /Type /Page /Parent 2 0 R /MediaBox [0 0 595 842] /Resources << /Font << /F1 4 0 R >> >> /Contents 5 0 R >>',
    '<< /Type /Font /Subtype /Type1 /BaseFont /Helvetica >>',
    `<< /Length ${Buffer.byteLength(stream, 'latin1')} >>\nstream\n${stream}\nendstream`,
  ];
  let body = '%PDF-1.4\n';
  const offsets: number[] = [];
  objects.forEach((o, i) => {
    offsets.push(Buffer.byteLength(body, 'latin1'));
    body += `${i + 1} 0 obj\n${o}\nendobj\n`;
  });
  const xref = Buffer.byteLength(body, 'latin1');
  body += `xref\n0 ${objects.length + 1}\n0000000000 65535 f \n${offsets.map((o) => `${String(o).padStart(10, '0')} 00000 n \n`).join('')}`;
  body += `trailer\n<< /Size ${objects.length + 1} /Root 1 0 R >>\nstartxref\n${xref}\n%%EOF\n`;
  return Buffer.from(body, 'latin1');
}

const writeupText: Record<string, string[]> = {
  'one-electron': [
    'The bonding orbital gathers charge between the nuclei; the antibonding one has a nodal',
    'plane halfway between them, perpendicular to the axis, and its curve has no minimum.',
  ],
  'two-electron': [
    'The simple MO function gives the ionic terms the same weight at every distance, so it',
    'dissociates to a mixture of two atoms and an ion pair; the valence-bond function does not.',
  ],
  huckel: ['Orbital energies from the lowest up; total pi energy from the occupied orbitals,', 'delocalization energy against isolated double bonds.'],
  diatomic: ['Level order chosen by the s-p mixing rule for the species.'],
};

const received = (fileName: string, bytes: Buffer): ReceivedFile => ({ fileName, bytes, sizeBytes: bytes.length, sha256: createHash('sha256').update(bytes).digest('hex') });

/* ------------------------------------------------------------------ */
/* reading and storing one version (the upload path, at a chosen moment) */
/* ------------------------------------------------------------------ */

const curveFamilies = new Set(['one-electron', 'two-electron']);

/** Reads a file as an upload does: for curves the reader's own proposal is shown and confirmed. */
async function readAsUploaded(spec: ExerciseSpec, data: ReceivedFile, writeup: ReceivedFile | null): Promise<ReadUpload> {
  const preview = await readUpload(spec, data, writeup, undefined);
  if (!curveFamilies.has(spec.model.family) || !preview.reading) return preview;
  const r = preview.reading;
  const choice: ReportChoice = {
    ...(r.choice.sheet ? { sheet: r.choice.sheet } : {}),
    distanceColumn: r.choice.distanceColumn,
    energyColumns: [...r.choice.energyColumns],
    distanceUnit: r.units.distance,
    energyUnit: r.units.energy,
    convention: r.convention,
  };
  return readUpload(spec, data, writeup, choice);
}

interface ExerciseRow {
  id: number;
  course_id: number;
  state: 'published' | 'closed';
  revision_id: number;
  spec: ExerciseSpec;
}

interface Student {
  enrolmentId: number;
  userId: number;
  number: string;
  name: string;
  section: string;
  sectionId: number | null;
}

interface StoredVersion {
  reportId: number;
  student: Student;
  role: Role;
  versionNo: number;
  uploadedAt: Date;
  hasWriteup: boolean;
  answers: ReportAnswers | null;
  checks: ReturnType<typeof storedChecks>;
}

async function storeVersion(
  trx: Db,
  exercise: ExerciseRow,
  student: Student,
  variant: { id: number; variant: Variant },
  files: { data: ReceivedFile; writeup: ReceivedFile | null },
  versionNo: number,
  uploadedAt: Date,
  uploadedBy: number,
  extension: number,
): Promise<{ reportId: number; answers: ReportAnswers | null; checks: ReturnType<typeof storedChecks> }> {
  const read = await readAsUploaded(exercise.spec, files.data, files.writeup);
  const stored = storedReadingOf(read);
  const mark = markWithReference({
    revisionId: exercise.revision_id,
    spec: exercise.spec,
    variant: variant.variant,
    reading: markableOf(stored),
    answers: stored.answers,
    submittedAt: uploadedAt,
    extensionMinutes: extension,
  });
  const checks = storedChecks(mark);
  const dataFileId = await insertStoredFile(trx, { sha256: files.data.sha256, sizeBytes: files.data.sizeBytes, detectedType: read.detected.kind, fileName: files.data.fileName, content: files.data.bytes, uploadedBy });
  const writeupFileId = files.writeup
    ? await insertStoredFile(trx, { sha256: files.writeup.sha256, sizeBytes: files.writeup.sizeBytes, detectedType: 'pdf', fileName: files.writeup.fileName, content: files.writeup.bytes, uploadedBy })
    : null;
  const reportId = await insertReport(trx, { exerciseId: exercise.id, enrolmentId: student.enrolmentId, variantId: variant.id, versionNo, dataFileId, writeupFileId, reading: stored, uploadedBy, uploadedAt });
  await insertMark(trx, {
    reportId,
    revisionId: exercise.revision_id,
    engineVersion: mark.engineVersion,
    points: mark.points,
    max: mark.max,
    latePenaltyPercent: mark.latePenaltyPercent,
    total: mark.total,
    checks,
  });
  await recordAudit(trx, {
    actorId: uploadedBy,
    action: 'report.uploaded',
    entityType: 'report',
    entityId: reportId,
    after: { exerciseId: exercise.id, enrolmentId: student.enrolmentId, versionNo, onBehalf: uploadedBy !== student.userId, dataSha256: files.data.sha256, writeupSha256: files.writeup?.sha256 ?? null, revisionId: exercise.revision_id, total: mark.total, demo: true },
  });
  return { reportId, answers: stored.answers, checks };
}

/* ------------------------------------------------------------------ */
/* one exercise                                                         */
/* ------------------------------------------------------------------ */

const writeupReasons = [
  'Write-up marked by hand: clear sketches, the comparison is argued well.',
  'Write-up marked by hand: sketches fine; the explanation of the node stays vague.',
  'Write-up marked by hand: the argument is right but the figures lack labels and units.',
  'Write-up marked by hand: short, but every point asked for is there.',
];
const answerReasons = ['Marked by hand from the answer cells: total and delocalization energy both right.', 'Marked by hand: total pi energy right; the delocalization energy is measured from the wrong reference.'];

const versionMistake = (family: string): Mistake => (family === 'one-electron' ? 'missing-antibonding' : family === 'two-electron' ? 'wrong-unit' : family === 'diatomic' ? 'wrong-term' : 'rounded');
const isMistake = (role: Role): role is Mistake =>
  ['wrong-unit', 'shifted-minimum', 'missing-antibonding', 'wrong-term', 'wrong-bond-order', 'wrong-unpaired', 'wrong-configuration', 'rounded', 'other-topology', 'missing-level'].includes(role);

export interface DemoReportsOfExercise {
  exerciseId: number;
  title: string;
  reports: number;
  students: number;
  flags: number;
  adjustments: number;
}

async function seedExercise(trx: Db, exercise: ExerciseRow): Promise<DemoReportsOfExercise> {
  const spec = exercise.spec;
  const family = spec.model.family;
  const plan = plans[spec.variantSeed] ?? defaultPlan;
  const due = zonedWallTimeToInstant(spec.dueLocal, spec.timeZone);

  const students: Student[] = (
    await trx('enrolments as en')
      .join('users as u', 'u.id', 'en.user_id')
      .leftJoin('sections as s', 's.id', 'en.section_id')
      .where({ 'en.course_id': exercise.course_id, 'en.status': 'active' })
      .orderBy('en.student_number')
      .select('en.id', 'en.user_id', 'en.student_number', 'en.given_name', 'en.family_name', 'u.display_name', 's.name as section', 'en.section_id')
  ).map((r) => ({
    enrolmentId: r.id,
    userId: r.user_id,
    number: r.student_number,
    name: [r.given_name, r.family_name].filter(Boolean).join(' ') || r.display_name,
    section: r.section ?? '',
    sectionId: r.section_id,
  }));
  const assistants = new Map<number, number>();
  for (const r of await trx('section_assistants as sa').join('sections as s', 's.id', 'sa.section_id').where('s.course_id', exercise.course_id).orderBy('sa.user_id').select('sa.section_id', 'sa.user_id')) {
    if (!assistants.has(r.section_id)) assistants.set(r.section_id, r.user_id);
  }
  const lecturer = await trx('course_staff').where({ course_id: exercise.course_id, role: 'lecturer' }).orderBy('user_id').first('user_id');
  const lecturerId = Number(lecturer.user_id);
  const assistantOf = (s: Student) => (s.sectionId !== null ? assistants.get(s.sectionId) : undefined) ?? lecturerId;

  const variantRows = await trx('variants').where({ revision_id: exercise.revision_id }).select('id', 'enrolment_id', 'variant_json');
  const variants = new Map<number, { id: number; variant: Variant }>(variantRows.map((v) => [v.enrolment_id as number, { id: v.id as number, variant: parseJson<Variant>(v.variant_json) }]));
  const variantOf = async (s: Student) => {
    let v = variants.get(s.enrolmentId);
    if (!v) {
      const made = await ensureVariant(trx as Knex, { id: exercise.id, course_id: exercise.course_id }, exercise.revision_id, s.enrolmentId);
      v = { id: made.id, variant: made.variant };
      variants.set(s.enrolmentId, v);
    }
    return v;
  };

  // roles: the demo student's, then the scripted ones in student-number order, then honest or absent
  const others = students.filter((s) => s.number !== DEMO_STUDENT_NUMBER);
  const roleOf = new Map<number, Role | null>();
  for (const s of students) {
    if (s.number === DEMO_STUDENT_NUMBER) roleOf.set(s.enrolmentId, plan.demoStudent);
  }
  // spread the scripted roles over the roster (every third student) so that they fall in every section
  const unscripted: Student[] = [];
  others.forEach((s, i) => {
    const scripted = i % 3 === 1 ? plan.roles[(i - 1) / 3] : undefined;
    if (scripted) roleOf.set(s.enrolmentId, scripted);
    else unscripted.push(s);
  });
  // of the others, a seeded few hand nothing in
  const draw = new Map(unscripted.map((s) => [s.enrolmentId, rngOf('absent', spec.variantSeed, s.number)()]));
  const absent = new Set([...unscripted].sort((a, b) => draw.get(a.enrolmentId)! - draw.get(b.enrolmentId)!).slice(0, Math.round(plan.absentShare * unscripted.length)).map((s) => s.enrolmentId));
  for (const s of unscripted) roleOf.set(s.enrolmentId, absent.has(s.enrolmentId) ? null : 'honest');

  const stored: StoredVersion[] = [];
  let copySource: { csv: string; deviations: number[][]; at: Date } | null = null;

  for (const student of students) {
    const role = roleOf.get(student.enrolmentId);
    if (!role) continue;
    const variant = await variantOf(student);
    const reference = referenceFor(exercise.revision_id, spec, variant.variant);
    const rng = rngOf('report', spec.variantSeed, student.number);

    let extension = 0;
    if (role === 'extension') {
      extension = 2 * 1440;
      await trx('extensions').insert({
        exercise_id: exercise.id,
        enrolment_id: student.enrolmentId,
        extra_minutes: extension,
        reason: 'Ill on the due date (note from the student office).',
        granted_by: lecturerId,
        created_at: new Date(due.getTime() - 20 * 60 * MINUTE),
      });
    }

    // the versions this student hands in: [mistake of the version, moment]
    const finalMistake: Mistake | null = isMistake(role) ? role : null;
    const versions: { mistake: Mistake | null; at: Date }[] = [];
    if (role === 'resubmit' || role === 'resubmit-late') {
      const first = uploadMoment(due, 'early', rng, spec);
      // the corrected version: later the same week, before the due moment, or just after it
      const second = role === 'resubmit' ? new Date(first.getTime() + (0.3 + 0.65 * rng()) * (due.getTime() - first.getTime())) : uploadMoment(due, 'resubmit-late', rng, spec);
      versions.push({ mistake: versionMistake(family), at: first });
      versions.push({ mistake: null, at: second });
    } else if (role === 'copy' && copySource) {
      versions.push({ mistake: null, at: new Date(copySource.at.getTime() + (70 + Math.floor(rng() * 60)) * MINUTE) });
    } else {
      versions.push({ mistake: finalMistake, at: uploadMoment(due, role, rng, spec) });
    }
    const byAssistant = role === 'on-behalf';
    const uploadedBy = byAssistant ? assistantOf(student) : student.userId;
    const surname = student.name.split(' ').slice(-1)[0].toLowerCase().normalize('NFKD').replace(/[^a-z]/g, '');
    const wantsWriteup = spec.writeUp === 'required' || (spec.writeUp === 'optional' && rngOf('writeup', spec.variantSeed, student.number)() < plan.writeupShare);

    for (let v = 0; v < versions.length; v++) {
      const { mistake, at } = versions[v];
      const versionNo = v + 1;
      let data: ReceivedFile;
      const stem = pick(rng, [`${surname}_${student.number}`, `${student.number}`, `${surname}-${family}`]) + (versions.length > 1 ? `_v${versionNo}` : '');
      if (reference.kind === 'curve') {
        const style = curveStyleOf(student.number, spec.variantSeed);
        let deviations = deviationsOf(`${spec.variantSeed}|${student.number}|${versionNo}`, reference, style.amplitude);
        let csv: string;
        if (role === 'copy' && copySource?.csv) {
          csv = copySource.csv; // the other student's file, byte for byte
        } else {
          if (role === 'copy-errors' && copySource?.deviations && copySource.deviations[0].length === reference.grid.bohr.length) {
            deviations = copySource.deviations.slice(0, reference.curves.length); // someone else's errors on one's own Reference
          }
          csv = curveCsv(reference, deviations, style, family, mistake);
        }
        if (role === 'copy-source') copySource = { csv, deviations, at };
        data = received(`${stem}.csv`, Buffer.from(csv, 'utf8'));
      } else if (reference.kind === 'diagram') {
        data = received(`${stem}.xlsx`, await answersWorkbook(diagramAnswers(reference, rng, mistake)));
      } else {
        data = received(`${stem}.csv`, Buffer.from(huckelCsv(reference, variant.variant, rng, mistake), 'utf8'));
      }
      const writeup = wantsWriteup
        ? received(
            `${surname}-write-up${versions.length > 1 ? `-v${versionNo}` : ''}.pdf`,
            writeupPdf([spec.title, `${student.name} (${student.number}), ${student.section}`, `Variant ${variant.variant.key}; version ${versionNo}`, '', ...(writeupText[family] ?? []), '', 'Invented demo write-up (Aldermere University demo data).']),
          )
        : null;
      const result = await storeVersion(trx, exercise, student, variant, { data, writeup }, versionNo, at, uploadedBy, extension);
      stored.push({ reportId: result.reportId, student, role, versionNo, uploadedAt: at, hasWriteup: writeup !== null, answers: result.answers, checks: result.checks });
    }
  }

  // the marks were made at the upload moment, and the files stored then
  await trx('marks').join('reports', 'reports.id', 'marks.report_id').where('reports.exercise_id', exercise.id).update({ 'marks.created_at': trx.raw('reports.uploaded_at') });
  await trx('stored_files').join('reports', 'reports.data_file_id', 'stored_files.id').where('reports.exercise_id', exercise.id).update({ 'stored_files.created_at': trx.raw('reports.uploaded_at') });
  await trx('stored_files').join('reports', 'reports.writeup_file_id', 'stored_files.id').where('reports.exercise_id', exercise.id).update({ 'stored_files.created_at': trx.raw('reports.uploaded_at') });

  // review: states of the newest versions, returns and adjustments
  const newest = new Map<number, StoredVersion>();
  for (const s of stored) if ((newest.get(s.student.enrolmentId)?.versionNo ?? 0) < s.versionNo) newest.set(s.student.enrolmentId, s);
  const returnedMoment = plan.returned ? zonedWallTimeToInstant(plan.returned.atLocal, spec.timeZone) : null;
  const byState: Record<ReportState, number[]> = { submitted: [], marked: [], returned: [] };
  const reviewed: { version: StoredVersion; at: Date }[] = [];
  for (const s of newest.values()) {
    let state: ReportState = 'submitted';
    if (plan.untouchedRoles.includes(s.role)) state = 'submitted';
    else if (plan.holdRoles.includes(s.role)) state = 'marked';
    else if (plan.returned && plan.returned.sections.includes(s.student.section)) state = 'returned';
    else if (rngOf('marked', spec.variantSeed, s.student.number)() < plan.markedShare) state = 'marked';
    byState[state].push(s.reportId);
    if (state !== 'submitted') {
      const latest = new Date(Math.max(s.uploadedAt.getTime(), due.getTime()));
      const at = state === 'returned' && returnedMoment ? new Date(returnedMoment.getTime() - (60 + Math.floor(rngOf('adjusted-at', s.reportId)() * 2 * 1440)) * MINUTE) : new Date(latest.getTime() + (2 * 1440 + Math.floor(rngOf('adjusted-at', s.reportId)() * 3 * 1440)) * MINUTE);
      reviewed.push({ version: s, at: at.getTime() > s.uploadedAt.getTime() ? at : new Date(s.uploadedAt.getTime() + 6 * 60 * MINUTE) });
    }
  }
  if (byState.marked.length) await trx('reports').whereIn('id', byState.marked).update({ state: 'marked' });
  if (byState.returned.length && returnedMoment) await trx('reports').whereIn('id', byState.returned).update({ state: 'returned', returned_at: returnedMoment });

  // adjustments: the hand-marked checks (write-ups, typed pi energies) of the reviewed reports, and a
  // few automatic marks a person corrected
  const adjustments: { report_id: number; check_id: string; points: number; reason: string; adjusted_by: number; created_at: Date }[] = [];
  for (const { version, at } of reviewed) {
    const rng = rngOf('adjust', spec.variantSeed, version.student.number);
    const by = assistantOf(version.student);
    for (const check of spec.scheme.checks) {
      const result = version.checks.find((c) => c.id === check.id);
      if (!result) continue;
      if (check.kind === 'manual') {
        const answered = version.answers && (version.answers[check.id] ?? null) !== null;
        if (!version.hasWriteup && !answered) continue;
        const fraction = pick(rng, [0.6, 0.7, 0.8, 0.9, 1]);
        adjustments.push({ report_id: version.reportId, check_id: check.id, points: Math.round(result.max * fraction * 2) / 2, reason: version.hasWriteup ? pick(rng, writeupReasons) : pick(rng, answerReasons), adjusted_by: by, created_at: at });
      } else if (version.role === 'shifted-minimum' && check.kind === 'equilibrium-distance') {
        adjustments.push({ report_id: version.reportId, check_id: check.id, points: Math.round(result.max * 0.75 * 100) / 100, reason: 'The write-up gives the right Rₑ; the table was pasted one row out of place. Most of the credit restored.', adjusted_by: by, created_at: at });
      } else if (version.role === 'wrong-configuration' && check.kind === 'configuration') {
        adjustments.push({ report_id: version.reportId, check_id: check.id, points: Math.round(result.max * 0.5 * 100) / 100, reason: 'Level order and filling right up to the last level; one electron missing there. Half credit.', adjusted_by: by, created_at: at });
      }
    }
  }
  if (adjustments.length) await trx('adjustments').insert(adjustments);

  // similarity over the newest reports (curve exercises), as the upload's similarity job does
  const run = await runSimilarity(trx as Knex, exercise.id);
  const lastUpload = stored.reduce((m, s) => Math.max(m, s.uploadedAt.getTime()), 0);
  if (run.flagsAdded) {
    await trx('similarity_flags').where({ exercise_id: exercise.id }).update({ created_at: new Date(lastUpload + 5 * MINUTE) });
    if (plan.flagReview && returnedMoment) {
      await trx('similarity_flags').where({ exercise_id: exercise.id }).update({ reviewed_by: lecturerId, review_note: plan.flagReview, reviewed_at: new Date(returnedMoment.getTime() - 1440 * MINUTE) });
    }
  }
  return { exerciseId: exercise.id, title: spec.title, reports: stored.length, students: newest.size, flags: run.flagsAdded, adjustments: adjustments.length };
}

/**
 * Adds the demo reports to every published and closed exercise (in the order
 * they were made). Expects the demo courses, rosters and exercises with their
 * variants (seeds/demo.ts, seeds/demo-exercises.ts). Returns what it made.
 */
export async function seedDemoReports(trx: Db): Promise<DemoReportsOfExercise[]> {
  const rows = await trx('exercises as e')
    .join('exercise_revisions as r', 'r.id', 'e.current_revision_id')
    .whereIn('e.state', ['published', 'closed'])
    .orderBy('e.id')
    .select('e.id', 'e.course_id', 'e.state', 'r.id as revision_id', 'r.spec_json');
  const made: DemoReportsOfExercise[] = [];
  for (const r of rows) {
    const exercise: ExerciseRow = { id: r.id, course_id: r.course_id, state: r.state, revision_id: r.revision_id, spec: exerciseSpecSchema.parse(parseJson(r.spec_json)) };
    made.push(await seedExercise(trx, exercise));
  }
  return made;
}
