/**
 * Dispatch of the engine's command line: `<command> [flags]`, flags parsed
 * with node:util parseArgs (strict) and validated with zod inside each command.
 * Exit status: 0 done, 2 bad flags or impossible input (one line on stderr),
 * 1 an unexpected failure (one line on stderr, no stack trace).
 */
import { parseArgs } from 'node:util';
import { commands } from './commands';
import { CliInputError, type CliCommand, type CliOutput } from './command';

export interface CliStreams {
  stdout: CliOutput;
  stderr: CliOutput;
}

const PROGRAM = 'npm run --silent cli --';

export async function overview(): Promise<string> {
  const loaded = await Promise.all(commands.map((entry) => entry.load()));
  const width = Math.max(...loaded.map((c) => c.name.length));
  return [
    `Bondmark engine command line. Atomic units: distances in bohr, energies in hartree.`,
    ``,
    `usage: ${PROGRAM} <command> [flags]`,
    ``,
    `commands:`,
    ...loaded.map((c) => `  ${c.name.padEnd(width)}  ${c.summary}`),
    ``,
    `${PROGRAM} <command> --help   shows the flags of one command.`,
    `Bad flags or impossible input exit with status 2 and one line on stderr.`,
    ``,
  ].join('\n');
}

function oneLine(text: string): string {
  return text.replace(/\s*\n\s*/g, ' ').trim();
}

/** `--r -1` → `--r=-1`, so that a negative number reaches the validation instead of confusing parseArgs. */
function joinNegativeValues(args: string[], command: CliCommand): string[] {
  const out: string[] = [];
  for (let i = 0; i < args.length; i++) {
    const token = args[i];
    const name = token.startsWith('--') && !token.includes('=') ? token.slice(2) : undefined;
    const next = args[i + 1];
    if (name && command.options[name]?.type === 'string' && next !== undefined && /^-(\d|\.\d)/.test(next)) {
      out.push(`${token}=${next}`);
      i++;
    } else out.push(token);
  }
  return out;
}

function flagList(command: CliCommand): string {
  return Object.keys(command.options)
    .map((name) => `--${name}`)
    .join(', ');
}

/** Turns parseArgs' own errors into one clear sentence. */
function parseArgsMessage(error: Error & { code?: string }, command: CliCommand): string {
  const option = /'(-[^' ]+)/.exec(error.message)?.[1];
  switch (error.code) {
    case 'ERR_PARSE_ARGS_UNKNOWN_OPTION':
      return `unknown flag ${option ?? ''} for '${command.name}' (its flags: ${flagList(command)}, --help)`;
    case 'ERR_PARSE_ARGS_INVALID_OPTION_VALUE':
      return option && error.message.includes('argument missing')
        ? `${option} needs a value`
        : option && /does not take an argument/.test(error.message)
          ? `${option} takes no value`
          : oneLine(error.message);
    case 'ERR_PARSE_ARGS_UNEXPECTED_POSITIONAL':
      return `unexpected argument ${/'([^']*)'/.exec(error.message)?.[1] ? `'${/'([^']*)'/.exec(error.message)![1]}'` : ''} for '${command.name}' (flags start with --; see --help)`;
    default:
      return oneLine(error.message);
  }
}

function isInputError(error: unknown): boolean {
  if (error instanceof CliInputError || error instanceof RangeError) return true;
  if (error instanceof Error && error.name === 'HuckelInputError') return true;
  return false;
}

export async function runCli(argv: readonly string[], io: CliStreams): Promise<number> {
  const [name, ...rest] = argv;
  if (name === undefined) {
    io.stderr.write(`error: no command given; commands: ${commands.map((c) => c.name).join(', ')} (see --help)\n`);
    return 2;
  }
  if (name === '--help' || name === '-h' || name === 'help') {
    io.stdout.write(await overview());
    return 0;
  }
  const entry = commands.find((c) => c.name === name);
  if (!entry) {
    io.stderr.write(`error: unknown command '${name}'; commands: ${commands.map((c) => c.name).join(', ')} (see --help)\n`);
    return 2;
  }
  const command = await entry.load();
  let values: Record<string, string | boolean | undefined>;
  let positionals: string[];
  try {
    const parsed = parseArgs({
      args: joinNegativeValues(rest, command),
      options: { ...command.options, help: { type: 'boolean', short: 'h' } },
      strict: true,
      allowPositionals: command.allowPositionals ?? false,
    });
    values = parsed.values as Record<string, string | boolean | undefined>;
    positionals = parsed.positionals;
  } catch (error) {
    io.stderr.write(`error: ${parseArgsMessage(error as Error & { code?: string }, command)}\n`);
    return 2;
  }
  if (values.help) {
    io.stdout.write(`usage: ${PROGRAM} ${command.usage}\n`);
    return 0;
  }
  try {
    await command.run(values, io.stdout, positionals);
    return 0;
  } catch (error) {
    const message = oneLine(error instanceof Error ? error.message : String(error));
    if (isInputError(error)) {
      io.stderr.write(`error: ${message}\n`);
      return 2;
    }
    io.stderr.write(`internal error in '${command.name}': ${message}\n`);
    return 1;
  }
}
