/* eslint-disable @typescript-eslint/no-explicit-any -- these tests build deliberately invalid studies */
import { describe, expect, it } from 'vitest';
import { referenceStudy, demoStudies } from '../solver/demo-cards';
import { StudyInputError, parseStudy, validateStudy, type StudyIssue } from './study';

// Each error must name the field (path), the value and the allowed range (issue 3, "Errors").

function issuesOf(mutate: (s: any) => void): StudyIssue[] {
  const s = structuredClone(referenceStudy()) as any;
  mutate(s);
  const v = validateStudy(s);
  if (v.ok) throw new Error('expected the study to be refused');
  return v.issues;
}

function issueAt(issues: StudyIssue[], path: string): StudyIssue {
  const found = issues.find((i) => i.path === path);
  if (!found) throw new Error(`no issue at ${path}; got ${JSON.stringify(issues)}`);
  return found;
}

describe('study schema', () => {
  it('accepts the reference study and every demo study', () => {
    expect(validateStudy(referenceStudy()).ok).toBe(true);
    for (const d of demoStudies()) expect(validateStudy(d.params).ok, d.name).toBe(true);
  });

  it('fills the hold defaults (clock start, ±5 °C band)', () => {
    const s = structuredClone(referenceStudy()) as any;
    s.cycle.segments[1] = { kind: 'hold', holdMin: 30, pressureBar: 7 };
    const p = parseStudy(s);
    expect(p.cycle.kind === 'segments' && p.cycle.segments[1]).toMatchObject({ start: 'clock', bandC: 5 });
  });

  it('refuses a ramp of 0 °C/min, naming the rate and its range', () => {
    const i = issueAt(issuesOf((s) => (s.cycle.segments[0].rateCPerMin = 0)), 'cycle.segments.0.rateCPerMin');
    expect(i.message).toContain('0 °C/min');
    expect(i.message).toMatch(/> 0 °C\/min and ≤ 20 °C\/min/);
  });

  it('refuses a dwell below room temperature with no cooling before it', () => {
    const issues = issuesOf((s) => {
      s.cycle.startC = 10;
      s.cycle.segments.unshift({ kind: 'hold', holdMin: 30, pressureBar: 1, start: 'clock', bandC: 5 });
    });
    const i = issueAt(issues, 'cycle.segments.0');
    expect(i.message).toContain('10 °C');
    expect(i.message).toMatch(/below room temperature \(20 °C\)/);
    expect(i.message).toMatch(/cool segment/);
  });

  it('accepts a sub-ambient dwell that a cool segment leads to', () => {
    const s = structuredClone(referenceStudy()) as any;
    s.cycle.segments.push({ kind: 'cool', rateCPerMin: 2, targetC: 10, pressureBar: 0 });
    s.cycle.segments.push({ kind: 'hold', holdMin: 10, pressureBar: 0, start: 'clock', bandC: 5 });
    s.cycle.segments.push({ kind: 'cool', rateCPerMin: 2, targetC: 5, pressureBar: 0 });
    expect(validateStudy(s).ok).toBe(true);
  });

  it('refuses a negative ply thickness', () => {
    const i = issueAt(issuesOf((s) => (s.layup.plies[3].thicknessMm = -0.2)), 'layup.plies.3.thicknessMm');
    expect(i.message).toContain('-0.2 mm');
    expect(i.message).toContain('≥ 0.02 mm and ≤ 2 mm');
  });

  it('refuses Prony weights that do not sum to 1', () => {
    const i = issueAt(
      issuesOf((s) => (s.resin.modulus.prony.weights = s.resin.modulus.prony.weights.map((w: number) => w * 0.9))),
      'resin.modulus.prony.weights',
    );
    expect(i.message).toMatch(/sum to 0\.9\b/);
    expect(i.message).toContain('1 within ±0.000001');
  });

  it('refuses a resin card whose Tg∞ is below Tg0', () => {
    const i = issueAt(
      issuesOf((s) => {
        s.resin.glassTransition.tg0C = 50;
        s.resin.glassTransition.tgInfC = 40;
      }),
      'resin.glassTransition.tgInfC',
    );
    expect(i.message).toContain('40 °C');
    expect(i.message).toContain('> Tg0 (50 °C)');
  });

  it('refuses relaxed ≥ unrelaxed modulus and mismatched Prony lengths', () => {
    const issues = issuesOf((s) => {
      s.resin.modulus.relaxedGPa = 4;
      s.resin.modulus.prony.timesS = [1, 10];
    });
    expect(issueAt(issues, 'resin.modulus.relaxedGPa').message).toContain('< unrelaxed modulus (3.4 GPa)');
    expect(issueAt(issues, 'resin.modulus.prony.timesS').message).toMatch(/2 relaxation times for 8 weights/);
  });

  it('refuses ramps that go down, cools that go up and a cycle that does not end with a cool', () => {
    const issues = issuesOf((s) => {
      s.cycle.segments[2].targetC = 100; // after the 120 °C dwell
      s.cycle.segments[4] = { kind: 'ramp', rateCPerMin: 1, targetC: 190, pressureBar: 7 };
    });
    expect(issueAt(issues, 'cycle.segments.2.targetC').message).toContain('allowed > 120 °C');
    expect(issueAt(issues, 'cycle.segments.4.kind').message).toMatch(/only 'cool' as the last segment/);
    const up = issuesOf((s) => (s.cycle.segments[4].targetC = 200));
    expect(issueAt(up, 'cycle.segments.4.targetC').message).toContain('allowed < 180 °C');
  });

  it('says how many list items came and the allowed count', () => {
    // The allowed counts are our input rules (issue 3: "any count from 1 to 200" plies); no outside source.
    expect(issueAt(issuesOf((s) => (s.layup.plies = [])), 'layup.plies').message).toBe('0 plies: allowed 1 to 200');
    const many = issuesOf((s) => (s.layup.plies = Array.from({ length: 201 }, () => ({ angleDeg: 0, thicknessMm: 0.1 }))));
    expect(issueAt(many, 'layup.plies').message).toBe('201 plies: allowed 1 to 200');
    expect(issueAt(issuesOf((s) => (s.resin.modulus.prony.weights = [])), 'resin.modulus.prony.weights').message).toBe('0 terms: allowed 1 to 40');
    const table = issuesOf((s) => (s.resin.modulus.shift.cureTable = { alpha: [0.5], log10a: [0] }));
    expect(issueAt(table, 'resin.modulus.shift.cureTable.alpha').message).toBe('1 point: allowed 2 to 100');
    expect(issueAt(issuesOf((s) => (s.cycle.segments = [])), 'cycle.segments').message).toBe('0 segments: allowed 1 to 40');
  });

  it('caps the length of a cycle at 14 days', () => {
    const issues = issuesOf((s) => {
      s.cycle.segments[3].holdMin = 10_000;
      s.cycle.segments[1].holdMin = 10_100;
    });
    // 50 + 10100 + 40 + 10000 + 60 min (closed form of the schedule)
    expect(issueAt(issues, 'cycle.segments').message).toBe('the schedule lasts 20250 min: allowed ≤ 20160 min (14 days)');
    const s = structuredClone(referenceStudy()) as any;
    s.cycle.segments[1].holdMin = 10_000;
    s.cycle.segments[3].holdMin = 10_000; // 50 + 10000 + 40 + 10000 + 60 = 20150 min: accepted
    expect(validateStudy(s).ok).toBe(true);
  });

  it('caps the laminate mesh with a hint', () => {
    const issues = issuesOf((s) => {
      s.layup.plies = Array.from({ length: 120 }, () => ({ angleDeg: 0, thicknessMm: 0.2 }));
      s.mesh.nodesPerPly = 5;
    });
    expect(issueAt(issues, 'mesh.nodesPerPly').message).toMatch(/600 nodes: allowed ≤ 400 .*use ≤ 3 nodes per ply/);
  });

  it('refuses fibre fractions, ply counts, whole-number fields and types out of range', () => {
    expect(issueAt(issuesOf((s) => (s.fibreVolumeFraction = 0.8)), 'fibreVolumeFraction').message).toContain('0.8 is out of range: allowed ≥ 0.3 and ≤ 0.75');
    expect(issueAt(issuesOf((s) => (s.layup.plies = [])), 'layup.plies').message).toBe('0 plies: allowed 1 to 200');
    expect(issueAt(issuesOf((s) => (s.mesh.nodesPerPly = 2.5)), 'mesh.nodesPerPly').message).toContain('a whole number ≥ 2 and ≤ 6');
    expect(issueAt(issuesOf((s) => (s.heatTransfer.bagSideWPerM2K = 'high')), 'heatTransfer.bagSideWPerM2K').message).toContain('got "high"');
    expect(issueAt(issuesOf((s) => (s.resin.kinetics.form = 'magic')), 'resin.kinetics.form').message).toContain("allowed 'nth-order'");
    expect(issueAt(issuesOf((s) => (s.layup.plies[0].angleDeg = 135)), 'layup.plies.0.angleDeg').message).toContain('135 ° is out of range');
  });

  it('refuses tool-held without a tool, and a record whose times do not increase', () => {
    expect(issueAt(issuesOf((s) => (s.tool = { kind: 'none' })), 'constraint').message).toMatch(/needs a tool plate/);
    const i = issueAt(
      issuesOf((s) => {
        s.cycle = { kind: 'record', points: [{ timeMin: 0, airC: 20 }, { timeMin: 10, airC: 40 }, { timeMin: 10, airC: 60 }] };
      }),
      'cycle.points.2.timeMin',
    );
    expect(i.message).toContain('allowed > 10 min');
  });

  it('throws StudyInputError listing the fields from parseStudy', () => {
    const s = structuredClone(referenceStudy()) as any;
    s.cycle.segments[0].rateCPerMin = 0;
    try {
      parseStudy(s);
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(StudyInputError);
      expect((e as StudyInputError).message).toContain('cycle.segments.0.rateCPerMin: 0 °C/min is out of range');
      expect((e as StudyInputError).issues).toHaveLength(1);
    }
  });
});
