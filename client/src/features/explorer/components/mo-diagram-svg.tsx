import { useMemo } from 'react';
import type { MoDiagram, TermSymbol } from '@shared/chemistry/diatomics';
import { layoutMoDiagram, splitMoLabel } from '../lib/mo-layout';
import { characterColor, PLOT_FONT_FAMILY, PLOT_MONO_FAMILY, PLOT_TOKENS } from '../lib/plot-colors';
import { formatFixed } from '../lib/units';
import { ElectronArrows } from './electron-arrows';

const LAMBDA_GREEK: Record<TermSymbol['lambda'], string> = { Sigma: 'Σ', Pi: 'Π', Delta: 'Δ', Phi: 'Φ', Gamma: 'Γ' };
const SUPERSCRIPT = ['⁰', '¹', '²', '³', '⁴', '⁵', '⁶', '⁷', '⁸', '⁹'];

/** The term symbol as tspans inside a <text>, g/u lowered; its text content reads e.g. "³Σg⁻". */
export function TermSymbolTspans({ term, fontSize = 16 }: { term: TermSymbol; fontSize?: number }) {
  const multiplicity = String(term.multiplicity)
    .split('')
    .map((d) => SUPERSCRIPT[Number(d)])
    .join('');
  const reflection = term.reflection === '+' ? '⁺' : term.reflection === '-' ? '⁻' : '';
  const drop = fontSize * 0.28;
  return (
    <tspan fontSize={fontSize} fill={PLOT_TOKENS.ink} data-testid="term-symbol">
      {multiplicity}
      {LAMBDA_GREEK[term.lambda]}
      {term.parity ? (
        <tspan dy={drop} fontSize={fontSize * 0.72}>
          {term.parity}
        </tspan>
      ) : null}
      {reflection ? <tspan dy={term.parity ? -drop : 0}>{reflection}</tspan> : null}
    </tspan>
  );
}

/** An MO label such as "1πg*" with the parity letter lowered. */
function MoLabel({ label, x, y, color, anchor = 'start' }: { label: string; x: number; y: number; color: string; anchor?: 'start' | 'end' }) {
  const parts = splitMoLabel(label);
  return (
    <text x={x} y={y + 4} fontSize={13} fill={color} textAnchor={anchor} paintOrder="stroke" stroke={PLOT_TOKENS.sheet} strokeWidth={4} strokeLinejoin="round">
      {parts.number}
      {parts.symbol}
      {parts.parity ? (
        <tspan dy={3.5} fontSize={10}>
          {parts.parity}
        </tspan>
      ) : null}
      {parts.star ? <tspan dy={parts.parity ? -3.5 : 0}>*</tspan> : null}
    </text>
  );
}

export interface MoDiagramSvgProps {
  diagram: MoDiagram;
  /** override the visible title line (default: "MO diagram of O₂") */
  title?: string;
  testId?: string;
}

/** A sentence a screen reader hears for the whole diagram. */
export function describeMoDiagram(d: MoDiagram): string {
  const unpaired = d.unpairedElectrons === 1 ? '1 unpaired electron' : `${d.unpairedElectrons} unpaired electrons`;
  return `MO diagram of ${d.display}: configuration ${d.configuration}; ground term ${d.termSymbol.text}; bond order ${formatBondOrder(d.bondOrder)}; ${unpaired}, ${d.magnetism}.`;
}

export function formatBondOrder(order: number): string {
  return Number.isInteger(order) ? String(order) : formatFixed(order, 1);
}

/**
 * The MO correlation diagram of a diatomic, drawn by hand as SVG: atomic
 * levels on both sides, MO levels in the middle (π pairs side by side),
 * dashed correlation lines, electrons as half-arrows, g/u and * labels,
 * HOMO and LUMO tags, bonding levels in the bonding colour and antibonding
 * ones in the antibonding colour, the ground term and bond order underneath.
 * Core (1s) levels sit in a band of their own below a break in the energy axis.
 */
