/**
 * Seeded randomness for tests: the project's own PRNG (mulberry32, as used for
 * variant draws) and normal deviates from it, so that noisy data can be replayed.
 */
export { mulberry32 } from '@shared/exercises/variants';

/** standard normal deviate by the Box–Muller transform (two uniform draws, in that order) */
export function gaussian(random: () => number): number {
  const u = 1 - random();
  const v = random();
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
}
