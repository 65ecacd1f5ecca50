import { useMemo } from 'react';
import type { HuckelResult } from '@shared/chemistry/huckel';
import { Table, Td, Th } from '@client/components/ui/table';
import { Num } from '@client/components/ui/num';
import { buildCsv } from '../lib/csv';
import { formatAlphaBeta, layoutHuckel } from '../lib/huckel-layout';
import { characterColor, PLOT_FONT_FAMILY, PLOT_MONO_FAMILY, PLOT_TOKENS } from '../lib/plot-colors';
import { formatFixed } from '../lib/units';
import { ElectronArrows } from './electron-arrows';
import { PlotFrame } from './plot-frame';

export function describeHuckel(result: HuckelResult, name: string): string {
  const levels = result.degenerateSets
    .map((s) => `${formatAlphaBeta(s.x)}${s.indices.length > 1 ? ` (×${s.indices.length})` : ''}`)
    .join(', ');
  return `Hückel levels of ${name}, lowest first: ${levels}. ${result.electronCount} π electrons; total π energy ${result.electronCount}α + ${formatFixed(result.totalPiEnergyBeta, 3)}β.`;
}

/** The levels at α + xβ as an SVG diagram: degenerate sets side by side, half-arrow electrons, HOMO/LUMO tags. */
export function HuckelLevelsSvg({ result, name }: { result: HuckelResult; name: string }) {
  const layout = useMemo(() => layoutHuckel(result), [result]);
  const alphaY = layout.sets.find((s) => Math.abs(s.x) < 1e-9)?.y ?? layout.alphaY;
  const label = describeHuckel(result, name);
  return (
    <svg
      viewBox={`0 0 ${layout.width} ${layout.height}`}
      width="100%"
      style={{ maxWidth: layout.width, height: 'auto', display: 'block' }}
      role="img"
      aria-label={label}
      data-plot-panel
      data-testid="huckel-levels"
      fontFamily={PLOT_FONT_FAMILY}
      xmlns="http://www.w3.org/2000/svg"
    >
      <title>{label}</title>
      <rect x={0} y={0} width={layout.width} height={layout.height} fill={PLOT_TOKENS.sheet} />
      <text x={layout.centre} y={18} fontSize={13} fontWeight={600} fill={PLOT_TOKENS.ink} textAnchor="middle">
        {name}: E = α + xβ (β &lt; 0)
      </text>
      <line x1={30} y1={layout.bottom} x2={30} y2={layout.top} stroke={PLOT_TOKENS.ruleStrong} strokeWidth={1.2} />
      <path d={`M24 ${layout.top + 10}L30 ${layout.top}L36 ${layout.top + 10}`} stroke={PLOT_TOKENS.ruleStrong} fill="none" strokeWidth={1.2} />
      <text x={18} y={(layout.top + layout.bottom) / 2} fontSize={11} fill={PLOT_TOKENS.graphite} textAnchor="middle" transform={`rotate(-90 18 ${(layout.top + layout.bottom) / 2})`}>
        energy
      </text>
      {alphaY >= layout.top && alphaY <= layout.bottom ? (
        <g>
          <line x1={40} y1={alphaY} x2={layout.width - 12} y2={alphaY} stroke={PLOT_TOKENS.rule} strokeDasharray="3 4" />
          <text x={44} y={alphaY - 4} fontSize={11} fill={PLOT_TOKENS.graphite}>
            α
          </text>
        </g>
      ) : null}
      {layout.sets.map((s, k) => {
        const color = characterColor(s.character);
        const left = s.bars[0].x1;
        const right = s.bars[s.bars.length - 1].x2;
        const tag = s.homo && s.lumo ? 'HOMO/LUMO' : s.homo ? 'HOMO' : s.lumo ? 'LUMO' : null;
        return (
          <g key={k} data-huckel-level={s.x.toFixed(4)} data-electrons={s.electrons}>
            {s.bars.map((b, i) => (
              <g key={i}>
                <line x1={b.x1} y1={s.y} x2={b.x2} y2={s.y} stroke={color} strokeWidth={2.6} strokeLinecap="round" />
                <ElectronArrows x1={b.x1} x2={b.x2} y={s.y} spins={s.spins[i] ?? []} color={PLOT_TOKENS.ink} />
              </g>
            ))}
            <text x={right + 10} y={s.y + 4} fontSize={12.5} fill={color} fontFamily={PLOT_MONO_FAMILY}>
              {formatAlphaBeta(s.x)}
            </text>
            {tag ? (
              <text x={left - 10} y={s.y + 4} fontSize={10.5} fontWeight={600} fill={PLOT_TOKENS.reference} textAnchor="end">
                {tag}
              </text>
            ) : null}
          </g>
        );
      })}
      <text x={40} y={layout.bottom + 26} fontSize={12} fill={PLOT_TOKENS.ink}>
        <tspan fill={PLOT_TOKENS.graphite}>π electrons </tspan>
        <tspan fontFamily={PLOT_MONO_FAMILY}>{result.electronCount}</tspan>
        <tspan fill={PLOT_TOKENS.graphite}> · E</tspan>
        <tspan fill={PLOT_TOKENS.graphite} dy={3} fontSize={9}>
          π
        </tspan>
        <tspan dy={-3} fill={PLOT_TOKENS.graphite}>
          {' '}
          ={' '}
        </tspan>
        <tspan fontFamily={PLOT_MONO_FAMILY}>
          {result.electronCount}α + {formatFixed(result.totalPiEnergyBeta, 3)}β
        </tspan>
      </text>
    </svg>
  );
}

