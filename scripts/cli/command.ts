/**
 * The shape of one command of the engine's command line. A command is one file
 * exporting a `CliCommand`, registered in `commands.ts`.
 */
import type { ParseArgsConfig } from 'node:util';

export type FlagValues = Record<string, string | boolean | undefined>;

export interface CliOutput {
  /** writes text to standard output as it is (add the newline yourself) */
  write(text: string): void;
}

export interface CliCommand {
  name: string;
  /** one line for the overview */
  summary: string;
  /** usage lines and flag descriptions for `<command> --help` */
  usage: string;
  /** node:util parseArgs options (string or boolean flags); `help` is added for every command */
  options: NonNullable<ParseArgsConfig['options']>;
  /** whether bare arguments (e.g. file names) are accepted; default false */
  allowPositionals?: boolean;
  /** validates `values` (zod) and writes the result; throws CliInputError/RangeError for bad input */
  run(values: FlagValues, out: CliOutput, positionals: string[]): void | Promise<void>;
}

/** Bad flags or impossible input: exit status 2 and the message as one line on stderr. */
export class CliInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'CliInputError';
  }
}
