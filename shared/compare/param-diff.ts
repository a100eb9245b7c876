import type { StudyParams } from '../schemas/study';
import { describeSegmentSettings, HOLD_START_WORDS, segmentNames } from './segment-names';
import { alignLists, deepEqual } from './align';
import { FIELD_LABELS, fieldLabel, formatDelta, formatQuantity, type FieldLabel } from './field-labels';

// Which inputs differ between two studies, in plain words with units, so an engineer reading a comparison
// (or a printed report) sees what was changed without opening either study.

export type ChangeArea = 'material' | 'layup' | 'cycle' | 'tool' | 'heat transfer' | 'model' | 'geometry' | 'limits';

export interface ParamChange {
  area: ChangeArea;
  kind: 'added' | 'removed' | 'changed';
  /** dotted path of the field (in study B; in study A for a removal) */
  path: string;
  /** one sentence in plain words, with units */
  text: string;
}

/** Ply-level lines beyond this collapse into one count line (a 24 → 128 ply change is not 104 lines). */
export const MAX_PLY_LINES = 16;

type Table = Record<string, FieldLabel>;
type Json = Record<string, unknown>;

export function paramDiff(a: StudyParams, b: StudyParams): ParamChange[] {
  const out: ParamChange[] = [];
  diffCard(out, 'Resin card', 'resin', a.resin, b.resin, FIELD_LABELS.resin);
  diffCard(out, 'Fibre card', 'fibre', a.fibre, b.fibre, FIELD_LABELS.fibre);
  diffStudyField(out, 'material', 'fibreVolumeFraction', a.fibreVolumeFraction, b.fibreVolumeFraction);
  diffLayup(out, a.layup.plies, b.layup.plies);
  diffCycle(out, a.cycle, b.cycle);
  diffTool(out, a.tool, b.tool);
  if (a.constraint !== b.constraint) {
    const text = `Part constraint: ${describeConstraint(a.constraint)} → ${describeConstraint(b.constraint)}`;
    out.push({ area: 'tool', kind: 'changed', path: 'constraint', text });
  }
  for (const key of ['bagSideWPerM2K', 'toolSideWPerM2K'] as const) {
    diffStudyField(out, 'heat transfer', `heatTransfer.${key}`, a.heatTransfer[key], b.heatTransfer[key]);
  }
  diffStudyField(out, 'model', 'mesh.nodesPerPly', a.mesh.nodesPerPly, b.mesh.nodesPerPly);
  for (const key of ['stripSpanMm', 'cornerAngleDeg'] as const) {
    diffStudyField(out, 'geometry', `geometry.${key}`, a.geometry[key], b.geometry[key]);
  }
  for (const key of Object.keys(b.limits) as (keyof StudyParams['limits'])[]) {
    diffStudyField(out, 'limits', `limits.${key}`, a.limits[key], b.limits[key]);
  }
  return out;
}

// --- sentences ---------------------------------------------------------------------------------------------

function changedText(subject: string, label: FieldLabel, before: unknown, after: unknown): string {
  const delta =
    typeof before === 'number' && typeof after === 'number' ? ` (${formatDelta(after - before, label.unit)})` : '';
  return `${subject}${label.label} ${formatQuantity(before, label.unit)} → ${formatQuantity(after, label.unit)}${delta}`;
}

function capitalise(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}

function diffStudyField(out: ParamChange[], area: ChangeArea, path: string, before: unknown, after: unknown) {
  if (deepEqual(before, after)) return;
  const label = fieldLabel(FIELD_LABELS.study, path);
  out.push({ area, kind: 'changed', path, text: capitalise(changedText('', label, before, after)) });
}

function describeConstraint(c: StudyParams['constraint']): string {
  return c === 'tool-held' ? 'held flat on the tool until demould' : 'free on the tool';
}

// --- material cards ----------------------------------------------------------------------------------------

