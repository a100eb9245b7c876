import { createContext, useContext, useState, type RefObject } from 'react';
import { exportChartPng, exportChartSvg } from '../../lib/chart-export';

/**
 * Why chart exports are held right now, or null: asked when a button is pressed (the workspace holds them
 * while its charts show a drag's quick look, so a file never carries a preview).
 */
export const ExportHoldContext = createContext<() => string | null>(() => null);

/**
 * "SVG" and "PNG" buttons for the chart inside `target` (the first <svg> in it, or the element itself).
 * Hidden when printing: the printed page has the chart already.
 */
export function ChartExportControl({
  target,
  fileBase,
  title,
}: {
  target: RefObject<Element | null>;
  /** file name without extension */
  fileBase: string;
  /** what the chart shows; becomes the file's <title> and the buttons' accessible names */
  title: string;
}) {
  const [error, setError] = useState<string | null>(null);
  const [working, setWorking] = useState(false);
  const hold = useContext(ExportHoldContext);

  async function run(kind: 'svg' | 'png') {
    const held = hold();
    if (held) {
      setError(held);
      return;
    }
    const root = target.current;
    const svg = root instanceof SVGSVGElement ? root : root?.querySelector('svg');
    if (!svg) {
      setError('No chart to export yet.');
      return;
    }
    setError(null);
    setWorking(true);
    try {
      await (kind === 'svg' ? exportChartSvg(svg, fileBase, title) : exportChartPng(svg, fileBase, title));
    } catch (e) {
      setError(e instanceof Error ? e.message : String(e));
    } finally {
      setWorking(false);
    }
  }

  const button =
    'rounded border border-rule px-1.5 py-0.5 text-[10px] font-semibold uppercase tracking-wide text-ink-soft hover:bg-rule/40 disabled:opacity-50';
  return (
    <span className="inline-flex items-center gap-1 print:hidden" data-export="skip">
      <button type="button" className={button} disabled={working} onClick={() => run('svg')} aria-label={`Download ${title} as SVG`}>
        SVG
      </button>
      <button type="button" className={button} disabled={working} onClick={() => run('png')} aria-label={`Download ${title} as PNG`}>
        PNG
      </button>
      {error && (
        <span role="alert" className="text-[10px] text-fault">
          {error}
        </span>
      )}
    </span>
  );
}
