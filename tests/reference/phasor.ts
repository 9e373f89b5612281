/**
 * Phasor arithmetic for the reference tests, written on the test side on purpose: the checks
 * against ngspice must not lean on the engine's own core/physics/complex.ts.
 */
import type { Phasor } from './ngspice.ts';

export const cmul = (a: Phasor, b: Phasor): Phasor => ({ re: a.re * b.re - a.im * b.im, im: a.re * b.im + a.im * b.re });
export const cconj = (a: Phasor): Phasor => ({ re: a.re, im: -a.im });
export const cneg = (a: Phasor): Phasor => ({ re: -a.re, im: -a.im });
export const cabs = (a: Phasor): number => Math.hypot(a.re, a.im);
export const cargDeg = (a: Phasor): number => (Math.atan2(a.im, a.re) * 180) / Math.PI;
/** Complex power V·conj(I). */
export const power = (v: Phasor, i: Phasor): Phasor => cmul(v, cconj(i));
export const csum = (...xs: Phasor[]): Phasor => xs.reduce((s, x) => ({ re: s.re + x.re, im: s.im + x.im }), { re: 0, im: 0 });
