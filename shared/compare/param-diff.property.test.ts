import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { referenceStudy } from '../solver/demo-cards';
import { paramDiff } from './param-diff';

// Property: change any one number anywhere in the reference study and the diff names exactly that field (by
// its path) once, as a change from the old value to the new one; nothing else is reported except the layup
// total when a ply's thickness moves.

type Leaf = { path: (string | number)[] };

function numericLeaves(value: unknown, path: (string | number)[] = []): Leaf[] {
  if (typeof value === 'number') return [{ path }];
  if (Array.isArray(value)) return value.flatMap((v, i) => numericLeaves(v, [...path, i]));
  if (value && typeof value === 'object') return Object.entries(value).flatMap(([k, v]) => numericLeaves(v, [...path, k]));
  return [];
}

function setAt(root: unknown, path: (string | number)[], v: number) {
  let node = root as Record<string | number, unknown>;
  for (const key of path.slice(0, -1)) node = node[key] as Record<string | number, unknown>;
  node[path[path.length - 1]] = v;
}

function getAt(root: unknown, path: (string | number)[]): number {
  return path.reduce<unknown>((node, key) => (node as Record<string | number, unknown>)[key], root) as number;
}

describe('paramDiff on one edited number', () => {
  const leaves = numericLeaves(referenceStudy()).filter((l) => l.path[0] !== 'schemaVersion');

  it('names exactly that field, once, with before and after', () => {
    fc.assert(
      fc.property(fc.constantFrom(...leaves), fc.double({ min: 0.5, max: 1.5, noNaN: true }), fc.integer({ min: 1, max: 9 }), (leaf, factor, offset) => {
        const a = referenceStudy();
        const b = structuredClone(a);
        const before = getAt(a, leaf.path);
        // A value that certainly differs (offset keeps zero-valued fields from staying zero).
        const after = before === 0 ? offset / 10 : Number((before * factor + (factor === 1 ? offset : 0)).toPrecision(6));
        fc.pre(after !== before);
        setAt(b, leaf.path, after);
        const path = leaf.path.join('.');
        const changes = paramDiff(a, b);
        const named = changes.filter((c) => c.path === path);
        expect(named, `${path}: ${JSON.stringify(changes)}`).toHaveLength(1);
        expect(named[0].kind).toBe('changed');
        expect(named[0].text).toContain('→');
        const others = changes.filter((c) => c.path !== path);
        expect(others.every((c) => c.path === 'layup.plies' && path.endsWith('thicknessMm')), JSON.stringify(others)).toBe(true);
      }),
      { numRuns: 300 },
    );
  });
});
