import type { ReadPreview, ReportChoice } from '@shared/api/reports';
import { distanceUnits, energyUnits, type DistanceUnit, type EnergyUnit } from '@shared/chemistry/units';
import { Num } from '@client/components/ui/num';
import { Table, Td, Th } from '@client/components/ui/table';
import { CurvePlot } from '@client/features/explorer/components/curve-plot';
import { CheckboxField, SelectField } from '@client/features/explorer/components/fields';
import { distanceUnitOptionLabel, energyUnitOptionLabel } from '@client/features/explorer/lib/units';
import { formatBytes, toCurveSeries } from '../lib/series';

const sourceWords: Record<string, string> = {
  header: 'from the column header',
  magnitude: 'guessed from the size of the numbers — please check',
  template: 'from your personal template',
  user: 'as you chose',
};

/** The choice the page starts from: what the reader decided. */
export function choiceOf(preview: ReadPreview): ReportChoice | null {
  if (!preview.choice || !preview.units) return null;
  return {
    sheet: preview.choice.sheet,
    distanceColumn: preview.choice.distanceColumn,
    energyColumns: preview.choice.energyColumns,
    distanceUnit: preview.units.distance,
    energyUnit: preview.units.energy,
    convention: preview.convention ?? undefined,
  };
}

/**
 * "What was read": the file, the columns and units Bondmark chose (and why),
 * warnings, the first rows and a plot of the student's own points. The
 * column and unit choices can be corrected; each change reads the file again.
 */
