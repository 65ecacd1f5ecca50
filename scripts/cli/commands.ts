/**
 * The table of commands. A new command is one file exporting a CliCommand and
 * one line here. Each is loaded only when asked for, so that `curve` does not
 * pay for loading the Hückel code (and the other way round).
 */
import type { CliCommand } from './command';

export interface CommandEntry {
  name: string;
  load: () => Promise<CliCommand>;
}

export const commands: readonly CommandEntry[] = [
  { name: 'curve', load: async () => (await import('./curve')).curveCommand },
  { name: 'minimum', load: async () => (await import('./minimum')).minimumCommand },
  { name: 'point', load: async () => (await import('./point')).pointCommand },
  { name: 'diagram', load: async () => (await import('./diagram')).diagramCommand },
  { name: 'huckel', load: async () => (await import('./huckel')).huckelCommand },
  { name: 'mark', load: async () => (await import('./mark')).markCommand },
];
