/**
 * A small immutable complex-number toolkit for the field solvers (no dependency on purpose:
 * calc/ imports nothing but zod). Principal branches throughout.
 */

export interface Complex {
  re: number;
  im: number;
}

export const complex = (re: number, im = 0): Complex => ({ re, im });

export const ZERO: Complex = complex(0, 0);
export const ONE: Complex = complex(1, 0);

export const add = (a: Complex, b: Complex): Complex => complex(a.re + b.re, a.im + b.im);
export const sub = (a: Complex, b: Complex): Complex => complex(a.re - b.re, a.im - b.im);
export const mul = (a: Complex, b: Complex): Complex => complex(a.re * b.re - a.im * b.im, a.re * b.im + a.im * b.re);
export const scale = (a: Complex, k: number): Complex => complex(a.re * k, a.im * k);
export const conj = (a: Complex): Complex => complex(a.re, -a.im);
export const abs = (a: Complex): number => Math.hypot(a.re, a.im);
export const abs2 = (a: Complex): number => a.re * a.re + a.im * a.im;
export const arg = (a: Complex): number => Math.atan2(a.im, a.re);

/** a / b, scaled (Smith's method) so that large or small moduli do not overflow. */
export function div(a: Complex, b: Complex): Complex {
  if (Math.abs(b.re) >= Math.abs(b.im)) {
    const r = b.im / b.re;
    const d = b.re + b.im * r;
    return complex((a.re + a.im * r) / d, (a.im - a.re * r) / d);
  }
  const r = b.re / b.im;
  const d = b.re * r + b.im;
  return complex((a.re * r + a.im) / d, (a.im * r - a.re) / d);
}

/** Principal square root (Re ≥ 0), computed without cancellation. */
export function sqrt(a: Complex): Complex {
  if (a.re === 0 && a.im === 0) return ZERO;
  const m = abs(a);
  if (a.re >= 0) {
    const t = Math.sqrt((m + a.re) / 2);
    return complex(t, a.im / (2 * t));
  }
  const t = Math.sqrt((m - a.re) / 2);
  return complex(Math.abs(a.im) / (2 * t), a.im >= 0 ? t : -t);
}

/** e^a */
export function exp(a: Complex): Complex {
  const m = Math.exp(a.re);
  return complex(m * Math.cos(a.im), m * Math.sin(a.im));
}

/** Principal power a^p for real p (used by the Cole-Cole terms). */
export function powReal(a: Complex, p: number): Complex {
  if (a.re === 0 && a.im === 0) return ZERO;
  const m = Math.pow(abs(a), p);
  const t = arg(a) * p;
  return complex(m * Math.cos(t), m * Math.sin(t));
}

/** Plain JSON shape for results, e.g. intrinsicImpedanceOhm: {re, im}. */
export const toJson = (a: Complex): Complex => ({ re: a.re, im: a.im });
