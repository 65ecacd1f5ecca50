/** `point`: the energy of one model at one distance, as JSON. */
import { curvePoint, describeCurveModel } from '@shared/chemistry/curves';
import { CliInputError, type CliCommand } from './command';
import { parseDistance } from './distance-range';
import { curveParamsFromFlags, modelOptions, modelUsage } from './model-flags';
import { writeJson } from './output';

export const pointCommand: CliCommand = {
  name: 'point',
  summary: 'the energy at one distance as JSON {"energy_hartree","electronic_hartree"}',
  usage: `point --model <model> [--za 1 --zb 1] [--zeta 1|opt] [--state bonding|antibonding] --r 2.0
${modelUsage}
  --r <distance>            bohr, > 0
Prints JSON: energy_hartree (total), electronic_hartree, r_bohr, zeta (the optimized ζ, or the
fixed one; null for exact), model.`,
  options: { ...modelOptions, r: { type: 'string' } },
  run(values, out) {
    const params = curveParamsFromFlags(values);
    if (typeof values.r !== 'string') throw new CliInputError('--r <distance in bohr> is required (e.g. --r 2.0)');
    const distanceBohr = parseDistance(values.r);
    const point = curvePoint(params, distanceBohr);
    writeJson(out, {
      energy_hartree: point.energyHartree,
      electronic_hartree: point.electronicHartree,
      r_bohr: distanceBohr,
      zeta: params.model === 'exact' ? null : (point.zeta ?? params.zeta),
      model: describeCurveModel(params),
    });
  },
};
