/**
 * Our sequential palette for density heat maps: from the paper colour through
 * pale and mid teal to deep ink, monotonic in lightness so that it reads in
 * grey-scale too. Densities are shown on a square-root scale (t = √(ρ/ρmax)):
 * ψ² of 1s functions has sharp cusps at the nuclei that would otherwise leave
 * the bond region blank.
 */
import { PLOT_TOKENS } from './plot-colors';

export const DENSITY_STOPS: readonly [number, string][] = [
  [0, PLOT_TOKENS.paper],
  [0.18, '#d3e6e2'],
  [0.4, '#8fc2bb'],
  [0.62, '#3f9490'],
  [0.82, '#186468'],
  [1, PLOT_TOKENS.ink],
];

function hexToRgb(hex: string): [number, number, number] {
  const n = parseInt(hex.slice(1), 16);
  return [(n >> 16) & 255, (n >> 8) & 255, n & 255];
}

const STOPS_RGB = DENSITY_STOPS.map(([t, hex]) => [t, ...hexToRgb(hex)] as const);

/** Colour at t ∈ [0, 1] (clamped), linear between the stops. */
export function densityColor(t: number): [number, number, number] {
  const x = Math.min(1, Math.max(0, Number.isFinite(t) ? t : 0));
  for (let k = 1; k < STOPS_RGB.length; k++) {
    const [t1, r1, g1, b1] = STOPS_RGB[k];
    if (x <= t1) {
      const [t0, r0, g0, b0] = STOPS_RGB[k - 1];
      const f = (x - t0) / (t1 - t0);
      return [Math.round(r0 + f * (r1 - r0)), Math.round(g0 + f * (g1 - g0)), Math.round(b0 + f * (b1 - b0))];
    }
  }
  const last = STOPS_RGB[STOPS_RGB.length - 1];
  return [last[1], last[2], last[3]];
}

/** Position on the colour scale of a density: √(ρ/ρmax). */
export function densityScale(value: number, max: number): number {
  return max > 0 && value > 0 ? Math.sqrt(Math.min(1, value / max)) : 0;
}

/** The density value at a scale position (inverse of densityScale). */
export function densityAtScale(t: number, max: number): number {
  return max * t * t;
}

/**
 * RGBA pixels of a density grid, row 0 at the top (largest y): density[j][i]
 * is at (x[i], y[j]) with y increasing upwards.
 */
export function densityPixels(density: readonly (readonly number[])[], max: number): Uint8ClampedArray {
  const ny = density.length;
  const nx = ny ? density[0].length : 0;
  const out = new Uint8ClampedArray(nx * ny * 4);
  for (let j = 0; j < ny; j++) {
    const row = density[ny - 1 - j];
    for (let i = 0; i < nx; i++) {
      const [r, g, b] = densityColor(densityScale(row[i], max));
      const p = (j * nx + i) * 4;
      out[p] = r;
      out[p + 1] = g;
      out[p + 2] = b;
      out[p + 3] = 255;
    }
  }
  return out;
}

/** Largest value in a grid. */
export function gridMax(density: readonly (readonly number[])[]): number {
  let m = 0;
  for (const row of density) for (const v of row) if (v > m) m = v;
  return m;
}
