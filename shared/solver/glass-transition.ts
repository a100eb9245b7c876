import type { ResinCard } from '../schemas/study';
import { cToK } from '../units';

// Glass transition temperature against degree of cure, DiBenedetto equation in the Pascault–Williams form
// (DiBenedetto 1987; Pascault & Williams, J. Polym. Sci. B 28, 1990):
//   (Tg − Tg0)/(Tg∞ − Tg0) = λα / (1 − (1 − λ)α)
// and the cure state of the resin: gelled once α reaches the card's gel point, vitrified while T < Tg(α).

export interface GlassTransitionK {
  /** Tg of the uncured resin, K */
  tg0K: number;
  /** Tg of the fully cured resin, K */
  tgInfK: number;
  /** λ = ΔCp∞/ΔCp0, in (0, 1] */
  lambda: number;
}

/** Card values (°C) to kelvin, checked once at entry. */
export function prepareGlassTransition(card: ResinCard['glassTransition']): GlassTransitionK {
  const g = { tg0K: cToK(card.tg0C), tgInfK: cToK(card.tgInfC), lambda: card.lambda };
  if (!Number.isFinite(g.tg0K) || !Number.isFinite(g.tgInfK) || !(g.tgInfK > g.tg0K)) {
    throw new RangeError(
      `glassTransition.tgInfC: ${String(card.tgInfC)} °C is out of range: allowed > tg0C (${String(card.tg0C)} °C)`,
    );
  }
  if (!(g.lambda > 0 && g.lambda <= 1)) {
    throw new RangeError(`glassTransition.lambda: ${String(card.lambda)} is out of range: allowed > 0 and ≤ 1`);
  }
  return g;
}

/** Tg(α) in kelvin (DiBenedetto, Pascault–Williams form); α is clamped to [0, 1]. */
export function glassTransitionK(alpha: number, g: GlassTransitionK): number {
  const a = alpha < 0 ? 0 : alpha > 1 ? 1 : alpha;
  return g.tg0K + ((g.tgInfK - g.tg0K) * g.lambda * a) / (1 - (1 - g.lambda) * a);
}

/**
 * Degree of cure at which Tg reaches TK (the inverse of the DiBenedetto form): the resin vitrifies at TK
 * once α passes this. 0 when TK ≤ Tg0 (glassy from the start), 1 when TK ≥ Tg∞ (never vitrifies at TK).
 */
export function alphaAtGlassTransition(TK: number, g: GlassTransitionK): number {
  const x = (TK - g.tg0K) / (g.tgInfK - g.tg0K);
  if (x <= 0) return 0;
  if (x >= 1) return 1;
  return x / (g.lambda + (1 - g.lambda) * x);
}

/** Gelled once α reaches the gel point: from then on the resin can carry stress. */
export function isGelled(alpha: number, gelPoint: number): boolean {
  return alpha >= gelPoint;
}

/** Vitrified (glassy) while the temperature is below the current Tg. */
export function isVitrified(TK: number, tgK: number): boolean {
  return TK < tgK;
}

export type CureState = 'liquid' | 'rubber' | 'ungelled-glass' | 'glass';

/**
 * Resin state in the time–temperature–transformation sense: liquid (not gelled, above Tg), rubber (gelled,
 * above Tg), ungelled glass (below Tg before gel), glass (gelled and below Tg).
 */
export function cureState(alpha: number, TK: number, g: GlassTransitionK, gelPoint: number): CureState {
  const gelled = isGelled(alpha, gelPoint);
  const glassy = isVitrified(TK, glassTransitionK(alpha, g));
  if (glassy) return gelled ? 'glass' : 'ungelled-glass';
  return gelled ? 'rubber' : 'liquid';
}
