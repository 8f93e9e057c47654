/**
 * `units` — dBm/mW/W, dBi, ERP↔EIRP, duty-cycle time averaging.
 * Reproduces: the definitions (dBm = 10·log10(P/1 mW), dBi = 10·log10(G); common practice); the
 * half-wave dipole gain 2.15 dBi ≈ 1.64 (Balanis, "Antenna Theory" — from memory;
 * also Table 1 to 47 CFR §1.1307(b)(3)(i)(C): EIRP = 1.64 × ERP);
 * the ±5 % power-drift figures +0.212 dB / −0.223 dB of a ±5 % drift, worked: 10·log10(1.05), 10·log10(0.95).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { dbiToLinear, dbmToMw, dbmToW, eirpDbmToErpDbm, eirpToErpW, erpDbmToEirpDbm, erpToEirpW, linearToDbi, mwToDbm, timeAveragedPowerW, units, unitsInput, wToDbm } from '../../calc/em/units';

const run = (raw: unknown) => units.compute(unitsInput.parse(raw));

describe('units: worked values', () => {
  const DEF = 'definition, common practice';
  const DIPOLE = 'half-wave dipole 2.15 dBi: 10^0.215 = 1.640590, from the 2.15 dB definition';
  it.each([
    { input: { conversion: 'dbm-to-mw', powerDbm: 0 }, key: 'powerMw', value: 1, source: DEF },
    { input: { conversion: 'dbm-to-mw', powerDbm: 20 }, key: 'powerMw', value: 100, source: DEF },
    { input: { conversion: 'dbm-to-mw', powerDbm: -30 }, key: 'powerMw', value: 0.001, source: DEF },
    { input: { conversion: 'mw-to-dbm', powerMw: 1000 }, key: 'powerDbm', value: 30, source: DEF },
    { input: { conversion: 'dbm-to-w', powerDbm: 30 }, key: 'powerW', value: 1, source: DEF },
    { input: { conversion: 'dbm-to-w', powerDbm: 33 }, key: 'powerW', value: 1.995262315, source: DEF },
    { input: { conversion: 'w-to-dbm', powerW: 2 }, key: 'powerDbm', value: 33.010299957, source: DEF },
    { input: { conversion: 'dbi-to-linear', gainDbi: 3 }, key: 'gainLinear', value: 1.995262315, source: DEF },
    { input: { conversion: 'linear-to-dbi', gainLinear: 10 }, key: 'gainDbi', value: 10, source: DEF },
    { input: { conversion: 'dbi-to-linear', gainDbi: 2.15 }, key: 'gainLinear', value: 1.64059, source: DIPOLE },
    { input: { conversion: 'erp-to-eirp', erpW: 1 }, key: 'eirpW', value: 1.64059, source: DIPOLE },
    { input: { conversion: 'eirp-to-erp', eirpW: 1.64059 }, key: 'erpW', value: 1, source: DIPOLE },
    { input: { conversion: 'time-averaged', peakPowerW: 2, dutyCycle: 0.25 }, key: 'timeAveragedPowerW', value: 0.5, source: 'P_avg = P_peak × duty cycle, common practice' },
  ])('$input.conversion → $key = $value ($source)', ({ input, key, value }) => {
    const r = run(input) as unknown as Record<string, number>;
    expect(r[key] / value).toBeCloseTo(1, 6);
  });

  it('EIRP = 1.64 × ERP to the 3 figures Table 1 to 47 CFR §1.1307(b)(3)(i)(C) uses, i.e. ERP = EIRP − 2.15 dB', () => {
    expect(erpToEirpW(1)).toBeCloseTo(1.64, 2);
    expect(erpDbmToEirpDbm(20)).toBe(22.15);
    expect(eirpDbmToErpDbm(22.15)).toBeCloseTo(20, 12);
    expect(wToDbm(erpToEirpW(0.1)) - wToDbm(0.1)).toBeCloseTo(2.15, 12);
  });

  it('±5 % power drift is +0.212 dB / −0.223 dB (IEC/IEEE 62209-1528:2020 system check and power drift)', () => {
    expect(mwToDbm(1.05)).toBeCloseTo(0.212, 3);
    expect(mwToDbm(0.95)).toBeCloseTo(-0.223, 3);
  });

  it('the derivation states formula, units and the dipole gain for ERP/EIRP (issue 3 output contract)', () => {
    const r = run({ conversion: 'erp-to-eirp', erpW: 2 });
    expect(r.derivation.formula).toBe('EIRP = ERP · 10^(2.15/10)');
    expect(r.derivation.inputs.erpW).toEqual({ value: 2, unit: 'W' });
    expect(r.derivation.intermediate.halfWaveDipoleGainDbi.value).toBe(2.15);
    expect(r.derivation.source).toMatch(/2\.15 dBi/);
  });
});

describe('units: bad input is named (issue 3 error contract)', () => {
  it('an unknown conversion lists the allowed ones', () => {
    const bad = unitsInput.safeParse({ conversion: 'dbm-to-kw', powerDbm: 1 });
    expect(bad.success).toBe(false);
    expect(bad.error!.issues[0].path).toEqual(['conversion']);
    expect(bad.error!.issues[0].message).toMatch(/dbm-to-mw/);
  });

  it.each([
    [{ conversion: 'mw-to-dbm', powerMw: 0 }, 'powerMw'],
    [{ conversion: 'w-to-dbm', powerW: -1 }, 'powerW'],
    [{ conversion: 'time-averaged', peakPowerW: 1, dutyCycle: 1.2 }, 'dutyCycle'],
    [{ conversion: 'time-averaged', peakPowerW: 1, dutyCycle: 0 }, 'dutyCycle'],
    [{ conversion: 'dbm-to-mw' }, 'powerDbm'],
  ])('%j is refused at %s', (input, field) => {
    const bad = unitsInput.safeParse(input);
    expect(bad.success).toBe(false);
    expect(bad.error!.issues[0].path).toEqual([field]);
  });
});

describe('units: round trips and monotonicity (fast-check; follow from the definitions)', () => {
  const dbm = fc.double({ min: -150, max: 90, noNaN: true });
  it('dBm → mW → dBm and dBm → W → dBm are identities; W = mW/1000', () => {
    fc.assert(
      fc.property(dbm, (p) => {
        expect(mwToDbm(dbmToMw(p))).toBeCloseTo(p, 9);
        expect(wToDbm(dbmToW(p))).toBeCloseTo(p, 9);
        expect(dbmToW(p) / (dbmToMw(p) / 1000)).toBeCloseTo(1, 12);
      }),
    );
  });

  it('dBi ↔ linear and ERP ↔ EIRP invert each other; EIRP > ERP', () => {
    fc.assert(
      fc.property(fc.double({ min: -40, max: 40, noNaN: true }), fc.double({ min: 1e-6, max: 1e6, noNaN: true }), (g, w) => {
        expect(linearToDbi(dbiToLinear(g))).toBeCloseTo(g, 9);
        expect(eirpToErpW(erpToEirpW(w)) / w).toBeCloseTo(1, 12);
        expect(erpToEirpW(w)).toBeGreaterThan(w);
      }),
    );
  });

  it('time-averaged power never exceeds the peak power', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1e3, noNaN: true }), fc.double({ min: 1e-6, max: 1, noNaN: true }), (p, dc) => {
        expect(timeAveragedPowerW(p, dc)).toBeLessThanOrEqual(p);
      }),
    );
  });
});
