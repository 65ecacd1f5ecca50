/** `huckel`: a Hückel pi system (chain, ring or graph file) as JSON. */
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { z } from 'zod';
import { huckelChain, huckelGraph, huckelRing, parseHuckelGraph, type HuckelResult } from '@shared/chemistry/huckel';
import { CliInputError, type CliCommand } from './command';
import { numberFlag, parseFlags } from './flags';
import { writeJson } from './output';

const schema = z.object({
  chain: numberFlag('chain', { integer: true, positive: true }).optional(),
  ring: numberFlag('ring', { integer: true, positive: true }).optional(),
  graph: z.string().optional(),
  charge: numberFlag('charge', { integer: true }).optional(),
});

function readGraph(path: string): HuckelResult {
  let text: string;
  try {
    // npm run starts scripts in the package root; INIT_CWD is where the user typed the command
    text = readFileSync(resolve(process.env.INIT_CWD ?? process.cwd(), path), 'utf8');
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    const reason = code === 'ENOENT' ? 'no such file' : code === 'EISDIR' ? 'it is a directory' : (error as Error).message;
    throw new CliInputError(`cannot read graph file '${path}': ${reason}`);
  }
  return huckelGraph(parseHuckelGraph(text));
}

export const huckelCommand: CliCommand = {
  name: 'huckel',
  summary: 'a Hückel pi system as JSON (x, piEnergyBeta, delocalizationBeta, homoLumoGapBeta)',
  usage: `huckel --chain 4 | --ring 6 | --graph file.json   [--charge 1 with --chain/--ring]
  --chain <n>               linear polyene of n carbons
  --ring <n>                monocyclic ring of n carbons (n ≥ 3)
  --graph <file.json>       {"atoms": ["C", "N-pyridine", …], "bonds": [[0, 1], …], "charge"?: 0}
  --charge <integer>        pi charge for --chain/--ring (allyl cation: --chain 3 --charge 1)
Prints JSON: x (E = α + xβ, descending), occupancies, piEnergyBeta, delocalizationBeta,
homoLumoGapBeta, unpairedElectrons, piCharges, bondOrders, orbitals (x, occupancy, coefficients).`,
  options: { chain: { type: 'string' }, ring: { type: 'string' }, graph: { type: 'string' }, charge: { type: 'string' } },
  run(values, out) {
    const flags = parseFlags(schema, { chain: values.chain, ring: values.ring, graph: values.graph, charge: values.charge });
    const given = (['chain', 'ring', 'graph'] as const).filter((key) => flags[key] !== undefined);
    if (given.length !== 1) {
      throw new CliInputError(
        given.length === 0 ? 'give one of --chain <n>, --ring <n> or --graph <file.json>' : `give only one of --chain, --ring, --graph (got --${given.join(', --')})`,
      );
    }
    if (flags.graph !== undefined && flags.charge !== undefined) {
      throw new CliInputError('--charge goes with --chain or --ring; for --graph write "charge" in the file');
    }
    const options = flags.charge === undefined ? {} : { charge: flags.charge };
    const result =
      flags.chain !== undefined ? huckelChain(flags.chain, options) : flags.ring !== undefined ? huckelRing(flags.ring, options) : readGraph(flags.graph!);
    writeJson(out, {
      name: result.name,
      atomCount: result.atomCount,
      electronCount: result.electronCount,
      charge: result.charge,
      x: [...result.xValues].sort((a, b) => b - a),
      occupancies: result.orbitals.map((orbital) => orbital.occupancy),
      piEnergyBeta: result.totalPiEnergyBeta,
      delocalizationBeta: result.delocalizationEnergyBeta,
      homoLumoGapBeta: result.homoLumoGapBeta,
      unpairedElectrons: result.unpairedElectrons,
      piCharges: result.netCharges,
      bondOrders: result.bondOrders,
      orbitals: result.orbitals.map((orbital) => ({ x: orbital.x, occupancy: orbital.occupancy, coefficients: orbital.coefficients })),
      notes: result.notes,
    });
  },
};
