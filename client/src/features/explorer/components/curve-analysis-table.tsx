import { Num } from '@client/components/ui/num';
import { Table, Td, Th } from '@client/components/ui/table';
import { distanceUnitLabel, energyUnitLabel } from '@shared/chemistry/units';
import { seriesColor, type SeriesKind } from '../lib/plot-colors';
import { distanceQuantity, energyQuantity, formatFixed, type PlotUnits } from '../lib/units';

export interface CurveAnalysisRow {
  id: string;
  label: string;
  kind: SeriesKind;
  /** the colour of its line in the plot beside (default: by kind) */
  color?: string;
  /** null: the curve has no minimum (repulsive) */
  minimum: { reBohr: number; energyHartree: number; deHartree: number; zeta?: number } | null;
  omegaCm1?: number | null;
  limitHartree?: number | null;
}

/**
 * The analysis numbers of curves (Re, E(Re), De, ωe, ζ at Re, the dissociation
 * limit) in the chosen units, the unit written in each column head.
 */
export function CurveAnalysisTable({ rows, units, caption = 'Analysis of the curves' }: { rows: readonly CurveAnalysisRow[]; units: PlotUnits; caption?: string }) {
  const d = distanceUnitLabel[units.distance];
  const e = energyUnitLabel[units.energy];
  const showZeta = rows.some((r) => r.minimum?.zeta !== undefined);
  const showOmega = rows.some((r) => r.omegaCm1 !== undefined);
  const showLimit = rows.some((r) => r.limitHartree !== undefined && r.limitHartree !== null);
  return (
    <Table label={caption} testId="curve-analysis">
      <thead>
        <tr>
          <Th>Curve</Th>
          <Th className="text-right">
            R<sub>e</sub> / {d}
          </Th>
          <Th className="text-right">
            E(R<sub>e</sub>) / {e}
          </Th>
          <Th className="text-right">
            D<sub>e</sub> / {e}
          </Th>
          {showOmega ? (
            <Th className="text-right">
              ω<sub>e</sub> / cm⁻¹
            </Th>
          ) : null}
          {showZeta ? (
            <Th className="text-right">
              ζ at R<sub>e</sub>
            </Th>
          ) : null}
          {showLimit ? <Th className="text-right">Limit / {e}</Th> : null}
        </tr>
      </thead>
      <tbody>
        {rows.map((row, i) => {
          const m = row.minimum;
          const re = distanceQuantity(m?.reBohr, units.distance);
          const em = energyQuantity(m?.energyHartree, units.energy);
          const de = energyQuantity(m?.deHartree, units.energy);
          const limit = energyQuantity(row.limitHartree, units.energy);
          return (
            <tr key={row.id} data-testid={`analysis-row-${row.id}`}>
              <Td>
                <span className="inline-flex items-center gap-2">
                  <span aria-hidden="true" className="inline-block h-0.5 w-4 shrink-0" style={{ backgroundColor: row.color ?? seriesColor(row.kind, kindOrdinal(rows, i)) }} />
                  {row.label}
                </span>
              </Td>
              {m ? (
                <>
                  <Td className="text-right" data-testid={`analysis-re-${row.id}`} data-unit={re.unit}>
                    <Num>{re.text}</Num>
                  </Td>
                  <Td className="text-right">
                    <Num>{em.text}</Num>
                  </Td>
                  <Td className="text-right" data-testid={`analysis-de-${row.id}`}>
                    <Num>{de.text}</Num>
                  </Td>
                </>
              ) : (
                <Td colSpan={3} className="text-graphite" data-testid={`analysis-re-${row.id}`}>
                  no minimum (repulsive)
                </Td>
              )}
              {showOmega ? (
                <Td className="text-right" data-testid={`analysis-omega-${row.id}`}>
                  <Num>{formatFixed(row.omegaCm1 ?? null, 1)}</Num>
                </Td>
              ) : null}
              {showZeta ? (
                <Td className="text-right">
                  <Num>{formatFixed(m?.zeta ?? null, 4)}</Num>
                </Td>
              ) : null}
              {showLimit ? (
                <Td className="text-right">
                  <Num>{limit.text}</Num>
                </Td>
              ) : null}
            </tr>
          );
        })}
      </tbody>
    </Table>
  );
}

function kindOrdinal(rows: readonly CurveAnalysisRow[], index: number): number {
  return rows.slice(0, index).filter((r) => r.kind === rows[index].kind).length;
}