/** Leaf-by-leaf comparison of two JSON objects; a changed discriminant ('form', 'kind') is one change. */
function diffCard(out: ParamChange[], subject: string, root: string, a: unknown, b: unknown, table: Table) {
  walk(a, b, '');

  function push(kind: ParamChange['kind'], rel: string, text: string) {
    out.push({ area: 'material', kind, path: `${root}.${rel}`, text: `${subject}: ${text}` });
  }

  function walk(x: unknown, y: unknown, rel: string) {
    if (deepEqual(x, y)) return;
    const label = fieldLabel(table, rel);
    if (x === undefined) return push('added', rel, `${label.label} added: ${summarise(y, rel)}`);
    if (y === undefined) return push('removed', rel, `${label.label} removed (was ${summarise(x, rel)})`);
    if (Array.isArray(x) && Array.isArray(y)) {
      if (x.length !== y.length) {
        return push('changed', rel, `${groupName(rel)} ${x.length} → ${y.length} terms (${summarise(y, rel)})`);
      }
      x.forEach((v, k) => walk(v, y[k], `${rel}.${k}`));
      return;
    }
    if (isObject(x) && isObject(y)) {
      for (const discriminant of ['form', 'kind']) {
        if (discriminant in x && x[discriminant] !== y[discriminant]) {
          const inner = fieldLabel(table, join(rel, discriminant));
          return push('changed', rel, `${changedText('', inner, x[discriminant], y[discriminant])} (now ${summarise(y, rel)})`);
        }
      }
      const keys = new Set([...Object.keys(x), ...Object.keys(y)]);
      for (const key of keys) walk(x[key], y[key], join(rel, key));
      return;
    }
    push('changed', rel, changedText('', label, x, y));
  }

  /** "A1 2.101e+9 1/min, E1 80700 J/mol, …" from the labels of the leaves. */
  function summarise(v: unknown, rel: string): string {
    if (Array.isArray(v)) return v.map((e) => formatQuantity(e, fieldLabel(table, `${rel}.0`).unit)).join(', ');
    if (!isObject(v)) return formatQuantity(v, fieldLabel(table, rel).unit);
    return Object.entries(v)
      .filter(([key]) => key !== 'form' && key !== 'kind')
      .map(([key, e]) => {
        const l = fieldLabel(table, join(rel, key));
        return isObject(e) || Array.isArray(e) ? `${key} …` : `${l.label} ${formatQuantity(e, l.unit)}`;
      })
      .join(', ');
  }
}

function groupName(rel: string): string {
  if (rel.endsWith('prony.weights')) return 'Prony series weights:';
  if (rel.endsWith('prony.timesS')) return 'Prony series relaxation times:';
  if (rel.includes('cureTable')) return 'cure shift table:';
  return `${rel}:`;
}

