/**
 * Plot colours as literal values, so that a downloaded SVG or PNG looks the
 * same outside the page (CSS variables do not travel with a serialized SVG).
 * The values are the tokens of client/src/styles.css (their contrast ratios are
 * listed there); keep the two in step.
 */
export const PLOT_TOKENS = {
  paper: '#f7f6f2',
  sheet: '#fcfbf8',
  wash: '#efede6',
  ink: '#1d2433',
  rule: '#d9d6cc',
  ruleStrong: '#82807a',
  graphite: '#5b6272',
  bonding: '#0e7679',
  antibonding: '#b0462a',
  reference: '#2b4fb3',
  student: '#7a3fa0',
  caution: '#8b5f10',
} as const;

export const PLOT_FONT_FAMILY = "'Source Sans 3', 'Source Sans Pro', system-ui, sans-serif";
export const PLOT_MONO_FAMILY = "'IBM Plex Mono', ui-monospace, 'DejaVu Sans Mono', monospace";

export type SeriesKind = 'reference' | 'student' | 'bonding' | 'antibonding' | 'other';

/**
 * Shades per kind: the first series of a kind takes the token itself; further
 * ones take a darker shade (every shade keeps ≥ 3:1 against paper, WCAG 1.4.11).
 */
const SHADES: Record<SeriesKind, readonly string[]> = {
  reference: ['#2b4fb3', '#1b2f6b', '#4a63a8'],
  student: ['#7a3fa0', '#4f2768'],
  bonding: ['#0e7679', '#0a4f51'],
  antibonding: ['#b0462a', '#7a2f1c'],
  other: ['#5b6272', '#8b5f10', '#1d2433'],
};

/** The colour of the `ordinal`-th series (0-based) of one kind. */
export function seriesColor(kind: SeriesKind, ordinal = 0): string {
  const shades = SHADES[kind];
  return shades[ordinal % shades.length];
}

/** Colours for a list of series: each kind counts its own members. */
export function assignSeriesColors(kinds: readonly SeriesKind[]): string[] {
  const seen = new Map<SeriesKind, number>();
  return kinds.map((kind) => {
    const n = seen.get(kind) ?? 0;
    seen.set(kind, n + 1);
    return seriesColor(kind, n);
  });
}

/** Level colours of MO and Hückel diagrams by character. */
export function characterColor(character: 'bonding' | 'antibonding' | 'nonbonding'): string {
  return character === 'bonding' ? PLOT_TOKENS.bonding : character === 'antibonding' ? PLOT_TOKENS.antibonding : PLOT_TOKENS.graphite;
}
