/** Figures as the wizard shows them: display units, sensible digits, the unit always beside. */

/** 4 significant digits, without exponent noise for everyday magnitudes. */
export function sig(x: number, digits = 4): string {
  if (!Number.isFinite(x)) return '—';
  if (x === 0) return '0';
  const abs = Math.abs(x);
  if (abs >= 1e-3 && abs < 1e7) return String(Number(x.toPrecision(digits)));
  return x.toExponential(digits - 1).replace('e+', 'e');
}

export const formatMhz = (hz: number) => `${sig(hz / 1e6, 6)} MHz`;
export const formatMw = (mw: number) => `${sig(mw)} mW`;
export const formatMm = (m: number) => `${sig(m * 1000)} mm`;
/** Margin in dB, one decimal; within ±0.05 dB of the threshold, two significant digits so it never reads "−0.0 dB". */
export function formatDb(db: number | null): string {
  if (db === null) return '—';
  const sign = db >= 0 ? '+' : '−';
  const abs = Math.abs(db);
  if (abs === 0) return '+0 dB';
  return `${sign}${abs < 0.05 ? sig(abs, 2) : abs.toFixed(1)} dB`;
}

/** A derivation quantity: "1.234 W/kg", text as it is, "Hz" shown as MHz. */
export function formatQuantity(value: number | string | boolean | null, unit: string): string {
  if (value === null) return '—';
  if (typeof value !== 'number') return String(value);
  if (unit === 'Hz') return formatMhz(value);
  // Separations are stored in m but entered in mm: show both.
  if (unit === 'm' && Math.abs(value) < 1) return `${sig(value)} m (${formatMm(value)})`;
  if (unit === '1' || unit === 'text' || !unit) return sig(value);
  return `${sig(value)} ${unit}`;
}

export const timeOfDay = (iso: string | Date) => new Date(iso).toLocaleTimeString('en-GB', { hour: '2-digit', minute: '2-digit' });
