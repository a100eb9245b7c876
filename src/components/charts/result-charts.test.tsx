// @vitest-environment jsdom
import { describe, expect, it, vi } from 'vitest';
import { fireEvent, render, screen, within } from '@testing-library/react';
import type { SimulationResult } from '../../../shared/solver/simulation-result';
import type { ResultRun } from './history-chart';
import { peakText, PlyStressChart } from './ply-stress-chart';
import { CureChart, TemperatureChart } from './result-charts';
import { CHART_MARGIN, makeTimeAxis } from './time-axis';
import { ThroughThicknessCharts } from './through-thickness-chart';
import { drawnCornerDeg, ShapeChart } from './shape-chart';

// A plot 600 px wide for 600 min: one pixel is one minute.
const axis = makeTimeAxis([0, 600], 600 + CHART_MARGIN.left + CHART_MARGIN.right);

/** A made-up run: a straight ramp of air and part, cure rising linearly; only what the charts read is filled. */
function run(label: string, gelTimeMin: number, plyStressMPa: number[]): ResultRun {
  const n = 301;
  const f = (g: (i: number) => number) => Float64Array.from({ length: n }, (_, i) => g(i));
  const history = {
    timeS: f((i) => i * 120),
    airK: f((i) => 293 + i * 0.5),
    toolK: f((i) => 293 + i * 0.48),
    bagSurfaceK: f((i) => 293 + i * 0.47),
    midPlaneK: f((i) => 293 + i * 0.45),
    alphaMin: f((i) => (i / (n - 1)) * 0.9),
    alphaMax: f((i) => (i / (n - 1)) * 0.95),
    tgMidK: f((i) => 270 + i * 0.6),
    resinModulusMidPa: f((i) => i * 1e7),
  };
  const z = plyStressMPa.map((_, i) => Math.floor((i + 1) / 2) * 0.25e-3);
  const stress = Float64Array.from(plyStressMPa, (v) => v * 1e6);
  const result = {
    history,
    summary: { gelTimeMin, vitrificationTimeMin: -1 },
    plyStresses: { zM: Float64Array.from(z), sigma1Pa: stress, sigma2Pa: stress.map((v) => -v / 2), tau12Pa: new Float64Array(stress.length) },
  } as unknown as SimulationResult;
  return { label, result, gelPoint: 0.5 };
}

