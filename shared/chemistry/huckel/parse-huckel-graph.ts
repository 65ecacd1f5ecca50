/**
 * Reading and checking a Hückel graph (atoms, bonds, charge) from JSON with zod.
 * Shorthands: an atom may be a type string ("C", "N-pyridine"); a bond may be a pair
 * [from, to] or a triple [from, to, k]. Atom indices are 0-based. Every problem is reported
 * with the index of the atom or bond it concerns, e.g. "atoms[2]: unknown atom type 'N' …".
 */
import { z } from 'zod';
import { mergeHuckelParameters, type HuckelParameters } from './parameters';
import type { HuckelGraphInput } from './types';

export interface HuckelInputIssue {
  /** e.g. "atoms[2].type", "bonds[0]", "charge" */
  path: string;
  message: string;
}

export class HuckelInputError extends Error {
  readonly issues: HuckelInputIssue[];
  constructor(issues: HuckelInputIssue[]) {
    super(`invalid Hückel graph: ${issues.map((i) => (i.path ? `${i.path}: ${i.message}` : i.message)).join('; ')}`);
    this.name = 'HuckelInputError';
    this.issues = issues;
  }
}

export const MAX_HUCKEL_ATOMS = 400;

const finite = z.number({ error: 'must be a number' }).refine(Number.isFinite, { message: 'must be a finite number' });
const atomIndex = z.number({ error: 'atom index must be a number' }).int({ message: 'atom index must be an integer' }).min(0, { message: 'atom index must be 0 or more' });

const ATOM_SHAPE = 'an atom is a type name ("C") or an object { type?, h?, piElectrons?, label? }';
const BOND_SHAPE = 'a bond is [from, to], [from, to, k] or an object { from, to, k?, type? }';

const atomObject = z
  .object(
    {
      type: z.string().min(1, { message: 'atom type must not be empty' }).optional(),
      h: finite.optional(),
      piElectrons: z
        .number({ error: 'piElectrons must be 0, 1 or 2' })
        .int({ message: 'piElectrons must be 0, 1 or 2' })
        .min(0, { message: 'piElectrons must be 0, 1 or 2' })
        .max(2, { message: 'piElectrons must be 0, 1 or 2' })
        .optional(),
      label: z.string().optional(),
    },
    { error: (issue) => (issue.code === 'invalid_type' ? ATOM_SHAPE : undefined) },
  )
  .strict();
/** shorthand "C" → { type: "C" } */
const atomSchema = z.preprocess((value) => (typeof value === 'string' ? { type: value } : value), atomObject);

const bondObject = z
  .object(
    {
      from: atomIndex,
      to: atomIndex,
      k: finite.optional(),
      type: z.enum(['single', 'double'], { error: "bond type must be 'single' or 'double'" }).optional(),
    },
    { error: (issue) => (issue.code === 'invalid_type' ? BOND_SHAPE : undefined) },
  )
  .strict();
/** shorthand [from, to] / [from, to, k] → object */
const bondSchema = z.preprocess((value) => {
  if (Array.isArray(value) && (value.length === 2 || value.length === 3)) {
    const [from, to, k] = value as unknown[];
    return value.length === 2 ? { from, to } : { from, to, k };
  }
  return value;
}, bondObject);

const atomTypeOverride = z
  .object({ h: finite.optional(), k: finite.optional(), piElectrons: z.number().int().min(0).max(2).optional(), description: z.string().optional() })
  .strict();

export const huckelGraphSchema = z
  .object({
    name: z.string().optional(),
    atoms: z.array(atomSchema).min(1, { message: 'at least one atom is needed' }).max(MAX_HUCKEL_ATOMS, { message: `at most ${MAX_HUCKEL_ATOMS} atoms` }),
    bonds: z.array(bondSchema),
    charge: z.number().int({ message: 'charge must be an integer' }).optional(),
    electrons: z.number().int({ message: 'electrons must be an integer' }).min(0, { message: 'electrons must be 0 or more' }).optional(),
    parameters: z
      .object({ atomTypes: z.record(z.string(), atomTypeOverride).optional(), bondK: z.record(z.string(), finite).optional() })
      .strict()
      .optional(),
  })
  .strict();

function pathText(path: ReadonlyArray<PropertyKey>): string {
  let out = '';
  for (const part of path) out += typeof part === 'number' ? `[${part}]` : out === '' ? String(part) : `.${String(part)}`;
  return out;
}