function isObject(v: unknown): v is Json {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

function join(rel: string, key: string): string {
  return rel ? `${rel}.${key}` : key;
}

// --- layup -------------------------------------------------------------------------------------------------

type Ply = StudyParams['layup']['plies'][number];

function describePly(p: Ply): string {
  return `${formatQuantity(p.angleDeg, '°')}, ${formatQuantity(p.thicknessMm, 'mm')}`;
}

function totalThicknessMm(plies: Ply[]): number {
  return plies.reduce((s, p) => s + p.thicknessMm, 0);
}

function diffLayup(out: ParamChange[], a: Ply[], b: Ply[]) {
  if (deepEqual(a, b)) return;
  const lines: ParamChange[] = [];
  for (const pair of alignLists(a, b)) {
    if (pair.kind === 'same') continue;
    if (pair.kind === 'added') {
      lines.push({ area: 'layup', kind: 'added', path: `layup.plies.${pair.indexB}`, text: `Ply ${pair.indexB + 1} added: ${describePly(pair.b)}` });
    } else if (pair.kind === 'removed') {
      lines.push({ area: 'layup', kind: 'removed', path: `layup.plies.${pair.indexA}`, text: `Ply ${pair.indexA + 1} removed (was ${describePly(pair.a)})` });
    } else {
      const name = pair.indexA === pair.indexB ? `Ply ${pair.indexB + 1}` : `Ply ${pair.indexB + 1} (ply ${pair.indexA + 1} before)`;
      if (pair.a.angleDeg !== pair.b.angleDeg) {
        lines.push({ area: 'layup', kind: 'changed', path: `layup.plies.${pair.indexB}.angleDeg`, text: changedText(`${name}: `, { label: 'angle', unit: '°' }, pair.a.angleDeg, pair.b.angleDeg) });
      }
      if (pair.a.thicknessMm !== pair.b.thicknessMm) {
        lines.push({ area: 'layup', kind: 'changed', path: `layup.plies.${pair.indexB}.thicknessMm`, text: changedText(`${name}: `, { label: 'thickness', unit: 'mm' }, pair.a.thicknessMm, pair.b.thicknessMm) });
      }
    }
  }
  const countChanged = a.length !== b.length;
  const thicknessChanged = Math.abs(totalThicknessMm(a) - totalThicknessMm(b)) > 1e-9;
  if (countChanged || thicknessChanged) {
    out.push({
      area: 'layup',
      kind: 'changed',
      path: 'layup.plies',
      text: `Layup: ${a.length} → ${b.length} plies, laminate thickness ${formatQuantity(totalThicknessMm(a), 'mm')} → ${formatQuantity(totalThicknessMm(b), 'mm')}`,
    });
  }
  out.push(...lines.slice(0, MAX_PLY_LINES));
  if (lines.length > MAX_PLY_LINES) {
    const rest = lines.slice(MAX_PLY_LINES);
    const count = (k: ParamChange['kind']) => rest.filter((l) => l.kind === k).length;
    out.push({
      area: 'layup',
      kind: 'changed',
      path: 'layup.plies',
      text: `…and ${rest.length} more ply changes (${count('added')} added, ${count('removed')} removed, ${count('changed')} changed)`,
    });
  }
}

// --- cycle -------------------------------------------------------------------------------------------------

function describeCycle(c: StudyParams['cycle']): string {
  if (c.kind === 'segments') return `a schedule of ${c.segments.length} segments from ${formatQuantity(c.startC, '°C')}`;
  const last = c.points[c.points.length - 1];
  return `a measured record of ${c.points.length} points over ${formatQuantity(last.timeMin - c.points[0].timeMin, 'min')}`;
}

function diffCycle(out: ParamChange[], a: StudyParams['cycle'], b: StudyParams['cycle']) {
  if (deepEqual(a, b)) return;
  if (a.kind !== b.kind || a.kind === 'record' || b.kind === 'record') {
    const differing =
      a.kind === 'record' && b.kind === 'record'
        ? `; ${b.points.filter((p, k) => !deepEqual(p, a.points[k])).length} points differ`
        : '';
    out.push({ area: 'cycle', kind: 'changed', path: 'cycle', text: `Cycle: ${describeCycle(a)} → ${describeCycle(b)}${differing}` });
    return;
  }
  diffStudyField(out, 'cycle', 'cycle.startC', a.startC, b.startC);
  // Segments are named as on the cycle editor: A's names for what went, B's for what is there now.
  const namesA = segmentNames(a.segments);
  const namesB = segmentNames(b.segments);
  for (const pair of alignLists(a.segments, b.segments)) {
    if (pair.kind === 'same') continue;
    if (pair.kind === 'added') {
      out.push({ area: 'cycle', kind: 'added', path: `cycle.segments.${pair.indexB}`, text: `${namesB[pair.indexB]} added: ${describeSegmentSettings(pair.b)}` });
      continue;
    }
    if (pair.kind === 'removed') {
      out.push({ area: 'cycle', kind: 'removed', path: `cycle.segments.${pair.indexA}`, text: `${namesA[pair.indexA]} removed (was ${describeSegmentSettings(pair.a)})` });
      continue;
    }
    const nameA = namesA[pair.indexA];
    const nameB = namesB[pair.indexB];
    const path = `cycle.segments.${pair.indexB}`;
    if (pair.a.kind !== pair.b.kind) {
      const text = `${nameA} replaced by ${nameB}: ${describeSegmentSettings(pair.a)} → ${describeSegmentSettings(pair.b)}`;
      out.push({ area: 'cycle', kind: 'changed', path, text });
      continue;
    }
    const subject = `${nameB}${nameA === nameB ? '' : ` (${nameA} before)`}: `;
    const before = pair.a as Json;
    const after = pair.b as Json;
    for (const key of Object.keys(after)) {
      if (key === 'kind' || deepEqual(before[key], after[key])) continue;
      const text =
        key === 'start'
          ? `${subject}starts ${HOLD_START_WORDS[before[key] as 'clock']} → starts ${HOLD_START_WORDS[after[key] as 'clock']}`
          : changedText(subject, fieldLabel(FIELD_LABELS.segment, key), before[key], after[key]);
      out.push({ area: 'cycle', kind: 'changed', path: `${path}.${key}`, text });
    }
  }
}

// --- tool --------------------------------------------------------------------------------------------------

function describeTool(t: StudyParams['tool']): string {
  return t.kind === 'none' ? 'no tool plate' : `${t.name}, ${formatQuantity(t.thicknessMm, 'mm')}`;
}

function diffTool(out: ParamChange[], a: StudyParams['tool'], b: StudyParams['tool']) {
  if (deepEqual(a, b)) return;
  if (a.kind !== 'plate' || b.kind !== 'plate') {
    out.push({ area: 'tool', kind: a.kind === 'none' ? 'added' : b.kind === 'none' ? 'removed' : 'changed', path: 'tool', text: `Tool: ${describeTool(a)} → ${describeTool(b)}` });
    return;
  }
  for (const key of Object.keys(b) as (keyof typeof b)[]) {
    if (key === 'kind' || a[key] === b[key]) continue;
    out.push({ area: 'tool', kind: 'changed', path: `tool.${key}`, text: changedText('Tool: ', fieldLabel(FIELD_LABELS.tool, key), a[key], b[key]) });
  }
}
