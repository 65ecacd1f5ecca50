/**
 * Downloads of plots (browser only): the plot's SVG serialized as a
 * stand-alone file (title and legend drawn into it, colours and fonts written
 * out), a PNG rendered from that SVG on an offscreen canvas, and CSV text.
 */
import { PLOT_FONT_FAMILY, PLOT_MONO_FAMILY, PLOT_TOKENS } from './plot-colors';

const SVG_NS = 'http://www.w3.org/2000/svg';

export interface LegendEntry {
  label: string;
  color: string;
  dashed?: boolean;
  /** a dot instead of a line (markers) */
  dot?: boolean;
}

/** Save a blob under a file name (an <a download> click on an object URL). */
export function downloadBlob(blob: Blob, fileName: string): void {
  const url = URL.createObjectURL(blob);
  const a = document.createElement('a');
  a.href = url;
  a.download = fileName;
  a.rel = 'noopener';
  a.style.display = 'none';
  document.body.appendChild(a);
  a.click();
  a.remove();
  // let the download start before the URL goes away
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

/** CSV with a byte-order mark, so that spreadsheets read the Greek letters and superscripts as UTF-8. */
export function downloadCsv(text: string, fileName: string): void {
  downloadBlob(new Blob(['\uFEFF', text], { type: 'text/csv;charset=utf-8' }), fileName);
}

function sizeOf(svg: SVGSVGElement): { width: number; height: number } {
  const box = svg.getBoundingClientRect();
  const width = Math.round(box.width || Number(svg.getAttribute('width')) || svg.viewBox.baseVal?.width || 600);
  const height = Math.round(box.height || Number(svg.getAttribute('height')) || svg.viewBox.baseVal?.height || 400);
  return { width, height };
}

function el<K extends keyof SVGElementTagNameMap>(name: K, attrs: Record<string, string | number>, text?: string): SVGElementTagNameMap[K] {
  const node = document.createElementNS(SVG_NS, name);
  for (const [k, v] of Object.entries(attrs)) node.setAttribute(k, String(v));
  if (text !== undefined) node.textContent = text;
  return node;
}

/**
 * One stand-alone SVG from the panels of a plot, stacked top to bottom, with
 * the title above and the legend below. Returns the text and its pixel size.
 */
export function serializePlotSvg(panels: SVGSVGElement[], options: { title?: string; legend?: LegendEntry[] } = {}): { text: string; width: number; height: number } {
  const sizes = panels.map(sizeOf);
  const width = Math.max(320, ...sizes.map((s) => s.width));
  const titleHeight = options.title ? 30 : 8;
  const legend = options.legend ?? [];
  const legendRows: LegendEntry[][] = [];
  // about three entries a row at 640 px
  const perRow = Math.max(1, Math.floor(width / 210));
  for (let i = 0; i < legend.length; i += perRow) legendRows.push(legend.slice(i, i + perRow));
  const legendHeight = legendRows.length * 20 + (legendRows.length ? 10 : 0);
  const height = titleHeight + sizes.reduce((a, s) => a + s.height, 0) + legendHeight + 6;

  const root = el('svg', { xmlns: SVG_NS, width, height, viewBox: `0 0 ${width} ${height}`, 'font-family': PLOT_FONT_FAMILY, 'font-size': 12 });
  const style = el('style', {}, `text { font-family: ${PLOT_FONT_FAMILY}; } .num, .recharts-cartesian-axis-tick-value { font-family: ${PLOT_MONO_FAMILY}; }`);
  root.appendChild(style);
  root.appendChild(el('rect', { x: 0, y: 0, width, height, fill: PLOT_TOKENS.paper }));
  if (options.title) root.appendChild(el('text', { x: 12, y: 20, 'font-size': 15, 'font-weight': 600, fill: PLOT_TOKENS.ink }, options.title));

  let y = titleHeight;
  panels.forEach((svg, i) => {
    const clone = svg.cloneNode(true) as SVGSVGElement;
    clone.removeAttribute('style');
    clone.removeAttribute('class');
    clone.setAttribute('x', '0');
    clone.setAttribute('y', String(y));
    clone.setAttribute('width', String(sizes[i].width));
    clone.setAttribute('height', String(sizes[i].height));
    if (!clone.getAttribute('viewBox')) clone.setAttribute('viewBox', `0 0 ${sizes[i].width} ${sizes[i].height}`);
    root.appendChild(clone);
    y += sizes[i].height;
  });

  legendRows.forEach((row, r) => {
    const rowY = y + 14 + r * 20;
    row.forEach((entry, c) => {
      const x = 14 + c * 210;
      if (entry.dot) root.appendChild(el('circle', { cx: x + 11, cy: rowY - 4, r: 4, fill: entry.color }));
      else root.appendChild(el('line', { x1: x, y1: rowY - 4, x2: x + 22, y2: rowY - 4, stroke: entry.color, 'stroke-width': 2.2, ...(entry.dashed ? { 'stroke-dasharray': '6 4' } : {}) }));
      root.appendChild(el('text', { x: x + 28, y: rowY, fill: PLOT_TOKENS.ink, 'font-size': 12 }, entry.label));
    });
  });

  const text = '<?xml version="1.0" encoding="UTF-8"?>\n' + new XMLSerializer().serializeToString(root);
  return { text, width, height };
}

/** Render SVG text to a PNG blob on an offscreen canvas (`scale` × the SVG's pixel size). */
export function svgToPngBlob(svgText: string, width: number, height: number, scale = 2): Promise<Blob> {
  return new Promise((resolve, reject) => {
    const url = URL.createObjectURL(new Blob([svgText], { type: 'image/svg+xml;charset=utf-8' }));
    const image = new Image();
    image.onload = () => {
      try {
        const canvas = document.createElement('canvas');
        canvas.width = Math.round(width * scale);
        canvas.height = Math.round(height * scale);
        const ctx = canvas.getContext('2d');
        if (!ctx) throw new Error('this browser cannot draw on a canvas');
        ctx.fillStyle = PLOT_TOKENS.paper;
        ctx.fillRect(0, 0, canvas.width, canvas.height);
        ctx.drawImage(image, 0, 0, canvas.width, canvas.height);
        canvas.toBlob((blob) => (blob ? resolve(blob) : reject(new Error('the PNG could not be made'))), 'image/png');
      } catch (error) {
        reject(error instanceof Error ? error : new Error(String(error)));
      } finally {
        URL.revokeObjectURL(url);
      }
    };
    image.onerror = () => {
      URL.revokeObjectURL(url);
      reject(new Error('the plot could not be turned into an image'));
    };
    image.src = url;
  });
}
