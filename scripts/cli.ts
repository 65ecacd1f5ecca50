/**
 * Entry of the engine's command line: `npm run --silent cli -- <command> [flags]`.
 * Commands live in scripts/cli/ (one file each, registered in scripts/cli/commands.ts).
 */
import { runCli } from './cli/run';

// a reader that stops early (| head) closes the pipe: that is not an error
process.stdout.on('error', (error: NodeJS.ErrnoException) => {
  if (error.code === 'EPIPE') process.exit(process.exitCode ?? 0);
  throw error;
});

process.exitCode = await runCli(process.argv.slice(2), {
  stdout: { write: (text) => void process.stdout.write(text) },
  stderr: { write: (text) => void process.stderr.write(text) },
});