describe('result charts', () => {
  it('draw a single run in full, with no run key and no markers', () => {
    render(<CureChart runs={[run('only', 120, [1, 2])]} axis={axis} />);
    const chart = screen.getByTestId('chart-cure');
    expect(chart.querySelectorAll('[data-run]')).toHaveLength(1);
    expect(screen.queryAllByTestId('run-legend')).toHaveLength(0);
    // band, least cured and most cured point
    expect([...chart.querySelectorAll('[data-run="A"] [data-series]')].map((g) => g.getAttribute('data-series'))).toEqual([
      'through-thickness spread',
      'least cured point',
      'most cured point',
    ]);
    expect(screen.getByText('through-thickness spread')).toBeTruthy();
  });

  it('redraw only the pieces of a curve after the moment a new result differs from the last', () => {
    const first = run('only', 120, [1, 2]);
    // The same run, cured faster from 400 min on (sample 200 of 301, at 120 s a sample): what a later dwell end does.
    const second = run('only', 120, [1, 2]);
    const h = second.result.history as { alphaMin: Float64Array; alphaMax: Float64Array };
    for (let i = 200; i < h.alphaMin.length; i++) [h.alphaMin[i], h.alphaMax[i]] = [h.alphaMin[i] * 1.05, h.alphaMax[i] * 1.05];
    const { rerender } = render(<CureChart runs={[first]} axis={axis} />);
    const pieces = () => [...screen.getByTestId('chart-cure').querySelectorAll('[data-series="least cured point"] path')];
    const before = pieces().map((p) => p.getAttribute('d'));
    rerender(<CureChart runs={[second]} axis={axis} />);
    const after = pieces().map((p) => p.getAttribute('d'));
    // 600 px for 600 min, 128 px pieces: minutes 0–384 lie in the first three pieces, untouched; the rest moved.
    expect(before.length).toBeGreaterThan(4);
    expect(after.slice(0, 3)).toEqual(before.slice(0, 3));
    expect(after.slice(3).every((d, i) => d !== before[3 + i])).toBe(true);
  });

  it('tell overlaid runs apart by dash and marker, each named in the key', () => {
    render(<TemperatureChart runs={[run('reference', 100, [1, 2]), run('candidate', 140, [1, 2])]} axis={axis} />);
    const chart = screen.getByTestId('chart-temperatures');
    const legend = screen.getAllByTestId('run-legend');
    expect(legend.map((l) => l.textContent)).toEqual(['A reference', 'B candidate']);
    const lineOf = (letter: string) => chart.querySelector(`[data-run="${letter}"] > [data-series] > :is(path, g)`)!;
    expect(lineOf('A').getAttribute('stroke-dasharray')).toBeNull();
    expect(lineOf('B').getAttribute('stroke-dasharray')).toBe('7 4');
    // markers about every 70 px on a 600 px plot, on each of the two quantities
    const markersOfB = chart.querySelectorAll('[data-run="B"] > g > path[transform]');
    expect(markersOfB.length).toBeGreaterThanOrEqual(2 * 7);
    expect(within(chart).getByRole('img').getAttribute('aria-label')).toBe('Temperatures against time, runs A: reference; B: candidate');
  });

  it('mark each run’s gelation at its time, and leave out an event that never happened', () => {
    render(<CureChart runs={[run('reference', 100, [1, 2]), run('candidate', 140, [1, 2])]} axis={axis} />);
    const chart = screen.getByTestId('chart-cure');
    expect(chart.textContent).toContain('A gel 100 min');
    expect(chart.textContent).toContain('B gel 140 min');
    expect(chart.textContent).not.toContain('vitrified');
  });

  it('report the minute under the pointer when pressed, and draw the scrub line where told', () => {
    const onScrub = vi.fn();
    render(<CureChart runs={[run('only', 120, [1, 2])]} axis={axis} scrubMin={250} onScrub={onScrub} />);
    const chart = screen.getByTestId('chart-cure');
    const target = chart.querySelector('rect[style*="col-resize"]')!;
    // jsdom lays nothing out: the target's left edge is at 0, so clientX is the pixel inside the plot.
    fireEvent.pointerDown(target, { clientX: 180, buttons: 1, pointerId: 1 });
    expect(onScrub).toHaveBeenCalledWith(180);
    const scrubLine = chart.querySelector('line[opacity="0.55"]')!;
    expect(scrubLine.getAttribute('x1')).toBe('250');
  });
});

describe('ply stress chart', () => {
  it('writes the peak of largest magnitude, never "-0.0"', () => {
    expect(peakText(Float64Array.from([2e6, -5.25e6, 3e6]))).toBe('-5.3');
    expect(peakText(Float64Array.from([-0.01e6, 0.02e6]))).toBe('0.0');
  });

  it('names every component’s peak for each run in its accessible name', () => {
    render(<PlyStressChart runs={[run('reference', 100, [10, 12, -4, -6]), run('candidate', 140, [8, 9, -3, -5])]} width={600} />);
    const label = screen.getByTestId('chart-ply-stress').querySelector('svg[role="img"]')!.getAttribute('aria-label')!;
    expect(label).toContain('σ₁ along fibre peak A 12.0 · B 9.0 MPa');
    expect(label).toContain('σ₂ across fibre peak A -6.0 · B -4.5 MPa');
    expect(label).toContain('τ₁₂ in-plane shear peak A 0.0 · B 0.0 MPa');
  });
});

describe('temperature chart', () => {
  it('draws the same four temperatures as the workspace: air, tool, part surface and mid-plane', () => {
    render(<TemperatureChart runs={[run('only', 100, [1, 2])]} axis={axis} />);
    const chart = screen.getByTestId('chart-temperatures');
    for (const name of ['air', 'tool', 'part surface', 'mid-plane']) expect(within(chart).getByText(name)).toBeTruthy();
    expect(chart.querySelectorAll('[data-run="A"] > [data-series]')).toHaveLength(4);
  });
});

