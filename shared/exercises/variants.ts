/**
 * Drawing each student's variant: deterministic from the exercise's seed and
 * the student's number, so that the same pair always gives the same variant
 * and a lecturer can reproduce any student's reference.
 *
 * PRNG: mulberry32 (T. Ettinger, public domain) seeded by a 32-bit FNV-1a hash
 * (Fowler–Noll–Vo, IETF draft-eastlake-fnv) of "seed|student".
 */
import type { HuckelSystem, ModelSpec, NumberChoice } from './spec';

export function fnv1a32(text: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) {
    h ^= text.charCodeAt(i);
    h = Math.imul(h, 0x01000193);
  }
  return h >>> 0;
}

export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const clean = (x: number) => Math.round(x * 1e10) / 1e10;

/** Every value a choice can take, in order. */
export function choiceValues(choice: NumberChoice): number[] {
  if (choice.kind === 'fixed') return [choice.value];
  if (choice.kind === 'list') return choice.values;
  const n = Math.floor((choice.max - choice.min) / choice.step + 1e-9);
  return Array.from({ length: n + 1 }, (_, k) => clean(choice.min + k * choice.step));
}

function pick<T>(values: T[], random: () => number): T {
  return values[Math.min(values.length - 1, Math.floor(random() * values.length))];
}

export type Variant =
  | { family: 'one-electron'; key: string; za: number; zb: number; zeta: number | 'optimized' }
  | { family: 'two-electron'; key: string; zeta: number | 'optimized' }
  | { family: 'diatomic'; key: string; species: string }
  | { family: 'huckel'; key: string; systemIndex: number; system: HuckelSystem };

export function huckelSystemLabel(s: HuckelSystem): string {
  return s.kind === 'graph' ? s.name : `${s.kind} of ${s.n}`;
}

const fmt = (x: number) => String(clean(x));

/** The variant of one student (identified by any stable key, e.g. the student number). */
export function drawVariant(model: ModelSpec, seed: string, studentKey: string): Variant {
  const random = mulberry32(fnv1a32(`${seed}|${studentKey}`));
  switch (model.family) {
    case 'one-electron': {
      const za = pick(choiceValues(model.za), random);
      const zb = pick(choiceValues(model.zb), random);
      const zeta = model.zeta.kind === 'optimized' ? 'optimized' : pick(choiceValues(model.zeta), random);
      return { family: 'one-electron', key: `za=${fmt(za)};zb=${fmt(zb)};zeta=${zeta === 'optimized' ? 'opt' : fmt(zeta)}`, za, zb, zeta };
    }
    case 'two-electron': {
      const zeta = model.zeta.kind === 'optimized' ? 'optimized' : pick(choiceValues(model.zeta), random);
      return { family: 'two-electron', key: `zeta=${zeta === 'optimized' ? 'opt' : fmt(zeta)}`, zeta };
    }
    case 'diatomic': {
      const species = pick(model.species, random);
      return { family: 'diatomic', key: `species=${species}`, species };
    }
    case 'huckel': {
      const systemIndex = Math.floor(random() * model.systems.length) % model.systems.length;
      const system = model.systems[systemIndex];
      return { family: 'huckel', key: `system=${systemIndex}:${huckelSystemLabel(system)}`, systemIndex, system };
    }
  }
}

/** Every distinct variant the model can produce (for the answer-key table), capped. */
export function allVariants(model: ModelSpec, cap = 500): Variant[] {
  const out: Variant[] = [];
  const push = (v: Variant) => {
    if (out.length < cap) out.push(v);
  };
  switch (model.family) {
    case 'one-electron': {
      const zetas: (number | 'optimized')[] = model.zeta.kind === 'optimized' ? ['optimized'] : choiceValues(model.zeta);
      for (const za of choiceValues(model.za))
        for (const zb of choiceValues(model.zb))
          for (const zeta of zetas) push({ family: 'one-electron', key: `za=${fmt(za)};zb=${fmt(zb)};zeta=${zeta === 'optimized' ? 'opt' : fmt(zeta)}`, za, zb, zeta });
      break;
    }
    case 'two-electron': {
      const zetas: (number | 'optimized')[] = model.zeta.kind === 'optimized' ? ['optimized'] : choiceValues(model.zeta);
      for (const zeta of zetas) push({ family: 'two-electron', key: `zeta=${zeta === 'optimized' ? 'opt' : fmt(zeta)}`, zeta });
      break;
    }
    case 'diatomic':
      for (const species of model.species) push({ family: 'diatomic', key: `species=${species}`, species });
      break;
    case 'huckel':
      model.systems.forEach((system, systemIndex) => push({ family: 'huckel', key: `system=${systemIndex}:${huckelSystemLabel(system)}`, systemIndex, system }));
      break;
  }
  return out;
}

/** The R grid in its own unit, point by point (inclusive of the end within rounding). */
export function gridValues(grid: { start: number; end: number; step: number }): number[] {
  const n = Math.floor((grid.end - grid.start) / grid.step + 1e-9);
  return Array.from({ length: n + 1 }, (_, k) => clean(grid.start + k * grid.step));
}