export function huckelLevelsCsv(result: HuckelResult): string {
  const atoms = result.atoms.map((a) => `c(${a.label})`);
  return buildCsv(
    ['orbital', 'x (E = alpha + x beta)', 'occupancy', 'degeneracy', 'character', ...atoms],
    result.orbitals.map((o) => [o.index + 1, o.x, o.occupancy, o.degeneracy, o.character, ...o.coefficients]),
  );
}

function Signed({ value, decimals = 3 }: { value: number; decimals?: number }) {
  return <Num>{formatFixed(value, decimals)}</Num>;
}

/** Levels diagram with its downloads, then the coefficient table, charges, bond orders and totals. */
export function HuckelView({ result, name, downloads = true }: { result: HuckelResult; name: string; downloads?: boolean }) {
  return (
    <div className="grid gap-4">
      <div className="grid gap-4 xl:grid-cols-[minmax(0,440px)_minmax(0,1fr)]">
        <PlotFrame title={`Hückel levels of ${name}`} csv={() => huckelLevelsCsv(result)} downloads={downloads} testId="huckel-levels-frame">
          <HuckelLevelsSvg result={result} name={name} />
        </PlotFrame>
        <div className="grid content-start gap-3">
          <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 rounded-[3px] border border-rule bg-sheet px-3 py-2 text-[0.92rem]" data-testid="huckel-totals">
            <dt className="text-graphite">π electrons</dt>
            <dd>
              <Num>{result.electronCount}</Num>
            </dd>
            <dt className="text-graphite">Total π energy</dt>
            <dd>
              <Num>
                {result.electronCount}α + {formatFixed(result.totalPiEnergyBeta, 4)}β
              </Num>
            </dd>
            <dt className="text-graphite">Delocalization energy</dt>
            <dd>
              <Num>{formatFixed(result.delocalizationEnergyBeta, 4)}β</Num>{' '}
              <span className="text-[0.85rem] text-graphite">
                against {result.localizedReference.doubleBonds.length} isolated π bond{result.localizedReference.doubleBonds.length === 1 ? '' : 's'}
              </span>
            </dd>
            <dt className="text-graphite">HOMO–LUMO gap</dt>
            <dd>{result.homoLumoGapBeta === null ? <span className="text-graphite">none</span> : <Num>{formatFixed(result.homoLumoGapBeta, 4)}|β|</Num>}</dd>
            <dt className="text-graphite">Unpaired electrons</dt>
            <dd>
              <Num>{result.unpairedElectrons}</Num>
            </dd>
          </dl>
          {result.notes.length > 0 ? (
            <ul className="list-disc pl-5 text-[0.88rem] text-graphite">
              {result.notes.map((n) => (
                <li key={n}>{n}</li>
              ))}
            </ul>
          ) : null}
          <div className="grid gap-3 md:grid-cols-2">
            <Table label={`π charges of ${name}`} testId="huckel-charges">
              <thead>
                <tr>
                  <Th>Atom</Th>
                  <Th className="text-right">π density q</Th>
                  <Th className="text-right">Net charge</Th>
                </tr>
              </thead>
              <tbody>
                {result.atoms.map((a, i) => (
                  <tr key={i}>
                    <Td>
                      {a.label}
                    </Td>
                    <Td className="text-right">
                      <Signed value={result.piElectronDensity[i]} />
                    </Td>
                    <Td className="text-right">
                      <Signed value={result.netCharges[i]} />
                    </Td>
                  </tr>
                ))}
              </tbody>
            </Table>
            <Table label={`π bond orders of ${name}`} testId="huckel-bond-orders">
              <thead>
                <tr>
                  <Th>Bond</Th>
                  <Th className="text-right">π bond order</Th>
                </tr>
              </thead>
              <tbody>
                {result.bondOrders.map((b) => (
                  <tr key={`${b.from}-${b.to}`}>
                    <Td>
                      {result.atoms[b.from].label}–{result.atoms[b.to].label}
                    </Td>
                    <Td className="text-right">
                      <Signed value={b.order} />
                    </Td>
                  </tr>
                ))}
              </tbody>
            </Table>
          </div>
        </div>
      </div>
      <Table label={`Hückel coefficients of ${name}`} testId="huckel-coefficients">
        <thead>
          <tr>
            <Th>Orbital</Th>
            <Th>Energy</Th>
            <Th className="text-right">Electrons</Th>
            {result.atoms.map((a, i) => (
              <Th key={i} className="text-right">
                c({a.label})
              </Th>
            ))}
          </tr>
        </thead>
        <tbody>
          {result.orbitals.map((o) => (
            <tr key={o.index} className={o.index === result.homoIndex || o.index === result.lumoIndex ? 'bg-wash' : undefined}>
              <Td>
                <Num>ψ{o.index + 1}</Num>
                {o.index === result.homoIndex ? <span className="ml-1 text-[0.8rem] font-semibold text-reference">HOMO</span> : null}
                {o.index === result.lumoIndex ? <span className="ml-1 text-[0.8rem] font-semibold text-reference">LUMO</span> : null}
              </Td>
              <Td className="whitespace-nowrap">
                <Num>{formatAlphaBeta(o.x)}</Num>
              </Td>
              <Td className="text-right">
                <Num>{formatFixed(o.occupancy, Number.isInteger(o.occupancy) ? 0 : 3)}</Num>
              </Td>
              {o.coefficients.map((c, i) => (
                <Td key={i} className="text-right">
                  <Signed value={c} />
                </Td>
              ))}
            </tr>
          ))}
        </tbody>
      </Table>
    </div>
  );
}