export function MoDiagramSvg({ diagram, title, testId = 'mo-diagram' }: MoDiagramSvgProps) {
  const layout = useMemo(() => layoutMoDiagram(diagram), [diagram]);
  const { width, height, columns, valence, coreBand, footerTop } = layout;
  const homo = diagram.homoIndex;
  const lumo = diagram.lumoIndex;
  const label = describeMoDiagram(diagram);

  return (
    <div className="min-w-0">
      <svg
        viewBox={`0 0 ${width} ${height}`}
        width="100%"
        style={{ maxWidth: width, height: 'auto', display: 'block' }}
        role="img"
        aria-label={label}
        data-testid={testId}
        data-plot-panel
        fontFamily={PLOT_FONT_FAMILY}
        xmlns="http://www.w3.org/2000/svg"
      >
        <title>{label}</title>
        <rect x={0} y={0} width={width} height={height} fill={PLOT_TOKENS.sheet} />

        {/* column heads */}
        <g fontSize={15} fontWeight={600} fill={PLOT_TOKENS.ink} textAnchor="middle">
          <text x={columns.left} y={26}>
            {diagram.atoms.left.element}
          </text>
          <text x={columns.middle} y={26}>
            {title ?? diagram.display}
          </text>
          <text x={columns.right} y={26}>
            {diagram.atoms.right.element}
          </text>
        </g>
        <g fontSize={10.5} fill={PLOT_TOKENS.graphite} textAnchor="middle">
          <text x={columns.left} y={40}>atomic orbitals</text>
          <text x={columns.middle} y={40}>molecular orbitals{diagram.order !== 'fixed' ? ` (${diagram.order === 'mixed' ? 's–p mixed' : 'unmixed'} order)` : ''}</text>
          <text x={columns.right} y={40}>atomic orbitals</text>
        </g>

        {/* energy axis (qualitative) */}
        <g stroke={PLOT_TOKENS.ruleStrong} fill="none">
          <line x1={22} y1={(coreBand?.bottom ?? valence.bottom) + 4} x2={22} y2={valence.top - 6} strokeWidth={1.2} />
          <path d={`M16 ${valence.top + 2}L22 ${valence.top - 8}L28 ${valence.top + 2}`} strokeWidth={1.2} />
        </g>
        <text x={14} y={(valence.top + valence.bottom) / 2} fontSize={11} fill={PLOT_TOKENS.graphite} textAnchor="middle" transform={`rotate(-90 14 ${(valence.top + valence.bottom) / 2})`}>
          energy (qualitative)
        </text>
        {coreBand ? (
          <g data-testid="core-break">
            <rect x={8} y={coreBand.breakY - 7} width={width - 16} height={14} fill={PLOT_TOKENS.sheet} />
            <path
              d={`M14 ${coreBand.breakY + 4}l8 -8l8 8`}
              stroke={PLOT_TOKENS.ruleStrong}
              fill="none"
              strokeWidth={1.2}
            />
            <line x1={40} y1={coreBand.breakY} x2={width - 12} y2={coreBand.breakY} stroke={PLOT_TOKENS.rule} strokeDasharray="2 4" />
            <text x={width - 14} y={coreBand.breakY - 4} fontSize={10.5} fill={PLOT_TOKENS.graphite} textAnchor="end">
              axis broken: core levels far below
            </text>
          </g>
        ) : null}

        {/* correlation lines under everything else */}
        <g strokeDasharray="4 3" strokeWidth={1} stroke={PLOT_TOKENS.ruleStrong} fill="none">
          {layout.lines.map((l, i) => (
            <line key={i} x1={l.x1} y1={l.y1} x2={l.x2} y2={l.y2} />
          ))}
        </g>

        {/* atomic levels */}
        {layout.atomLevels.map((a) => (
          <g key={`${a.side}-${a.orbital}`} data-atomic-level={`${a.side}:${a.orbital}`}>
            {a.bars.map((b, k) => (
              <g key={k}>
                <line x1={b.x1} y1={a.y} x2={b.x2} y2={a.y} stroke={PLOT_TOKENS.ink} strokeWidth={2.2} strokeLinecap="round" />
                <ElectronArrows x1={b.x1} x2={b.x2} y={a.y} spins={a.spins[k] ?? []} color={PLOT_TOKENS.ink} />
              </g>
            ))}
            <text
              x={a.side === 'left' ? a.bars[0].x1 - 8 : a.bars[a.bars.length - 1].x2 + 8}
              y={a.y + 4}
              fontSize={12.5}
              fill={PLOT_TOKENS.graphite}
              textAnchor={a.side === 'left' ? 'end' : 'start'}
            >
              {a.orbital}
            </text>
          </g>
        ))}

        {/* molecular levels */}
        {layout.levels.map((l) => {
          const color = characterColor(l.level.character);
          const left = l.bars[0].x1;
          const right = l.bars[l.bars.length - 1].x2;
          const tag = l.index === homo && l.index === lumo ? 'HOMO/LUMO' : l.index === homo ? 'HOMO' : l.index === lumo ? 'LUMO' : null;
          return (
            <g key={l.index} data-mo-level={l.level.label} data-occupancy={l.level.occupancy}>
              {l.bars.map((b, k) => (
                <g key={k}>
                  <line x1={b.x1} y1={l.y} x2={b.x2} y2={l.y} stroke={color} strokeWidth={2.6} strokeLinecap="round" />
                  <ElectronArrows x1={b.x1} x2={b.x2} y={l.y} spins={l.spins[k] ?? []} color={PLOT_TOKENS.ink} />
                </g>
              ))}
              <MoLabel label={l.level.label} x={right + 9} y={l.y} color={color} />
              {tag ? (
                <text
                  x={left - 9}
                  y={l.y + 4}
                  fontSize={10.5}
                  fontWeight={600}
                  letterSpacing={0.4}
                  fill={PLOT_TOKENS.reference}
                  textAnchor="end"
                  paintOrder="stroke"
                  stroke={PLOT_TOKENS.sheet}
                  strokeWidth={4}
                  strokeLinejoin="round"
                  data-testid={`tag-${tag.toLowerCase().replace('/', '-')}`}
                >
                  {tag}
                </text>
              ) : null}
            </g>
          );
        })}

        {/* footer: term symbol, bond order, configuration, key */}
        <line x1={12} y1={footerTop - 10} x2={width - 12} y2={footerTop - 10} stroke={PLOT_TOKENS.rule} />
        <text x={16} y={footerTop + 11} fontSize={13} fill={PLOT_TOKENS.graphite} data-testid="diagram-summary">
          ground term <TermSymbolTspans term={diagram.termSymbol} />
          {/* an absolute y puts the rest back on the baseline after a lowered g/u */}
          <tspan y={footerTop + 11}> · bond order </tspan>
          <tspan fontFamily={PLOT_MONO_FAMILY} fill={PLOT_TOKENS.ink} data-testid="bond-order">
            {formatBondOrder(diagram.bondOrder)}
          </tspan>
          <tspan> · unpaired electrons </tspan>
          <tspan fontFamily={PLOT_MONO_FAMILY} fill={PLOT_TOKENS.ink}>
            {diagram.unpairedElectrons}
          </tspan>
          <tspan> · {diagram.magnetism}</tspan>
        </text>
        <text x={16} y={footerTop + 32} fontSize={12.5} fill={PLOT_TOKENS.ink} data-testid="configuration">
          {diagram.configuration}
        </text>
        <g fontSize={11.5} fill={PLOT_TOKENS.graphite} transform={`translate(16 ${footerTop + 54})`}>
          <line x1={0} y1={-4} x2={22} y2={-4} stroke={PLOT_TOKENS.bonding} strokeWidth={2.6} />
          <text x={28} y={0}>bonding</text>
          <line x1={92} y1={-4} x2={114} y2={-4} stroke={PLOT_TOKENS.antibonding} strokeWidth={2.6} />
          <text x={120} y={0}>antibonding (*)</text>
          <line x1={222} y1={-4} x2={244} y2={-4} stroke={PLOT_TOKENS.graphite} strokeWidth={2.6} />
          <text x={250} y={0}>nonbonding</text>
          <path d="M340 0V-12l-4.5 6" stroke={PLOT_TOKENS.ink} fill="none" strokeWidth={1.5} />
          <path d="M348 -12V0l4.5 -6" stroke={PLOT_TOKENS.ink} fill="none" strokeWidth={1.5} />
          <text x={360} y={0}>electrons (spin up, down)</text>
        </g>
      </svg>
      <table className="sr-only">
        <caption>Levels of the MO diagram of {diagram.display}, lowest first</caption>
        <thead>
          <tr>
            <th scope="col">Level</th>
            <th scope="col">Character</th>
            <th scope="col">Electrons</th>
            <th scope="col">Correlates with</th>
            <th scope="col">Note</th>
          </tr>
        </thead>
        <tbody>
          {diagram.levels.map((l, i) => (
            <tr key={l.label}>
              <th scope="row">{l.label}</th>
              <td>{l.character}</td>
              <td>
                {l.occupancy} of {l.capacity}
              </td>
              <td>{l.correlations.map((c) => `${c.element} ${c.orbital} (${c.side})`).join(', ')}</td>
              <td>{i === homo && i === lumo ? 'HOMO and LUMO (partly filled)' : i === homo ? 'HOMO' : i === lumo ? 'LUMO' : ''}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
