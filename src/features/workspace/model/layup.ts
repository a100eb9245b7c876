/** Ply stacks: presets, mirroring, reordering. Ply 1 is the tool-side ply. */
export type Ply = { angleDeg: number; thicknessMm: number };

/** The study schema's ply limit (shared/schemas/study.ts, layup.plies max), for disabling actions before they fail. */
export const MAX_PLIES = 200;

export type LayupPreset = 'quasi-isotropic' | 'cross-ply' | 'unsymmetric';

export const presetLabels: Record<LayupPreset, string> = {
  'quasi-isotropic': 'Quasi-isotropic [0/45/−45/90]ns',
  'cross-ply': 'Cross-ply [0/90]ns',
  unsymmetric: 'Unsymmetric [0n/90n]',
};

/** The nearest ply count the preset can make (at least one full repeat). */
export function presetPlyCount(preset: LayupPreset, wanted: number): number {
  const unit = preset === 'quasi-isotropic' ? 8 : preset === 'cross-ply' ? 4 : 2;
  return Math.max(unit, Math.round(wanted / unit) * unit);
}

export function presetPlies(preset: LayupPreset, wanted: number, thicknessMm: number): Ply[] {
  const count = presetPlyCount(preset, wanted);
  const half = count / 2;
  let angles: number[];
  if (preset === 'unsymmetric') {
    angles = [...Array(half).fill(0), ...Array(half).fill(90)];
  } else {
    const repeat = preset === 'quasi-isotropic' ? [0, 45, -45, 90] : [0, 90];
    const lower = Array.from({ length: half }, (_, i) => repeat[i % repeat.length]);
    angles = [...lower, ...lower.slice().reverse()];
  }
  return angles.map((angleDeg) => ({ angleDeg, thicknessMm }));
}

/** The stack followed by its mirror image: symmetric about the new mid-plane. */
export function mirrored(plies: readonly Ply[]): Ply[] {
  return [...plies.map((p) => ({ ...p })), ...plies.slice().reverse().map((p) => ({ ...p }))];
}

/**
 * The tool-side half kept and mirrored onto the bag side: the same ply count, symmetric about its mid-plane.
 * With an odd count the middle ply stays and is its own mirror.
 */
export function mirroredToolSideHalf(plies: readonly Ply[]): Ply[] {
  const keep = plies.slice(0, Math.ceil(plies.length / 2)).map((p) => ({ ...p }));
  const mirror = plies.slice(0, Math.floor(plies.length / 2)).reverse().map((p) => ({ ...p }));
  return [...keep, ...mirror];
}

export function isSymmetric(plies: readonly Ply[]): boolean {
  const n = plies.length;
  for (let i = 0; i < n / 2; i++) {
    const a = plies[i];
    const b = plies[n - 1 - i];
    if (a.angleDeg !== b.angleDeg || a.thicknessMm !== b.thicknessMm) return false;
  }
  return true;
}

export function totalThicknessMm(plies: readonly Ply[]): number {
  return plies.reduce((s, p) => s + p.thicknessMm, 0);
}

/** Short code of a stack, tool side first: "0/45/−45/90/90/−45/45/0". */
export function stackCode(plies: readonly Ply[]): string {
  return plies.map((p) => String(p.angleDeg).replace('-', '−')).join('/');
}