describe('through-thickness and shape charts', () => {
  /** Two nodes, two steps: a 1 mm laminate at 20 °C then at 100 °C (bottom) / 110 °C (top). */
  function profiled(label: string, topC: number): ResultRun {
    const r = run(label, 100, [1, 2]);
    (r.result as { profiles: SimulationResult['profiles'] }).profiles = {
      zM: Float64Array.from([0, 1e-3]),
      temperatureK: Float64Array.from([293.15, 293.15, 373.15, topC + 273.15]),
      alpha: Float64Array.from([0, 0, 0.3, 0.4]),
    };
    return r;
  }

  it('overlay both runs’ profiles at the time asked for, each with its export buttons', () => {
    render(<ThroughThicknessCharts runs={[profiled('reference', 110), profiled('candidate', 130)]} minutes={2} />);
    const temperature = screen.getByTestId('profile-temperature');
    expect(temperature.querySelectorAll('[data-run]')).toHaveLength(2);
    expect(within(temperature).getByRole('button', { name: 'Download Temperature profile as SVG' })).toBeTruthy();
    expect(within(temperature).getByRole('button', { name: 'Download Temperature profile as PNG' })).toBeTruthy();
    expect(within(screen.getByTestId('profile-cure')).getByRole('button', { name: 'Download Cure profile as PNG' })).toBeTruthy();
    // at 2 min (the second step: steps are 120 s apart) B's top sits right of A's (130 °C against 110 °C)
    const endX = (letter: string) => Number(/L([\d.]+),[\d.-]+$/.exec(temperature.querySelector(`[data-run="${letter}"] > path`)!.getAttribute('d')!)![1]);
    expect(endX('B')).toBeGreaterThan(endX('A'));
  });

  it('draw each run’s strip and corner in its dash, and say when the corner is drawn at its limit', () => {
    const shape = (label: string, springInDeg: number) => ({ label, kxPerM: 0.1, springInDeg, stripSpanMm: 300, cornerAngleDeg: 90 });
    render(<ShapeChart runs={[shape('reference', 1), shape('candidate', 2)]} factor={10} />);
    const chart = screen.getByTestId('chart-shape');
    expect(chart.querySelector('[data-run="B"] > path')!.getAttribute('stroke-dasharray')).toBe('7 4');
    expect(within(chart).getByRole('button', { name: 'Download Shape after demould as SVG' })).toBeTruthy();
    expect(drawnCornerDeg(90, 1, 10)).toEqual({ deg: 80, clipped: false });
    expect(drawnCornerDeg(90, 2, 50)).toEqual({ deg: 5, clipped: true });
  });
});

describe('axis and event labels', () => {
  it('set the unit upright beside the tick labels, clear of the top one, inside the margin', () => {
    render(<CureChart runs={[run('only', 120, [1, 2])]} axis={axis} />);
    const unit = screen.getByTestId('chart-cure').querySelector('[data-axis-unit]')!;
    expect(unit.textContent).toBe('α');
    const [, tx, ty] = /translate\(([-\d.]+),([-\d.]+)\) rotate\(-90\)/.exec(unit.getAttribute('transform')!)!.map(Number);
    // tick labels ("0.0" … "1.0") end 6 px left of the axis and are about 18 px wide
    expect(tx).toBeLessThan(-6 - 18);
    expect(tx).toBeGreaterThan(-CHART_MARGIN.left + 5);
    // halfway up the plot, not level with the top label
    expect(ty).toBeGreaterThan(30);
  });

  it('stagger gel and vitrification labels of two runs that would overlap', () => {
    const a = run('reference', 100, [1, 2]);
    const b = run('candidate', 110, [1, 2]);
    (a.result.summary as { vitrificationTimeMin: number }).vitrificationTimeMin = 120;
    render(<CureChart runs={[a, b]} axis={axis} />);
    const labels = Array.from(screen.getByTestId('chart-cure').querySelectorAll('text')).filter((t) => /^[AB] .* min$/.test(t.textContent ?? ''));
    expect(labels.map((t) => t.textContent)).toEqual(['A gel 100 min', 'A vitrified 120 min', 'B gel 110 min']);
    // 10 px and 20 px apart on a 1 px/min axis, each label ~70 px wide: three rows
    expect(new Set(labels.map((t) => t.getAttribute('y'))).size).toBe(3);
  });
});
