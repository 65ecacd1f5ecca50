/**
 * zod helpers for command-line flags (parseArgs hands over strings): numbers,
 * integers, choices, and one-line messages naming the flag.
 */
import { z } from 'zod';
import { CliInputError } from './command';

/** a flag's text that must be a finite number */
export function numberFlag(flag: string, check?: { positive?: boolean; integer?: boolean }) {
  return z.string({ error: `--${flag} needs a value` }).transform((text, ctx) => {
    const value = text.trim() === '' ? Number.NaN : Number(text);
    const kind = check?.integer ? 'a whole number' : 'a number';
    if (!Number.isFinite(value) || (check?.integer && !Number.isInteger(value))) {
      ctx.addIssue({ code: 'custom', message: `--${flag} must be ${kind}, got '${text}'` });
      return z.NEVER;
    }
    if (check?.positive && !(value > 0)) {
      ctx.addIssue({ code: 'custom', message: `--${flag} must be greater than 0, got ${text}` });
      return z.NEVER;
    }
    return value;
  });
}

/** a flag whose text must be one of `choices` */
export function choiceFlag<const T extends readonly [string, ...string[]]>(flag: string, choices: T) {
  return z.enum(choices, { error: (issue) => `--${flag} must be one of ${choices.join(', ')}, got '${String(issue.input)}'` });
}

/** parse flag values with a zod schema; the first issue becomes a CliInputError */
export function parseFlags<T extends z.ZodType>(schema: T, values: unknown): z.output<T> {
  const parsed = schema.safeParse(values);
  if (parsed.success) return parsed.data;
  const issue = parsed.error.issues[0];
  const flag = issue.path.length > 0 ? `--${String(issue.path[0])}` : '';
  const message = issue.message.startsWith('--') || flag === '' ? issue.message : `${flag}: ${issue.message}`;
  throw new CliInputError(message);
}
