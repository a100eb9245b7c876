import type { SpecReport, WindowReport } from '../../../../shared/run-log/index';

// What the spec check measured against each limit, passed or not: a clean run shows its margins, not just
// an empty findings list. Records made before the figures were kept show dashes.

interface Row {
  key: string;
  check: string;
  measured: string;
  limit: string;
  /** null: not judged here (no figure or no limit) */
  pass: boolean | null;
}

const n = (v: number | null | undefined) => (v === null || v === undefined ? '—' : String(Number(v.toPrecision(4))));

function windowRow(key: string, what: string, w: WindowReport | null | undefined): Row {
  if (!w) return { key, check: what, measured: 'not checked', limit: '—', pass: null };
  const limit = w.high === null ? `≥ ${n(w.low)} ${w.unit}` : `${n(w.low)} – ${n(w.high)} ${w.unit}`;
  if (!w.reached) return { key, check: `${what}, ${w.channel}`, measured: `never reached (peak ${n(w.max)} ${w.unit})`, limit, pass: false };
  const pass = w.min !== null && (w.low === null || w.min >= w.low) && (w.high === null || (w.max !== null && w.max <= w.high));
  return { key, check: `${what}, ${w.channel}`, measured: `${n(w.min)} – ${n(w.max)} ${w.unit}`, limit, pass };
}

export function specRows(spec: SpecReport): Row[] {
  const rows: Row[] = [];
  const lim = spec.limits;
  for (const r of spec.rates) {
    rows.push({
      key: `heat-${r.channel}`,
      check: `Max heat-up rate, ${r.channel}`,
      measured: `${n(r.maxHeatCPerMin)} °C/min`,
      limit: lim ? `≤ ${lim.maxHeatCPerMin} °C/min` : '—',
      pass: lim && r.maxHeatCPerMin !== null ? r.maxHeatCPerMin <= lim.maxHeatCPerMin : null,
    });
    rows.push({
      key: `cool-${r.channel}`,
      check: `Max cool-down rate, ${r.channel}`,
      measured: `${n(r.maxCoolCPerMin)} °C/min`,
      limit: lim ? `≤ ${lim.maxCoolCPerMin} °C/min` : '—',
      pass: lim && r.maxCoolCPerMin !== null ? r.maxCoolCPerMin <= lim.maxCoolCPerMin : null,
    });
  }
  for (const h of spec.holds) {
    const allowance = h.allowanceMin;
    rows.push({
      key: `hold-time-${h.hold}`,
      check: `Hold ${h.hold} time at ${h.targetC} °C (from the lagging TC in band)`,
      measured: h.measuredMin === null ? 'not reached' : `${n(h.measuredMin)} min (${n(h.startMin)}–${n(h.endMin)})`,
      limit: `${h.specifiedMin}${allowance !== undefined ? ` ± ${n(allowance)}` : ''} min`,
      pass: h.measuredMin === null ? false : allowance !== undefined ? Math.abs(h.measuredMin - h.specifiedMin) <= allowance : null,
    });
    rows.push({
      key: `hold-band-${h.hold}`,
      check: `Hold ${h.hold} band, every part TC`,
      measured: h.minC === undefined || h.minC === null ? '—' : `${n(h.minC)} – ${n(h.maxC)} °C`,
      limit: `${n(h.targetC - h.bandC)} – ${n(h.targetC + h.bandC)} °C`,
      pass: h.minC === undefined || h.minC === null || h.maxC === undefined || h.maxC === null ? null : h.minC >= h.targetC - h.bandC - 1e-9 && h.maxC <= h.targetC + h.bandC + 1e-9,
    });
  }
  rows.push({
    key: 'max-temperature',
    check: 'Max part temperature',
    measured: `${n(spec.maxPartC)} °C`,
    limit: lim ? `≤ ${n(lim.maxTemperatureC)} °C` : '—',
    pass: lim && spec.maxPartC !== null ? spec.maxPartC <= lim.maxTemperatureC : null,
  });
  if (spec.pressure !== undefined) rows.push(windowRow('pressure', 'Vessel pressure until demould', spec.pressure));
  if (spec.vacuum !== undefined) rows.push(windowRow('vacuum', 'Bag vacuum until demould', spec.vacuum));
  rows.push({
    key: 'cycle-time',
    check: 'Cycle time',
    measured: `${n(spec.durationMin)} min`,
    limit: lim ? `≤ ${lim.maxCycleMin} min` : '—',
    pass: lim ? spec.durationMin <= lim.maxCycleMin : null,
  });
  return rows;
}

const MARK = { pass: 'within', fail: 'outside', none: '—' };

/** Every checked figure against its limit, passed or not. */
export function SpecSummary({ spec, testId = 'spec-summary' }: { spec: SpecReport; testId?: string }) {
  const rows = specRows(spec);
  return (
    <table className="mt-3 w-full border-collapse text-sm" data-testid={testId}>
      <thead>
        <tr className="border-b border-rule text-left text-ink-soft">
          <th className="py-1 pr-2 font-medium">Check</th>
          <th className="py-1 pr-2 text-right font-medium">Measured</th>
          <th className="py-1 pr-2 text-right font-medium">Limit</th>
          <th className="py-1 pr-2 text-right font-medium">Result</th>
        </tr>
      </thead>
      <tbody>
        {rows.map((r) => (
          <tr key={r.key} className="border-b border-rule/60" data-check={r.key} data-pass={r.pass === null ? 'na' : String(r.pass)}>
            <td className="py-1 pr-2">{r.check}</td>
            <td className="num py-1 pr-2 text-right">{r.measured}</td>
            <td className="num py-1 pr-2 text-right">{r.limit}</td>
            <td className={`py-1 pr-2 text-right ${r.pass === false ? 'text-fault' : r.pass ? 'text-verdigris' : 'text-ink-faint'}`}>
              {r.pass === null ? MARK.none : r.pass ? MARK.pass : MARK.fail}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