export function ReadBack({ preview, choice, onChange, busy, onBehalf = false }: { preview: ReadPreview; choice: ReportChoice | null; onChange: (choice: ReportChoice) => void; busy: boolean; onBehalf?: boolean }) {
  const table = preview.table;
  const numeric = table?.columns.filter((c) => c.numericCount > 0) ?? [];
  const columnName = (letter: string) => {
    const c = table?.columns.find((x) => x.letter === letter);
    return c?.header ? `${letter} — ${c.header}` : `column ${letter}`;
  };
  const units = preview.units;

  return (
    <section aria-labelledby="read-back-heading" className="flex flex-col gap-4" data-testid="read-back" aria-busy={busy || undefined}>
      <div>
        <h2 id="read-back-heading" className="font-serif text-xl font-semibold">
          What was read
        </h2>
        <p className="text-graphite">
          <span className="font-medium text-ink">{preview.dataFile.fileName}</span> — {preview.dataFile.description}, <Num>{formatBytes(preview.dataFile.sizeBytes)}</Num>
          {table ? (
            <>
              {table.sheet ? <> · sheet “{table.sheet}”</> : null} · <Num>{preview.pointCount}</Num> points
            </>
          ) : null}
          {preview.writeup ? (
            <>
              {' '}
              · write-up <span className="font-medium text-ink">{preview.writeup.fileName}</span> (<Num>{formatBytes(preview.writeup.sizeBytes)}</Num>)
            </>
          ) : null}
        </p>
        {preview.template ? (
          <p className="text-[0.9rem] text-bonding" data-testid="template-recognised">
            Recognised as your personal template (student number <Num>{preview.template.studentNumber}</Num>).
          </p>
        ) : null}
        {onBehalf && preview.enrolment ? (
          <p className="text-[0.85rem] text-graphite">
            For {preview.enrolment.displayName} (<Num>{preview.enrolment.studentNumber}</Num>)
          </p>
        ) : null}
      </div>

      {preview.warnings.length > 0 ? (
        <ul className="flex flex-col gap-1 rounded-[3px] border border-caution/60 bg-sheet px-4 py-2 text-[0.9rem]" aria-label="Warnings" data-testid="read-warnings">
          {preview.warnings.map((w) => (
            <li key={w} className="text-ink">
              <span aria-hidden="true" className="mr-1.5 text-caution">
                ◆
              </span>
              {w}
            </li>
          ))}
        </ul>
      ) : null}

      {choice && units && table ? (
        <fieldset className="grid gap-4 rounded-[3px] border border-rule bg-sheet p-4 md:grid-cols-2" disabled={busy}>
          <legend className="px-1 text-[0.9rem] font-semibold">Columns and units — correct them if they are wrong</legend>
          <SelectField
            label="Distance column"
            value={choice.distanceColumn}
            options={numeric.map((c) => ({ value: c.letter, label: columnName(c.letter) }))}
            onChange={(letter) => onChange({ ...choice, distanceColumn: letter, energyColumns: choice.energyColumns.filter((e) => e !== letter).length ? choice.energyColumns.filter((e) => e !== letter) : choice.energyColumns })}
            testId="distance-column"
          />
          <fieldset className="flex flex-col gap-1">
            <legend className="text-[0.85rem] font-semibold">Energy columns</legend>
            {numeric
              .filter((c) => c.letter !== choice.distanceColumn)
              .map((c) => (
                <CheckboxField
                  key={c.letter}
                  label={columnName(c.letter)}
                  checked={choice.energyColumns.includes(c.letter)}
                  onChange={(checked) => {
                    const next = checked ? [...choice.energyColumns, c.letter].sort() : choice.energyColumns.filter((l) => l !== c.letter);
                    if (next.length > 0) onChange({ ...choice, energyColumns: next });
                  }}
                />
              ))}
          </fieldset>
          <SelectField<DistanceUnit>
            label="Distance unit"
            value={choice.distanceUnit}
            options={distanceUnits.map((u) => ({ value: u, label: distanceUnitOptionLabel[u] }))}
            onChange={(u) => onChange({ ...choice, distanceUnit: u })}
            hint={sourceWords[units.distanceSource]}
            testId="distance-unit"
          />
          <SelectField<EnergyUnit>
            label="Energy unit"
            value={choice.energyUnit}
            options={energyUnits.map((u) => ({ value: u, label: energyUnitOptionLabel[u] }))}
            onChange={(u) => onChange({ ...choice, energyUnit: u })}
            hint={sourceWords[units.energySource]}
            testId="energy-unit"
          />
          <SelectField<'total' | 'relative'>
            label="Energies are"
            value={choice.convention ?? preview.convention ?? 'total'}
            options={[
              { value: 'total', label: 'total energies' },
              { value: 'relative', label: 'relative to the dissociation limit' },
            ]}
            onChange={(c) => onChange({ ...choice, convention: c })}
            testId="energy-convention"
          />
        </fieldset>
      ) : null}

      {table && table.preview.length > 0 ? (
        <Table label="First rows of the table as they are in the file">
          <thead>
            <tr>
              <Th>Row</Th>
              {table.columns.map((c) => (
                <Th key={c.letter}>
                  {c.letter}
                  {c.header ? <span className="ml-1 font-normal">{c.header}</span> : null}
                </Th>
              ))}
            </tr>
          </thead>
          <tbody>
            {table.preview.map((row) => (
              <tr key={row.rowNumber}>
                <Td>
                  <Num>{row.rowNumber}</Num>
                </Td>
                {table.columns.map((c, i) => (
                  <Td key={c.letter}>
                    <Num>{row.cells[i] ?? ''}</Num>
                  </Td>
                ))}
              </tr>
            ))}
          </tbody>
        </Table>
      ) : null}

      {units && preview.series.length > 0 ? (
        <CurvePlot
          series={toCurveSeries(preview.series, units, () => 'student', 'read')}
          units={{ distance: units.distance, energy: units.energy }}
          title="Your points"
          description="Only your own numbers, as read with the choices above."
          downloads={false}
          height={260}
          testId="preview-plot"
        />
      ) : null}

      {preview.answers ? (
        <dl className="grid grid-cols-[max-content_1fr] gap-x-4 gap-y-1 text-[0.9rem]" data-testid="read-answers">
          {Object.entries(preview.answers).map(([name, value]) => (
            <div key={name} className="contents">
              <dt className="text-graphite">{name}</dt>
              <dd>
                <Num>{value === null || value === undefined ? '—' : String(value)}</Num>
              </dd>
            </div>
          ))}
        </dl>
      ) : null}
    </section>
  );
}
