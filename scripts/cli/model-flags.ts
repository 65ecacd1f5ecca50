/**
 * Flags shared by `curve`, `minimum` and `point`: which curve model and its
 * parameters, checked with zod and then by validateCurveParams.
 */
import type { ParseArgsConfig } from 'node:util';
import { z } from 'zod';
import { curveModels, curveStates, validateCurveParams, type CurveModelParams } from '@shared/chemistry/curves';
import { CliInputError } from './command';
import { choiceFlag, numberFlag, parseFlags } from './flags';

export const modelOptions = {
  model: { type: 'string' },
  za: { type: 'string' },
  zb: { type: 'string' },
  zeta: { type: 'string' },
  state: { type: 'string' },
} satisfies NonNullable<ParseArgsConfig['options']>;

export const modelUsage = `  --model ${curveModels.join('|')}   (required)
  --za, --zb <charge>       nuclear charges (default 1; must be 1 for h2-*)
  --zeta <number>|opt       orbital exponent, or opt to minimize it at every R (default 1; ignored by exact)
  --state bonding|antibonding
                            default bonding; h2-*: antibonding is the triplet ³Σu⁺; exact: σg/σu`;

const modelSchema = z.object({
  model: choiceFlag('model', curveModels).optional(),
  za: numberFlag('za', { positive: true }).optional(),
  zb: numberFlag('zb', { positive: true }).optional(),
  zeta: z
    .string({ error: '--zeta needs a value' })
    .transform((text, ctx) => {
      if (text.trim().toLowerCase() === 'opt') return 'opt' as const;
      const value = text.trim() === '' ? Number.NaN : Number(text);
      if (!Number.isFinite(value) || value <= 0) {
        ctx.addIssue({ code: 'custom', message: `--zeta must be a number greater than 0 or 'opt', got '${text}'` });
        return z.NEVER;
      }
      return value;
    })
    .optional(),
  state: choiceFlag('state', curveStates).optional(),
});

export function curveParamsFromFlags(values: Record<string, unknown>): CurveModelParams {
  const picked = Object.fromEntries(Object.keys(modelOptions).map((key) => [key, values[key]]));
  const flags = parseFlags(modelSchema, picked);
  if (flags.model === undefined) throw new CliInputError(`--model is required (one of ${curveModels.join(', ')})`);
  const params: CurveModelParams = {
    model: flags.model,
    za: flags.za ?? 1,
    zb: flags.zb ?? 1,
    zeta: flags.zeta ?? 1,
    state: flags.state ?? 'bonding',
  };
  validateCurveParams(params);
  return params;
}
