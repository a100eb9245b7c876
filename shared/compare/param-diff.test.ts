import { describe, expect, it } from 'vitest';
import { aluminiumPlate, invarPlate, leeLoosSpringerResin, referenceStudy } from '../solver/demo-cards';
import type { StudyParams } from '../schemas/study';
import { MAX_PLY_LINES, paramDiff, type ParamChange } from './param-diff';

// Each test makes one kind of edit to the reference study by hand and checks the diff names it, in words,
// with the unit, and nothing else. The expected sentences are written out here, not produced by the code.

function edit(change: (p: StudyParams) => void): StudyParams {
  const p = structuredClone(referenceStudy());
  change(p);
  return p;
}

function texts(changes: ParamChange[]): string[] {
  return changes.map((c) => c.text);
}

function segments(p: StudyParams) {
  if (p.cycle.kind !== 'segments') throw new Error('reference study has a segment cycle');
  return p.cycle.segments;
}

describe('paramDiff', () => {
  it('finds no change between a study and its copy', () => {
    expect(paramDiff(referenceStudy(), referenceStudy())).toEqual([]);
  });

  it('names a lengthened dwell by its name on the cycle editor, field, both values, the difference and the unit', () => {
    const b = edit((p) => {
      const hold = segments(p)[1];
      if (hold.kind === 'hold') hold.holdMin = 120;
    });
    const changes = paramDiff(referenceStudy(), b);
    expect(changes).toHaveLength(1);
    expect(changes[0]).toMatchObject({ area: 'cycle', kind: 'changed', path: 'cycle.segments.1.holdMin' });
    expect(changes[0].text).toBe('Dwell 1: length 90 min → 120 min (+30 min)');
  });

  it('names a slower ramp with a negative difference in °C/min', () => {
    const b = edit((p) => {
      const ramp = segments(p)[0];
      if (ramp.kind === 'ramp') ramp.rateCPerMin = 1.5;
    });
    expect(texts(paramDiff(referenceStudy(), b))).toEqual(['Ramp 1: rate 2 °C/min → 1.5 °C/min (−0.5 °C/min)']);
  });

  it('names a dwell that now starts on the clock instead of waiting for the coldest point to be in band', () => {
    const b = edit((p) => {
      const hold = segments(p)[3];
      if (hold.kind === 'hold') hold.start = 'clock';
    });
    expect(texts(paramDiff(referenceStudy(), b))).toEqual([
      'Dwell 2: starts when the coldest point is in band → starts on the clock',
    ]);
  });

  it('reports an inserted segment as one addition, not as every later segment changed', () => {
    const b = edit((p) => {
      segments(p).splice(2, 0, { kind: 'hold', holdMin: 15, pressureBar: 7, start: 'clock', bandC: 5 });
    });
    // The new dwell sits right after the first one; alignment may attribute it to either position.
    const changes = paramDiff(referenceStudy(), b);
    expect(changes).toHaveLength(1);
    expect(changes[0].kind).toBe('added');
    expect(changes[0].text).toMatch(/^Dwell [12] added: 15 min, 7 bar, starts on the clock$/);
  });

  it('reports a removed segment with what it was', () => {
    const b = edit((p) => {
      segments(p).splice(0, 2); // drop the first ramp and the intermediate dwell
      segments(p)[0] = { kind: 'ramp', rateCPerMin: 1.5, targetC: 180, pressureBar: 7 };
    });
    const changes = paramDiff(referenceStudy(), b);
    expect(changes.map((c) => c.kind).sort()).toEqual(['removed', 'removed']);
    expect(texts(changes)).toContain('Ramp 1 removed (was 2 °C/min to 120 °C, 7 bar)');
    expect(texts(changes)).toContain(
      'Dwell 1 removed (was 90 min, 7 bar, starts when the coldest point is in band (±5 °C))',
    );
  });

  it('reports a segment of another kind at the same place as replaced', () => {
    const b = edit((p) => {
      segments(p)[1] = { kind: 'ramp', rateCPerMin: 1, targetC: 130, pressureBar: 7 };
    });
    expect(texts(paramDiff(referenceStudy(), b))).toEqual([
      'Dwell 1 replaced by Ramp 2: 90 min, 7 bar, starts when the coldest point is in band (±5 °C) → 1 °C/min to 130 °C, 7 bar',
    ]);
  });

  it('matches an edited segment with the one it most resembles, even when earlier segments were removed', () => {
    // Single fast ramp: drop the first ramp and dwell, ramp at 5 °C/min to 180 °C, clock-started dwell, faster cool.
    const b = edit((p) => {
      p.cycle = {
        kind: 'segments',
        startC: 20,
        segments: [
          { kind: 'ramp', rateCPerMin: 5, targetC: 180, pressureBar: 7 },
          { kind: 'hold', holdMin: 120, pressureBar: 7, start: 'clock', bandC: 5 },
          { kind: 'cool', rateCPerMin: 5, targetC: 60, pressureBar: 7 },
        ],
      };
    });
    expect(texts(paramDiff(referenceStudy(), b))).toEqual([
      'Ramp 1 removed (was 2 °C/min to 120 °C, 7 bar)',
      'Dwell 1 removed (was 90 min, 7 bar, starts when the coldest point is in band (±5 °C))',
      'Ramp 1 (Ramp 2 before): rate 1.5 °C/min → 5 °C/min (+3.5 °C/min)',
      'Dwell 1 (Dwell 2 before): starts when the coldest point is in band → starts on the clock',
      'Cool 1: rate 2 °C/min → 5 °C/min (+3 °C/min)',
    ]);
  });

  it('names a changed demould temperature and pressure on the cool segment', () => {
    const b = edit((p) => {
      const cool = segments(p)[4];
      if (cool.kind === 'cool') {
        cool.targetC = 50;
        cool.pressureBar = 6;
      }
    });
    expect(texts(paramDiff(referenceStudy(), b))).toEqual([
      'Cool 1: target 60 °C → 50 °C (−10 °C)',
      'Cool 1: pressure 7 bar → 6 bar (−1 bar)',
    ]);
  });

  it('names a ply angle and a ply thickness change', () => {
    const b = edit((p) => {
      p.layup.plies[1].angleDeg = 30; // was 45
      p.layup.plies[2].thicknessMm = 0.25; // was 0.19
    });
    const t = texts(paramDiff(referenceStudy(), b));
    expect(t).toContain('Ply 2: angle 45° → 30° (−15°)');
    expect(t).toContain('Ply 3: thickness 0.19 mm → 0.25 mm (+0.06 mm)');
    // 24 × 0.19 = 4.56 mm before, 4.56 + 0.06 = 4.62 mm after (hand arithmetic).
    expect(t).toContain('Layup: 24 → 24 plies, laminate thickness 4.56 mm → 4.62 mm');
  });

  it('names an added and a removed ply with angle and thickness', () => {
    const added = edit((p) => p.layup.plies.push({ angleDeg: 60, thicknessMm: 0.3 }));
    const t = texts(paramDiff(referenceStudy(), added));
    expect(t).toContain('Ply 25 added: 60°, 0.3 mm');
    expect(t).toContain('Layup: 24 → 25 plies, laminate thickness 4.56 mm → 4.86 mm');

    const removed = edit((p) => p.layup.plies.shift()); // the 0° tool-side ply
    const r = paramDiff(referenceStudy(), removed);
    expect(r.filter((c) => c.kind === 'removed').map((c) => c.text)).toEqual([
      expect.stringMatching(/^Ply \d+ removed \(was 0°, 0\.19 mm\)$/),
    ]);
    expect(texts(r)).toContain('Layup: 24 → 23 plies, laminate thickness 4.56 mm → 4.37 mm');
  });

  it('collapses a very large layup change into a count line', () => {
    const b = edit((p) => {
      p.layup.plies = Array.from({ length: 60 }, () => ({ angleDeg: 0, thicknessMm: 0.1 }));
    });
    const layup = paramDiff(referenceStudy(), b).filter((c) => c.area === 'layup');
    // One count line at the top, MAX_PLY_LINES detailed lines, one "…and N more" line.
    expect(layup).toHaveLength(MAX_PLY_LINES + 2);
    expect(layup[layup.length - 1].text).toMatch(/^…and \d+ more ply changes \(\d+ added, \d+ removed, \d+ changed\)$/);
  });

  it('names resin card values with their units', () => {
    const b = edit((p) => {
      p.resin.heatOfReactionKJPerKg = 520;
      p.resin.glassTransition.tgInfC = 205;
      p.resin.modulus.unrelaxedGPa = 3.2;
    });
    expect(texts(paramDiff(referenceStudy(), b))).toEqual([
      'Resin card: heat of reaction 500 kJ/kg → 520 kJ/kg (+20 kJ/kg)',
      'Resin card: Tg∞ 215 °C → 205 °C (−10 °C)',
      'Resin card: unrelaxed modulus 3.4 GPa → 3.2 GPa (−0.2 GPa)',
    ]);
  });

  it('names a Prony weight by its term number and a change of term count', () => {
    const b = edit((p) => {
      const w = p.resin.modulus.prony.weights;
      w[2] += 0.01;
      w[3] -= 0.01;
    });
    const t = texts(paramDiff(referenceStudy(), b));
    expect(t).toHaveLength(2);
    expect(t[0]).toMatch(/^Resin card: Prony weight 3 [\d.]+ → [\d.]+ \(\+0\.01\)$/);
    expect(t[1]).toMatch(/^Resin card: Prony weight 4 [\d.]+ → [\d.]+ \(−0\.01\)$/);

    const fewer = edit((p) => {
      p.resin.modulus.prony.weights = [0.5, 0.5];
      p.resin.modulus.prony.timesS = [10, 1000];
    });
    const f = texts(paramDiff(referenceStudy(), fewer));
    expect(f.some((s) => s.startsWith('Resin card: Prony series weights: 8 → 2 terms'))).toBe(true);
    expect(f.some((s) => s.startsWith('Resin card: Prony series relaxation times: 8 → 2 terms (10 s, 1000 s)'))).toBe(true);
  });

  it('names a change of kinetics form once, with the new constants, rather than field by field', () => {
    const b = edit((p) => {
      p.resin.kinetics = leeLoosSpringerResin().kinetics;
    });
    const t = texts(paramDiff(referenceStudy(), b));
    expect(t).toHaveLength(1);
    expect(t[0]).toMatch(/^Resin card: kinetics form 'kamal-sourour' → 'lee-loos-springer' \(now pre-exponential factor A1 .* 1\/min, .*constant B 0\.47\)$/);
  });

  it('names an added or dropped diffusion factor', () => {
    const b = edit((p) => {
      delete p.resin.diffusion;
    });
    const t = texts(paramDiff(referenceStudy(), b));
    expect(t).toHaveLength(1);
    expect(t[0]).toMatch(/^Resin card: diffusion removed \(was diffusion constant C 30, critical cure αC0 −1\.3, critical cure slope αCT 0\.005 1\/K\)$/);
    expect(texts(paramDiff(b, referenceStudy()))[0]).toMatch(/^Resin card: diffusion added: diffusion constant C 30/);
  });

  it('names fibre card values and the fibre volume fraction', () => {
    const b = edit((p) => {
      p.fibre.e1GPa = 240;
      p.fibre.cte1MicroPerK = -0.4;
      p.fibreVolumeFraction = 0.6;
    });
    expect(texts(paramDiff(referenceStudy(), b))).toEqual([
      'Fibre card: E1 232 GPa → 240 GPa (+8 GPa)',
      'Fibre card: CTE1 −0.5 µ/K → −0.4 µ/K (+0.1 µ/K)',
      'Fibre volume fraction 0.58 → 0.6 (+0.02)',
    ]);
  });

  it('names a different tool plate field by field, and a removed tool as one line', () => {
    const thicker = edit((p) => {
      p.tool = aluminiumPlate(12);
    });
    expect(texts(paramDiff(referenceStudy(), thicker))).toEqual(['Tool: thickness 10 mm → 12 mm (+2 mm)']);

    const invar = edit((p) => {
      p.tool = invarPlate(10);
    });
    const t = texts(paramDiff(referenceStudy(), invar));
    expect(t).toContain("Tool: name 'Aluminium plate' → 'Invar-like plate'");
    expect(t).toContain('Tool: CTE 23.6 µ/K → 1.5 µ/K (−22.1 µ/K)');

    const none = edit((p) => {
      p.tool = { kind: 'none' };
      p.constraint = 'free';
    });
    const n = paramDiff(referenceStudy(), none);
    expect(n[0]).toMatchObject({ area: 'tool', kind: 'removed', text: 'Tool: Aluminium plate, 10 mm → no tool plate' });
    expect(n[1].text).toBe('Part constraint: held flat on the tool until demould → free on the tool');
  });

  it('names heat transfer, mesh and geometry changes with units', () => {
    const b = edit((p) => {
      p.heatTransfer.bagSideWPerM2K = 80;
      p.mesh.nodesPerPly = 3;
      p.geometry.stripSpanMm = 450;
      p.geometry.cornerAngleDeg = 120;
    });
    const changes = paramDiff(referenceStudy(), b);
    expect(changes.map((c) => c.area)).toEqual(['heat transfer', 'model', 'geometry', 'geometry']);
    expect(texts(changes)).toEqual([
      'Bag-side heat transfer coefficient 50 W/(m²·K) → 80 W/(m²·K) (+30 W/(m²·K))',
      'Nodes per ply 2 → 3 (+1)',
      'Strip span 300 mm → 450 mm (+150 mm)',
      'Corner angle 90° → 120° (+30°)',
    ]);
  });

  it('names process limit changes', () => {
    const b = edit((p) => {
      p.limits.maxOvershootC = 8;
      p.limits.maxCycleMin = 460;
      p.limits.minFinalCure = 0.92;
    });
    expect(texts(paramDiff(referenceStudy(), b))).toEqual([
      'Minimum final degree of cure 0.9 → 0.92 (+0.02)',
      'Maximum exotherm overshoot 10 °C → 8 °C (−2 °C)',
      'Maximum cycle time 480 min → 460 min (−20 min)',
    ]);
  });

  it('names a switch from a segment schedule to a measured record', () => {
    const b = edit((p) => {
      p.cycle = {
        kind: 'record',
        points: [
          { timeMin: 0, airC: 20 },
          { timeMin: 60, airC: 140 },
          { timeMin: 300, airC: 60 },
        ],
      };
    });
    expect(texts(paramDiff(referenceStudy(), b))).toEqual([
      'Cycle: a schedule of 5 segments from 20 °C → a measured record of 3 points over 300 min',
    ]);
  });
});
