/** `diagram`: the MO diagram of a diatomic (levels, bond order, magnetism, ground term) as JSON. */
import { z } from 'zod';
import { buildMoDiagram } from '@shared/chemistry/diatomics';
import { CliInputError, type CliCommand } from './command';
import { choiceFlag, numberFlag, parseFlags } from './flags';
import { writeJson } from './output';

const schema = z.object({
  formula: z.string().optional(),
  charge: numberFlag('charge', { integer: true }).optional(),
  order: choiceFlag('order', ['mixed', 'unmixed', 'auto']).optional(),
});

export const diagramCommand: CliCommand = {
  name: 'diagram',
  summary: 'the MO diagram of a diatomic as JSON (levels, bondOrder, magnetism, termSymbol)',
  usage: `diagram --formula O2 [--charge 1] [--order mixed|unmixed]
  --formula <formula>       H2, He2, Li2 … Ne2, CO, CN, NO, BN, BO, CF, NF, BH, CH, NH, OH, HF
                            (a charge may be written in it: O2+, O2^2-)
  --charge <integer>        overall charge (default 0)
  --order mixed|unmixed|auto
                            level order with or without s–p mixing (default auto: Z ≤ 7 mixed)
Prints JSON: levels (label, energyRank, occupancy, …, lowest first), configuration, bondOrder,
unpairedElectrons, magnetism, termSymbol {multiplicity, lambda, parity, reflection, text}, homo, lumo.`,
  options: { formula: { type: 'string' }, charge: { type: 'string' }, order: { type: 'string' } },
  run(values, out) {
    const flags = parseFlags(schema, { formula: values.formula, charge: values.charge, order: values.order });
    if (flags.formula === undefined || flags.formula.trim() === '') throw new CliInputError('--formula is required (e.g. --formula O2)');
    const diagram = buildMoDiagram({ formula: flags.formula.trim(), charge: flags.charge, order: flags.order ?? 'auto' });
    const { multiplicity, lambda, parity, reflection, text } = diagram.termSymbol;
    writeJson(out, {
      formula: diagram.formula,
      species: diagram.species,
      charge: diagram.charge,
      electronCount: diagram.electronCount,
      order: diagram.order,
      levels: diagram.levels.map((level) => ({
        label: level.label,
        labelAscii: level.labelAscii,
        energyRank: level.energyRank,
        occupancy: level.occupancy,
        capacity: level.capacity,
        symmetry: level.symmetry,
        parity: level.parity,
        character: level.character,
        energyEv: level.energyEv,
      })),
      configuration: diagram.configuration,
      configurationAscii: diagram.configurationAscii,
      bondOrder: diagram.bondOrder,
      unpairedElectrons: diagram.unpairedElectrons,
      magnetism: diagram.magnetism,
      termSymbol: { multiplicity, lambda, parity, reflection, text },
      termSymbolAscii: diagram.termSymbolAscii,
      homo: diagram.homoIndex === null ? null : diagram.levels[diagram.homoIndex].label,
      lumo: diagram.lumoIndex === null ? null : diagram.levels[diagram.lumoIndex].label,
      notes: diagram.notes,
    });
  },
};
