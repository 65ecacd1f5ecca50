import { useId, useRef, useState, type ReactNode } from 'react';
import { Button } from '@client/components/ui/button';
import { fileSlug } from '../lib/csv';
import { downloadBlob, downloadCsv, serializePlotSvg, svgToPngBlob, type LegendEntry } from '../lib/download';

export interface PlotFrameProps {
  title: string;
  /** one line under the title */
  description?: ReactNode;
  /** file names start with this (default: from the title) */
  fileBase?: string;
  /** CSV text of the plotted data; no CSV button without it */
  csv?: () => string;
  legend?: LegendEntry[];
  /** turn the download buttons off (e.g. small previews) */
  downloads?: boolean;
  /** something the page shows beside the buttons, e.g. a busy mark */
  status?: ReactNode;
  children: ReactNode;
  testId?: string;
  className?: string;
}

/** A legend line sample as HTML (the same marks the exported SVG draws). */
function LegendSample({ entry }: { entry: LegendEntry }) {
  return (
    <svg width="24" height="10" aria-hidden="true" className="shrink-0">
      {entry.dot ? (
        <circle cx="12" cy="5" r="4" fill={entry.color} />
      ) : (
        <line x1="1" y1="5" x2="23" y2="5" stroke={entry.color} strokeWidth="2.2" strokeDasharray={entry.dashed ? '6 4' : undefined} />
      )}
    </svg>
  );
}

/**
 * The frame of every plot: a title, the plot's panels (elements marked
 * data-plot-panel, each holding one <svg>), a legend and the downloads
 * (SVG, PNG, CSV). Exported files carry the title and legend inside them.
 */
export function PlotFrame({ title, description, fileBase, csv, legend = [], downloads = true, status, children, testId, className = '' }: PlotFrameProps) {
  const titleId = useId();
  const body = useRef<HTMLDivElement>(null);
  const [error, setError] = useState<string | null>(null);
  const base = fileBase ?? fileSlug(title);

  const panels = (): SVGSVGElement[] => {
    const root = body.current;
    if (!root) return [];
    return [...root.querySelectorAll<HTMLElement>('[data-plot-panel]')]
      .map((panel) => (panel instanceof SVGSVGElement ? panel : panel.querySelector('svg:not([aria-hidden="true"])')) as SVGSVGElement | null)
      .filter((svg): svg is SVGSVGElement => svg !== null);
  };

  const saveSvg = () => {
    setError(null);
    const { text } = serializePlotSvg(panels(), { title, legend });
    downloadBlob(new Blob([text], { type: 'image/svg+xml;charset=utf-8' }), `${base}.svg`);
  };
  const savePng = async () => {
    setError(null);
    try {
      const { text, width, height } = serializePlotSvg(panels(), { title, legend });
      downloadBlob(await svgToPngBlob(text, width, height), `${base}.png`);
    } catch (e) {
      setError(e instanceof Error ? e.message : 'the PNG could not be made');
    }
  };
  const saveCsv = () => {
    if (!csv) return;
    setError(null);
    downloadCsv(csv(), `${base}.csv`);
  };

  return (
    <figure aria-labelledby={titleId} className={`min-w-0 rounded-[3px] border border-rule bg-sheet ${className}`} data-testid={testId}>
      <div className="flex flex-wrap items-start justify-between gap-x-4 gap-y-1 border-b border-rule px-3 py-2">
        <div className="min-w-0">
          <figcaption id={titleId} className="font-semibold text-ink">
            {title}
          </figcaption>
          {description ? <div className="text-[0.85rem] text-graphite">{description}</div> : null}
        </div>
        <div className="flex flex-wrap items-center gap-1.5">
          {status}
          {downloads ? (
            <>
              <Button size="sm" variant="quiet" onClick={saveSvg} aria-label={`Download ${title} as SVG`}>
                SVG
              </Button>
              <Button size="sm" variant="quiet" onClick={() => void savePng()} aria-label={`Download ${title} as PNG`}>
                PNG
              </Button>
              {csv ? (
                <Button size="sm" variant="quiet" onClick={saveCsv} aria-label={`Download ${title} data as CSV`}>
                  CSV
                </Button>
              ) : null}
            </>
          ) : null}
        </div>
      </div>
      <div ref={body} className="px-2 pt-2 pb-1">
        {children}
      </div>
      {legend.length > 0 ? (
        <ul className="flex flex-wrap gap-x-4 gap-y-1 px-3 pb-2 text-[0.85rem] text-ink" aria-label={`Legend of ${title}`}>
          {legend.map((entry) => (
            <li key={entry.label} className="inline-flex items-center gap-1.5">
              <LegendSample entry={entry} />
              {entry.label}
            </li>
          ))}
        </ul>
      ) : null}
      {error ? (
        <p role="alert" className="px-3 pb-2 text-sm text-antibonding">
          {error}
        </p>
      ) : null}
    </figure>
  );
}
