/** `minimum`: Re, E(Re), De and ζ(Re) of a model, found on the model itself, as JSON. */
import { curveMinimum, describeCurveModel, dissociationLimit } from '@shared/chemistry/curves';
import { BOHR_ANGSTROM } from '@shared/chemistry/units';
import type { CliCommand } from './command';
import { curveParamsFromFlags, modelOptions, modelUsage } from './model-flags';
import { writeJson } from './output';

export const minimumCommand: CliCommand = {
  name: 'minimum',
  summary: 'the equilibrium of a model as JSON {"re_bohr","energy_hartree","de_ev","zeta"}',
  usage: `minimum --model <model> [--za 1 --zb 1] [--zeta 1|opt] [--state bonding|antibonding]
${modelUsage}
Prints JSON: re_bohr, energy_hartree (total at Re), de_ev (against the dissociation limit of the
same model), zeta (ζ at Re; null for exact), and bound, re_angstrom, de_hartree,
dissociation_limit_hartree, model. A repulsive curve gives bound: false and nulls.`,
  options: { ...modelOptions },
  run(values, out) {
    const params = curveParamsFromFlags(values);
    const minimum = curveMinimum(params);
    const limit = dissociationLimit(params);
    writeJson(out, {
      re_bohr: minimum?.reBohr ?? null,
      energy_hartree: minimum?.energyHartree ?? null,
      de_ev: minimum?.deEv ?? null,
      zeta: minimum?.zeta ?? null,
      bound: minimum !== null,
      re_angstrom: minimum ? minimum.reBohr * BOHR_ANGSTROM : null,
      de_hartree: minimum?.deHartree ?? null,
      dissociation_limit_hartree: limit,
      model: describeCurveModel(params),
    });
  },
};
