/** `curve`: a potential-energy curve as CSV, r_bohr,energy_hartree[,zeta] (total energies, full precision). */
import { curve } from '@shared/chemistry/curves';
import { CliInputError, type CliCommand } from './command';
import { parseDistanceRange } from './distance-range';
import { curveParamsFromFlags, modelOptions, modelUsage } from './model-flags';

export const curveCommand: CliCommand = {
  name: 'curve',
  summary: 'a potential-energy curve as CSV (r_bohr,energy_hartree[,zeta])',
  usage: `curve --model <model> [--za 1 --zb 1] [--zeta 1|opt] [--state bonding|antibonding] --r start:end:step
${modelUsage}
  --r start:end:step        distances in bohr, end included (e.g. 0.5:10:0.05)
Prints CSV with the header r_bohr,energy_hartree (plus zeta when ζ is optimized);
energies are total (electronic + nuclear repulsion), hartree, full double precision.`,
  options: { ...modelOptions, r: { type: 'string' } },
  run(values, out) {
    const params = curveParamsFromFlags(values);
    if (typeof values.r !== 'string') throw new CliInputError('--r start:end:step is required (distances in bohr, e.g. 0.5:10:0.05)');
    const distances = parseDistanceRange(values.r);
    const result = curve(params, distances);
    const zetas = result.zeta;
    const lines: string[] = [zetas ? 'r_bohr,energy_hartree,zeta' : 'r_bohr,energy_hartree'];
    for (let i = 0; i < result.distanceBohr.length; i++) {
      const row = `${result.distanceBohr[i]},${result.energyHartree[i]}`;
      lines.push(zetas ? `${row},${zetas[i]}` : row);
    }
    out.write(`${lines.join('\n')}\n`);
  },
};
