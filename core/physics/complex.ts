/**
 * Minimal complex arithmetic for phasors (rectangular form). Immutable plain objects.
 * Checked against complex.js in tests/core/complex.test.ts.
 */
export interface Complex {
  readonly re: number;
  readonly im: number;
}

export const ZERO: Complex = { re: 0, im: 0 };

export const c = (re: number, im = 0): Complex => ({ re, im });
export const add = (a: Complex, b: Complex): Complex => ({ re: a.re + b.re, im: a.im + b.im });
export const sub = (a: Complex, b: Complex): Complex => ({ re: a.re - b.re, im: a.im - b.im });
export const mul = (a: Complex, b: Complex): Complex => ({
  re: a.re * b.re - a.im * b.im,
  im: a.re * b.im + a.im * b.re,
});
export const scale = (a: Complex, k: number): Complex => ({ re: a.re * k, im: a.im * k });
export const conj = (a: Complex): Complex => ({ re: a.re, im: -a.im });
/**
 * |a|. √(re² + im²) where the squares neither overflow nor underflow (much faster than Math.hypot
 * in V8); Math.hypot, which scales, outside that range.
 */
export const abs = (a: Complex): number => {
  const s = a.re * a.re + a.im * a.im;
  return s > 1e-290 && s < 1e290 ? Math.sqrt(s) : Math.hypot(a.re, a.im);
};
export const arg = (a: Complex): number => Math.atan2(a.im, a.re);

/** a / b; b must not be zero. */
export function div(a: Complex, b: Complex): Complex {
  const d = b.re * b.re + b.im * b.im;
  return { re: (a.re * b.re + a.im * b.im) / d, im: (a.im * b.re - a.re * b.im) / d };
}

/** r·e^{jθ}. */
export const polar = (r: number, theta: number): Complex => ({ re: r * Math.cos(theta), im: r * Math.sin(theta) });
