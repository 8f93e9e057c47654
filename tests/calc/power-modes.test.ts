/**
 * Power-reduction modes: in a use position where a transmitter reduces its tune-up power (hotspot
 * back-off, proximity sensor, time-averaged SAR limit), screening evaluates that reduced power and
 * the row names the mode; elsewhere the maximum applies.
 *
 * Expected values are hand-computed from 47 CFR §1.1307(b)(3)(i)(B) (FCC 19-126), formulas (B.1)
 * and (B.2): for 1.5 ≤ f ≤ 6 GHz, ERP_20cm = 3060 mW, x = −log10(60 / (ERP_20cm · √f)) (f in GHz),
 * P_th = ERP_20cm · (d / 20 cm)^x. At 2.45 GHz: x = −log10(60 / (3060 · 1.565248)) = 1.902153;
 * d = 1 cm → P_th = 3060 · 0.05^1.902153 = 10.26 mW. With 0 dBi gain the ERP is below the
 * time-averaged power, so (B) compares the time-averaged power P_avg = 10^(P_dBm/10) mW × duty.
 *
 * Hand-computed: full power 13 dBm = 19.95 mW → margin 10·log10(10.26 / 19.95) = −2.89 dB (SAR
 * evaluation needed); hotspot back-off to 9 dBm = 7.943 mW → margin 10·log10(10.26 / 7.943) =
 * +1.11 dB (exempt).
 */
import { describe, expect, it } from 'vitest';
import { screenDevice, screeningInput } from '../../calc/screening';

const pTh1cm = 3060 * (1 / 20) ** -Math.log10(60 / (3060 * Math.sqrt(2.45)));

const device = (powerModes?: { transmitterId: string; reducedTuneUpPowerDbm: number; trigger: 'hotspot-back-off' | 'proximity-sensor' | 'time-averaged-sar' }[]) => ({
  markets: [{ regime: 'fcc' as const, tier: 'general' as const }],
  antennas: [{ id: 'A', gainDbi: 0 }],
  transmitters: [{ id: 'LTE', frequencyMinHz: 2.45e9, frequencyMaxHz: 2.45e9, maxTuneUpPowerDbm: 13, dutyCycle: 1, antennaId: 'A' }],
  usePositions: [
    { id: 'hotspot-back', kind: 'hotspot' as const, separations: [{ antennaId: 'A', separationM: 0.01 }], ...(powerModes ? { powerModes } : {}) },
    { id: 'body', kind: 'body-worn' as const, separations: [{ antennaId: 'A', separationM: 0.01 }] },
  ],
});

describe('power-reduction modes in screening', () => {
  it('the hand-computed threshold this file relies on (§1.1307(b)(3)(i)(B), 2.45 GHz, 1 cm)', () => {
    expect(pTh1cm).toBeCloseTo(10.26, 2);
  });

  it('full power everywhere: 13 dBm at 10 mm needs SAR (margin −2.89 dB); the rows say "full"', () => {
    const { rows } = screenDevice(device());
    expect(rows.map((r) => r.powerMode)).toEqual(['full', 'full']);
    expect(rows[0]).toMatchObject({ result: 'evaluate-sar' });
    expect(rows[0].marginDb!).toBeCloseTo(-2.89, 2);
    expect(rows[0].marginDb!).toBeCloseTo(10 * Math.log10(pTh1cm / 10 ** 1.3), 9);
  });

  it('a hotspot back-off to 9 dBm makes the hotspot position exempt (+1.11 dB); the body position keeps full power', () => {
    const { rows } = screenDevice(device([{ transmitterId: 'LTE', reducedTuneUpPowerDbm: 9, trigger: 'hotspot-back-off' }]));
    const [hotspot, body] = rows;
    expect(hotspot).toMatchObject({ usePositionId: 'hotspot-back', powerMode: 'hotspot-back-off', result: 'exempt' });
    expect(hotspot.powers.tuneUpPowerMw).toBeCloseTo(7.943, 3);
    expect(hotspot.marginDb!).toBeCloseTo(1.11, 2);
    expect(hotspot.marginDb!).toBeCloseTo(10 * Math.log10(pTh1cm / 10 ** 0.9), 9);
    expect(hotspot.derivation.inputs.maxTuneUpPowerDbm).toEqual({ value: 13, unit: 'dBm' });
    expect(hotspot.derivation.inputs.reducedTuneUpPowerDbm).toEqual({ value: 9, unit: 'dBm' });
    expect(hotspot.derivation.formula).toMatch(/10\^\(P_reduced,dBm\/10\)/);
    expect(hotspot.derivation.notes.join(' ')).toMatch(/hotspot back-off .* 9 dBm instead of its maximum 13 dBm.*KDB 941225 D06.*from memory/);
    expect(body).toMatchObject({ usePositionId: 'body', powerMode: 'full', result: 'evaluate-sar' });
    expect(body.derivation.inputs.reducedTuneUpPowerDbm).toBeUndefined();
  });

  it('a reduction that is not below the maximum, an unknown transmitter or two modes for one transmitter are refused at their paths', () => {
    const same = screeningInput.safeParse(device([{ transmitterId: 'LTE', reducedTuneUpPowerDbm: 13, trigger: 'proximity-sensor' }]));
    expect(same.success).toBe(false);
    expect(same.error!.issues[0]).toMatchObject({ path: ['usePositions', 0, 'powerModes', 0, 'reducedTuneUpPowerDbm'] });
    const unknown = screeningInput.safeParse(device([{ transmitterId: 'GONE', reducedTuneUpPowerDbm: 5, trigger: 'proximity-sensor' }]));
    expect(unknown.error!.issues[0].message).toMatch(/unknown transmitter id "GONE"/);
    const twice = screeningInput.safeParse(
      device([
        { transmitterId: 'LTE', reducedTuneUpPowerDbm: 9, trigger: 'hotspot-back-off' },
        { transmitterId: 'LTE', reducedTuneUpPowerDbm: 8, trigger: 'time-averaged-sar' },
      ]),
    );
    expect(twice.error!.issues[0]).toMatchObject({ path: ['usePositions', 0, 'powerModes', 1, 'transmitterId'] });
  });
});
