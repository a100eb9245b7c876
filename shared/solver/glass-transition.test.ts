import { describe, expect, it } from 'vitest';
import { alphaAtGlassTransition, cureState, glassTransitionK, isGelled, isVitrified, prepareGlassTransition } from './glass-transition';
import { expectClose } from './test-support/expect-close';

const C0 = 273.15;
const g = prepareGlassTransition({ tg0C: -20, tgInfC: 220, lambda: 0.5 });

describe('DiBenedetto glass transition', () => {
  it('Tg0 −20 °C, Tg∞ 220 °C, λ 0.5: Tg = 60.000, 140.000, 176.364 °C at α = 0.5, 0.8, 0.9', () => {
    // closed form, DiBenedetto in the Pascault–Williams form (Pascault & Williams 1990)
    expectClose(glassTransitionK(0.5, g) - C0, 60.0, 0, 5e-4);
    expectClose(glassTransitionK(0.8, g) - C0, 140.0, 0, 5e-4);
    expectClose(glassTransitionK(0.9, g) - C0, 176.364, 0, 5e-4);
  });

  it('runs from Tg0 at α = 0 to Tg∞ at α = 1 and λ = 1 makes it linear', () => {
    // limits of the Pascault–Williams form (λ = 1: linear in α)
    expectClose(glassTransitionK(0, g), -20 + C0, 1e-12);
    expectClose(glassTransitionK(1, g), 220 + C0, 1e-12);
    const linear = prepareGlassTransition({ tg0C: 0, tgInfC: 200, lambda: 1 });
    expectClose(glassTransitionK(0.37, linear) - C0, 74, 1e-9);
  });

  it('alphaAtGlassTransition inverts Tg(α)', () => {
    // the inverse of the same closed form; at 140 °C the resin vitrifies at α = 0.8 (closed form)
    expectClose(alphaAtGlassTransition(140 + C0, g), 0.8, 1e-9);
    expect(alphaAtGlassTransition(-30 + C0, g)).toBe(0);
    expect(alphaAtGlassTransition(250 + C0, g)).toBe(1);
  });

  it('gel and vitrification states follow the gel point and T < Tg(α)', () => {
    // Gelled at α_gel; vitrified when T < Tg(α)
    expect(isGelled(0.49, 0.5)).toBe(false);
    expect(isGelled(0.5, 0.5)).toBe(true);
    expect(isVitrified(100 + C0, 140 + C0)).toBe(true);
    expect(cureState(0.2, 150 + C0, g, 0.5)).toBe('liquid');
    expect(cureState(0.6, 150 + C0, g, 0.5)).toBe('rubber');
    expect(cureState(0.9, 150 + C0, g, 0.5)).toBe('glass');
    expect(cureState(0.1, -15 + C0, g, 0.5)).toBe('ungelled-glass');
  });

  it('refuses Tg∞ ≤ Tg0 and λ outside (0, 1] naming the field', () => {
    expect(() => prepareGlassTransition({ tg0C: 100, tgInfC: 90, lambda: 0.5 })).toThrow(/glassTransition\.tgInfC: 90 °C/);
    expect(() => prepareGlassTransition({ tg0C: 0, tgInfC: 90, lambda: 0 })).toThrow(/glassTransition\.lambda: 0 /);
  });
});