/** Checks that need the whole graph: indices in range, no loops or repeated bonds, known types, electron count. */
function graphIssues(graph: HuckelGraphInput): HuckelInputIssue[] {
  const issues: HuckelInputIssue[] = [];
  let parameters: HuckelParameters;
  try {
    parameters = mergeHuckelParameters(graph.parameters);
  } catch (error) {
    return [{ path: 'parameters', message: (error as Error).message }];
  }
  const n = graph.atoms.length;
  let contributed = 0;
  graph.atoms.forEach((atom, i) => {
    const type = atom.type ?? 'C';
    const known = parameters.atomTypes[type];
    if (!known) {
      const hint =
        type === 'N'
          ? " ('N' is ambiguous: use 'N-pyridine' (=N−, 1 π electron), 'N-pyrrole' (−N̈<, 2) or 'N-pyridinium' (=N⁺<, 1))"
          : type === 'O'
            ? " ('O' is ambiguous: use 'O-carbonyl' (=O, 1 π electron), 'O-ether' (−Ö−, 2) or 'O-pyrylium' (=O⁺−, 1))"
            : `; known types: ${Object.keys(parameters.atomTypes).join(', ')}`;
      issues.push({ path: `atoms[${i}].type`, message: `unknown atom type '${type}'${hint}` });
    } else {
      contributed += atom.piElectrons ?? known.piElectrons;
    }
  });
  const seen = new Map<string, number>();
  const doubleAt = new Map<number, number>();
  graph.bonds.forEach((bond, b) => {
    for (const end of ['from', 'to'] as const) {
      if (bond[end] >= n) issues.push({ path: `bonds[${b}].${end}`, message: `atom index ${bond[end]} is out of range (${n} atoms, indices 0…${n - 1})` });
    }
    if (bond.from === bond.to) issues.push({ path: `bonds[${b}]`, message: `bond joins atom ${bond.from} to itself` });
    const key = bond.from < bond.to ? `${bond.from}-${bond.to}` : `${bond.to}-${bond.from}`;
    const earlier = seen.get(key);
    if (earlier !== undefined) issues.push({ path: `bonds[${b}]`, message: `repeats bonds[${earlier}] (atoms ${key})` });
    else seen.set(key, b);
    if (bond.type === 'double') {
      for (const atom of [bond.from, bond.to]) {
        const other = doubleAt.get(atom);
        if (other !== undefined) issues.push({ path: `bonds[${b}].type`, message: `atom ${atom} is already in the double bond bonds[${other}]` });
        else doubleAt.set(atom, b);
      }
    }
  });
  if (issues.length > 0) return issues;
  const charge = graph.charge ?? 0;
  if (graph.electrons !== undefined && graph.charge !== undefined && contributed - graph.charge !== graph.electrons) {
    issues.push({
      path: 'electrons',
      message: `electrons ${graph.electrons} and charge ${graph.charge} disagree: the atom types contribute ${contributed} π electrons, so charge ${graph.charge} means ${contributed - graph.charge}`,
    });
  }
  const electrons = graph.electrons ?? contributed - charge;
  if (electrons < 0 || electrons > 2 * n) {
    issues.push({
      path: graph.electrons !== undefined ? 'electrons' : 'charge',
      message: `${electrons} π electrons do not fit ${n} orbitals (0…${2 * n}); the atom types contribute ${contributed}`,
    });
  }
  return issues;
}

/**
 * A checked Hückel graph from JSON text or a parsed value.
 * Throws HuckelInputError listing every problem with its atom/bond index.
 */
export function parseHuckelGraph(json: unknown): HuckelGraphInput {
  let value = json;
  if (typeof json === 'string') {
    try {
      value = JSON.parse(json);
    } catch (error) {
      throw new HuckelInputError([{ path: '', message: `not valid JSON (${(error as Error).message})` }]);
    }
  }
  const parsed = huckelGraphSchema.safeParse(value);
  if (!parsed.success) {
    throw new HuckelInputError(parsed.error.issues.map((issue) => ({ path: pathText(issue.path), message: issue.message })));
  }
  const graph = parsed.data as HuckelGraphInput;
  const issues = graphIssues(graph);
  if (issues.length > 0) throw new HuckelInputError(issues);
  return graph;
}
