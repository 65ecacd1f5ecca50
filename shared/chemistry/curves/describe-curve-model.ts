/** A short human label of a curve model and its parameters, e.g. "LCAO, Za = 1, Zb = 1, ζ optimized, bonding (σg)". */
import { isH2Model } from './model-mapping';
import type { CurveModelParams } from './types';
import { validateCurveParams } from './validate-curve-params';

const H2_NAMES = { 'h2-mo': 'H2 simple MO', 'h2-ci': 'H2 MO with CI', 'h2-vb': 'H2 valence bond (Heitler–London)' } as const;

export function describeCurveModel(p: CurveModelParams): string {
  validateCurveParams(p);
  const zetaText = p.zeta === 'opt' ? 'ζ optimized' : `ζ = ${p.zeta}`;
  if (isH2Model(p.model)) {
    const state = p.state === 'bonding' ? 'ground state (¹Σg⁺)' : 'triplet (³Σu⁺)';
    return `${H2_NAMES[p.model]}, ${zetaText}, ${state}`;
  }
  const homonuclear = p.za === p.zb;
  const charges = `Za = ${p.za}, Zb = ${p.zb}`;
  if (p.model === 'exact') {
    const state = !homonuclear ? 'lowest state (1sσ)' : p.state === 'bonding' ? 'σg (1sσg)' : 'σu (2pσu)';
    return `exact one-electron, ${charges}, ${state}`;
  }
  const state = homonuclear ? (p.state === 'bonding' ? 'bonding (σg)' : 'antibonding (σu)') : p.state;
  return `LCAO, ${charges}, ${zetaText}, ${state}`;
}
