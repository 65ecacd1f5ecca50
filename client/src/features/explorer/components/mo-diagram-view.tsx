import type { MoDiagram } from '@shared/chemistry/diatomics';
import { experimentalConstants } from '@shared/chemistry/diatomics';
import { Num } from '@client/components/ui/num';
import { buildCsv } from '../lib/csv';
import { distanceQuantity, formatFixed, type DistanceUnit } from '../lib/units';
import { distanceToBohr } from '@shared/chemistry/units';
import { formatBondOrder, MoDiagramSvg } from './mo-diagram-svg';
import { PlotFrame } from './plot-frame';

export function moLevelsCsv(d: MoDiagram): string {
  return buildCsv(
    ['level', 'character', 'degeneracy', 'electrons', 'capacity', 'energy sketch / eV', 'correlates with', 'HOMO/LUMO'],
    d.levels.map((l, i) => [
      l.label,
      l.character,
      l.degeneracy,
      l.occupancy,
      l.capacity,
      l.energyEv,
      l.correlations.map((c) => `${c.element} ${c.orbital} (${c.side})`).join('; '),
      i === d.homoIndex && i === d.lumoIndex ? 'HOMO and LUMO' : i === d.homoIndex ? 'HOMO' : i === d.lumoIndex ? 'LUMO' : '',
    ]),
  );
}

/** The diagram in its frame (downloads) beside the answer key: configuration, bond order, unpaired electrons, term, magnetism. */
export function MoDiagramView({ diagram, distanceUnit = 'angstrom', downloads = true }: { diagram: MoDiagram; distanceUnit?: DistanceUnit; downloads?: boolean }) {
  const experimental = diagram.charge === 0 ? experimentalConstants(diagram.formula) : null;
  const re = experimental ? distanceQuantity(distanceToBohr(experimental.reAngstrom, 'angstrom'), distanceUnit) : null;
  return (
    <div className="grid gap-4 xl:grid-cols-[minmax(0,660px)_minmax(0,1fr)]">
      <PlotFrame title={`MO diagram of ${diagram.display}`} csv={() => moLevelsCsv(diagram)} downloads={downloads} testId="mo-diagram-frame">
        <MoDiagramSvg diagram={diagram} />
      </PlotFrame>
      <div className="grid min-w-0 content-start gap-3">
        <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1.5 rounded-[3px] border border-rule bg-sheet px-3 py-2 text-[0.92rem]" data-testid="mo-answers">
          <dt className="text-graphite">Configuration</dt>
          <dd className="[overflow-wrap:anywhere]" data-testid="answer-configuration">
            {diagram.configuration}
          </dd>
          <dt className="text-graphite">Valence form</dt>
          <dd className="[overflow-wrap:anywhere]">{diagram.valenceConfiguration}</dd>
          <dt className="text-graphite">Bond order</dt>
          <dd data-testid="answer-bond-order">
            <Num>{formatBondOrder(diagram.bondOrder)}</Num>{' '}
            <span className="text-[0.85rem] text-graphite">
              ({diagram.bondingElectrons} bonding − {diagram.antibondingElectrons} antibonding)/2
            </span>
          </dd>
          <dt className="text-graphite">Unpaired electrons</dt>
          <dd>
            <Num>{diagram.unpairedElectrons}</Num> <span className="text-graphite">({diagram.magnetism})</span>
          </dd>
          <dt className="text-graphite">Ground term</dt>
          <dd data-testid="answer-term">{diagram.termSymbol.text}</dd>
          {diagram.terms.length > 1 ? (
            <>
              <dt className="text-graphite">All terms</dt>
              <dd>{diagram.terms.map((t) => t.term.text).join(', ')}</dd>
            </>
          ) : null}
          <dt className="text-graphite">Level order</dt>
          <dd className="text-[0.88rem]">{diagram.orderRule}</dd>
          {experimental && re ? (
            <>
              <dt className="text-graphite">Measured</dt>
              <dd>
                r<sub>e</sub> = <Num>{re.text}</Num> {re.unit}, ω<sub>e</sub> = <Num>{formatFixed(experimental.omegaEWavenumber, 1)}</Num> cm⁻¹
                <div className="text-[0.8rem] text-graphite">{experimental.source}</div>
              </dd>
            </>
          ) : null}
        </dl>
        {diagram.notes.length > 0 ? (
          <ul className="list-disc pl-5 text-[0.88rem] text-caution">
            {diagram.notes.map((n) => (
              <li key={n}>{n}</li>
            ))}
          </ul>
        ) : null}
        <p className="text-[0.82rem] text-graphite">Level heights are a qualitative sketch from atomic orbital energies: their order is meaningful, their spacing only roughly.</p>
      </div>
    </div>
  );
}
