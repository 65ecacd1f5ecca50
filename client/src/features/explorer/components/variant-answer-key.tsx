import { useEffect, useMemo, useState } from 'react';
import type { Reference } from '@shared/exercises/reference';
import type { ModelSpec } from '@shared/exercises/spec';
import { allVariants, type Variant } from '@shared/exercises/variants';
import { Button } from '@client/components/ui/button';
import { Num } from '@client/components/ui/num';
import { Table, Td, Th } from '@client/components/ui/table';
import { answerCells, answerColumns, answerKeyCsv, variantLabel, type AnswerRow } from '../lib/answer-key';
import { fileSlug } from '../lib/csv';
import { downloadCsv } from '../lib/download';
import type { DistanceUnit, EnergyUnit, PlotUnits } from '../lib/units';
import { tryComputeReference } from './reference-preview';

interface ComputedRow {
  variant: Variant;
  reference: Reference | null;
  error: string | null;
}

export interface VariantAnswerKeyProps {
  model: ModelSpec;
  distanceUnit?: DistanceUnit;
  energyUnit?: EnergyUnit;
  /** at most this many variants (default 200) */
  cap?: number;
  /** a Preview button on each row calls this */
  onSelect?: (variant: Variant) => void;
  selectedKey?: string | null;
  title?: string;
}

/**
 * Every variant's answer key in one table, computed in the browser a few
 * variants at a time (exact curves take tens of milliseconds each), with a
 * progress bar and a CSV download.
 */
export function VariantAnswerKey({ model, distanceUnit, energyUnit = 'hartree', cap = 200, onSelect, selectedKey = null, title = 'Answer key of every variant' }: VariantAnswerKeyProps) {
  const modelKey = JSON.stringify(model);
  // eslint-disable-next-line react-hooks/exhaustive-deps
  const variants = useMemo(() => allVariants(model, cap), [modelKey, cap]);
  const [rows, setRows] = useState<ComputedRow[]>([]);
  const units: PlotUnits = {
    distance: distanceUnit ?? ('grid' in model ? model.grid.unit : 'angstrom'),
    energy: energyUnit,
  };

  useEffect(() => {
    let cancelled = false;
    let index = 0;
    const done: ComputedRow[] = [];
    setRows([]);
    const step = () => {
      if (cancelled) return;
      const started = performance.now();
      // about one frame of work, then let the page breathe
      while (index < variants.length && performance.now() - started < 12) {
        const variant = variants[index++];
        const computed = tryComputeReference(model, variant);
        done.push(computed.ok ? { variant, reference: computed.reference, error: null } : { variant, reference: null, error: computed.message });
      }
      setRows([...done]);
      if (index < variants.length) timer = setTimeout(step, 0);
    };
    let timer = setTimeout(step, 0);
    return () => {
      cancelled = true;
      clearTimeout(timer);
    };
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [variants]);

  const columns = answerColumns(model.family, units);
  // cells depend on the units; the references do not
  const shown: AnswerRow[] = rows.map((r) => ({ variant: r.variant, cells: r.reference ? answerCells(r.reference, units) : null, error: r.error }));
  const complete = rows.length === variants.length;

  return (
    <section aria-label={title} className="grid gap-2" data-testid="variant-answer-key">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h3 className="font-semibold text-ink">{title}</h3>
        <div className="flex items-center gap-3">
          {!complete ? (
            <div className="flex items-center gap-2 text-[0.85rem] text-graphite">
              <progress max={variants.length} value={rows.length} aria-label="Answer keys computed" className="h-2 w-32 accent-[var(--color-reference)]" />
              <span role="status">
                <Num>{rows.length}</Num> of <Num>{variants.length}</Num>
              </span>
            </div>
          ) : (
            <span className="text-[0.85rem] text-graphite">
              <Num>{variants.length}</Num> {variants.length === 1 ? 'variant' : 'variants'}
              {variants.length === cap ? ` (first ${cap} shown)` : ''}
            </span>
          )}
          <Button size="sm" variant="quiet" disabled={!complete} onClick={() => downloadCsv(answerKeyCsv(model.family, units, shown), `${fileSlug(title)}.csv`)} aria-label={`Download ${title} as CSV`}>
            CSV
          </Button>
        </div>
      </div>
      <Table label={title} busy={!complete}>
        <thead>
          <tr>
            <Th>Variant</Th>
            {columns.map((c) => (
              <Th key={c.id} className={c.numeric ? 'text-right' : undefined}>
                {c.header}
              </Th>
            ))}
            {onSelect ? (
              <Th>
                <span className="sr-only">Preview</span>
              </Th>
            ) : null}
          </tr>
        </thead>
        <tbody>
          {shown.map((r) => (
            <tr key={r.variant.key} className={r.variant.key === selectedKey ? 'bg-wash' : undefined} aria-selected={r.variant.key === selectedKey || undefined}>
              <Td className="whitespace-nowrap">{variantLabel(r.variant)}</Td>
              {r.cells ? (
                r.cells.map((c, i) => (
                  <Td key={columns[i].id} className={columns[i].numeric ? 'text-right' : '[overflow-wrap:anywhere]'}>
                    {columns[i].numeric ? <Num>{c.text}</Num> : c.text}
                  </Td>
                ))
              ) : (
                <Td colSpan={columns.length} className="text-antibonding">
                  {r.error}
                </Td>
              )}
              {onSelect ? (
                <Td>
                  <Button size="sm" variant="quiet" onClick={() => onSelect(r.variant)} aria-label={`Preview variant ${variantLabel(r.variant)}`}>
                    Preview
                  </Button>
                </Td>
              ) : null}
            </tr>
          ))}
        </tbody>
      </Table>
    </section>
  );
}
