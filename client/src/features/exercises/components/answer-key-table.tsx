/**
 * Every variant's answer key in one table: the numbers a marker checks a
 * report against, and the students who hold each variant.
 */
import type { AnswerKey, VariantStudent } from '@shared/api/exercises';
import type { Variant } from '@shared/exercises/variants';
import { Button } from '@client/components/ui/button';
import { Num } from '@client/components/ui/num';
import { Table, Td, Th } from '@client/components/ui/table';

export interface AnswerKeyRow {
  key: string;
  variant: Variant;
  answers: AnswerKey | null;
  error: string | null;
  students?: VariantStudent[];
}

const fixed = (x: number | null | undefined, digits: number) => (x === null || x === undefined || !Number.isFinite(x) ? '—' : x.toFixed(digits).replace('-', '−'));

export function variantLabel(v: Variant): string {
  if (v.family === 'one-electron') return `Za = ${v.za}, Zb = ${v.zb}, ζ = ${v.zeta === 'optimized' ? 'optimized' : v.zeta}`;
  if (v.family === 'two-electron') return `ζ = ${v.zeta === 'optimized' ? 'optimized' : v.zeta}`;
  if (v.family === 'diatomic') return v.species;
  return v.system.kind === 'graph' ? v.system.name : `${v.system.kind} of ${v.system.n}`;
}

function Students({ students }: { students: VariantStudent[] | undefined }) {
  if (!students) return <span className="text-graphite">—</span>;
  if (!students.length) return <span className="text-graphite">none</span>;
  return (
    <details>
      <summary className="cursor-pointer">
        <Num>{students.length}</Num> student{students.length === 1 ? '' : 's'}
      </summary>
      <ul className="mt-1 text-[0.85rem]">
        {students.map((s) => (
          <li key={s.enrolmentId}>
            <Num>{s.studentNumber}</Num> {s.name}
            {s.section ? <span className="text-graphite"> · {s.section}</span> : null}
          </li>
        ))}
      </ul>
    </details>
  );
}

export function AnswerKeyTable({ rows, selectedKey, onPick, showStudents }: { rows: AnswerKeyRow[]; selectedKey?: string; onPick?: (v: Variant) => void; showStudents: boolean }) {
  const family = rows[0]?.variant.family;
  const headers =
    family === 'diatomic'
      ? ['Species', 'Configuration', 'Bond order', 'Unpaired e⁻', 'Term symbol', 'Magnetism']
      : family === 'huckel'
        ? ['Pi system', 'x (E = α + xβ), lowest first', 'E_π / β', 'Delocalization / β', 'HOMO–LUMO gap / |β|']
        : ['Variant', 'Rₑ / a₀', 'Rₑ / Å', 'E(Rₑ) / Eₕ', 'Dₑ / eV', 'ωₑ / cm⁻¹', 'ζ at Rₑ', 'Upper curve'];
  return (
    <Table label="Answer key of every variant" testId="answer-key-table">
      <thead>
        <tr>
          {headers.map((h) => (
            <Th key={h}>{h}</Th>
          ))}
          {showStudents ? <Th>Held by</Th> : null}
          {onPick ? <Th>
            <span className="sr-only">Preview</span>
          </Th> : null}
        </tr>
      </thead>
      <tbody>
        {rows.map((row) => {
          const a = row.answers;
          return (
            <tr key={row.key} data-testid="answer-key-row" data-variant-key={row.key} className={row.key === selectedKey ? 'bg-wash' : 'hover:bg-paper'}>
              <Td className="whitespace-nowrap font-medium">{variantLabel(row.variant)}</Td>
              {row.error || !a ? (
                <Td colSpan={headers.length - 1} className="text-antibonding">
                  {row.error ?? 'no answer key'}
                </Td>
              ) : a.kind === 'curve' ? (
                <>
                  <Td className="text-right"><Num>{fixed(a.reBohr, 4)}</Num></Td>
                  <Td className="text-right"><Num>{fixed(a.reAngstrom, 4)}</Num></Td>
                  <Td className="text-right"><Num>{fixed(a.energyAtReHartree, 6)}</Num></Td>
                  <Td className="text-right"><Num>{fixed(a.deEv, 4)}</Num></Td>
                  <Td className="text-right"><Num>{fixed(a.harmonicWavenumberCm1, 1)}</Num></Td>
                  <Td className="text-right"><Num>{fixed(a.zetaAtRe, 4)}</Num></Td>
                  <Td>{a.antibondingRepulsive === null ? <span className="text-graphite">—</span> : a.antibondingRepulsive ? 'repulsive' : 'has a minimum'}</Td>
                </>
              ) : a.kind === 'diagram' ? (
                <>
                  <Td><Num>{a.configuration}</Num></Td>
                  <Td className="text-right"><Num>{a.bondOrder}</Num></Td>
                  <Td className="text-right"><Num>{a.unpairedElectrons}</Num></Td>
                  <Td><Num>{a.termSymbol}</Num></Td>
                  <Td>{a.magnetism}</Td>
                </>
              ) : (
                <>
                  <Td><Num>{a.x.map((x) => fixed(x, 4)).join(', ')}</Num></Td>
                  <Td className="text-right"><Num>{fixed(a.piEnergyBeta, 4)}</Num></Td>
                  <Td className="text-right"><Num>{fixed(a.delocalizationBeta, 4)}</Num></Td>
                  <Td className="text-right"><Num>{fixed(a.homoLumoGapBeta, 4)}</Num></Td>
                </>
              )}
              {showStudents ? <Td><Students students={row.students} /></Td> : null}
              {onPick ? (
                <Td>
                  <Button size="sm" variant="quiet" onClick={() => onPick(row.variant)} aria-label={`Preview ${variantLabel(row.variant)}`}>
                    Preview
                  </Button>
                </Td>
              ) : null}
            </tr>
          );
        })}
      </tbody>
    </Table>
  );
}
