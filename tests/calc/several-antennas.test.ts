/**
 * A transmitter with several antennas: every antenna × use position is screened with the
 * antenna's own gain and separation, and the row reports the least favourable antenna by name.
 * MIMO streams on one band add their powers (FCC KDB 662911 D01 sums the outputs' powers in one
 * band — from memory; evaluating the sum at each antenna is a conservative screening, common
 * practice); switched antennas transmit one at a time.
 *
 * Expected values are hand-computed from 47 CFR §1.1307(b)(3)(i)(B) (FCC 19-126), formulas (B.1)
 * and (B.2): for 1.5 ≤ f ≤ 6 GHz, ERP_20cm = 3060 mW, x = −log10(60 / (ERP_20cm · √f)) (f in GHz),
 * P_th = ERP_20cm · (d / 20 cm)^x. At 2.45 GHz: x = −log10(60 / (3060 · 1.565248)) = 1.902153;
 * d = 1 cm → P_th = 10.26 mW; d = 0.5 cm → P_th = 2.744 mW. With 0 dBi gain the ERP is below the
 * time-averaged power, so (B) compares the time-averaged power.
 */
import { describe, expect, it } from 'vitest';
import { screenDevice } from '../../calc/screening';

const pTh = (dCm: number) => {
  const x = -Math.log10(60 / (3060 * Math.sqrt(2.45)));
  return 3060 * (dCm / 20) ** x;
};

const device = (antennaUse: 'mimo' | 'switched', seps: [number, number]) => ({
  markets: [{ regime: 'fcc' as const, tier: 'general' as const }],
  antennas: [
    { id: 'A', gainDbi: 0 },
    { id: 'B', gainDbi: 0 },
  ],
  // 10 dBm = 10 mW per stream, one frequency, continuous.
  transmitters: [{ id: 'WLAN', frequencyMinHz: 2.45e9, frequencyMaxHz: 2.45e9, maxTuneUpPowerDbm: 10, dutyCycle: 1, antennaId: 'A', moreAntennaIds: ['B'], antennaUse }],
  usePositions: [
    {
      id: 'body',
      kind: 'body-worn' as const,
      separations: [
        { antennaId: 'A', separationM: seps[0] },
        { antennaId: 'B', separationM: seps[1] },
      ],
    },
  ],
});

describe('several antennas on one transmitter', () => {
  it('the hand-computed thresholds (§1.1307(b)(3)(i)(B)) this file relies on', () => {
    expect(pTh(1)).toBeCloseTo(10.26, 2);
    expect(pTh(0.5)).toBeCloseTo(2.744, 3);
  });

  it('MIMO: two 10 mW streams add to 20 mW at each antenna; B at 5 mm is the least favourable', () => {
    const [row] = screenDevice(device('mimo', [0.01, 0.005])).rows;
    expect(row).toMatchObject({ antennaId: 'B', antennaCount: 2, separationM: 0.005, result: 'evaluate-sar' });
    expect(row.powers.tuneUpPowerMw).toBeCloseTo(20, 9);
    // margin = 10·log10(2.744 / 20) = −8.63 dB
    expect(row.marginDb).toBeCloseTo(10 * Math.log10(pTh(0.5) / 20), 6);
    expect(row.marginDb!).toBeCloseTo(-8.63, 2);
    expect(row.derivation.inputs.mimoStreams.value).toBe(2);
    expect(row.derivation.notes.join(' ')).toMatch(
      /MIMO: 2 streams at once, powers added.*least favourable, B.*A at 10 mm: SAR evaluation needed, margin -2\.90 dB; B at 5 mm: SAR evaluation needed, margin -8\.63 dB/,
    );
  });

  it('switched: one antenna at a time at 10 mW; A at 10 mm would be exempt (+0.11 dB), B at 5 mm is not', () => {
    const [row] = screenDevice(device('switched', [0.01, 0.005])).rows;
    expect(row).toMatchObject({ antennaId: 'B', result: 'evaluate-sar' });
    expect(row.powers.tuneUpPowerMw).toBeCloseTo(10, 9);
    expect(row.marginDb!).toBeCloseTo(10 * Math.log10(pTh(0.5) / 10), 6);
    expect(row.derivation.notes.join(' ')).toMatch(/switched: one at a time.*A at 10 mm: exempt, margin 0\.11 dB/);
    expect(row.derivation.inputs.mimoStreams).toBeUndefined();
  });

  it('an antenna closer than any formula covers (3 mm, under the 0.5 cm of (B)) is less favourable than one with a negative margin', () => {
    const [row] = screenDevice(device('mimo', [0.01, 0.003])).rows;
    expect(row).toMatchObject({ antennaId: 'B', separationM: 0.003, result: 'evaluate-sar', marginDb: null });
  });

  it('the first antenna is reported when it is the closer one', () => {
    const [row] = screenDevice(device('switched', [0.005, 0.01])).rows;
    expect(row.antennaId).toBe('A');
  });

  it('an antenna without a separation makes the combination a gap that names it, never a guess', () => {
    const input = device('mimo', [0.01, 0.005]);
    input.usePositions[0].separations = [{ antennaId: 'A', separationM: 0.01 }];
    const out = screenDevice(input);
    expect(out.rows).toEqual([]);
    expect(out.gaps[0].message).toMatch(/no separation for antenna "B" of transmitter "WLAN"/);
  });

  it('one antenna: rows as before, with the antenna named', () => {
    const out = screenDevice({ ...device('mimo', [0.01, 0.005]), transmitters: [{ id: 'WLAN', frequencyMinHz: 2.45e9, frequencyMaxHz: 2.45e9, maxTuneUpPowerDbm: 10, dutyCycle: 1, antennaId: 'A' }] });
    expect(out.rows[0]).toMatchObject({ antennaId: 'A', antennaCount: 1, result: 'exempt' });
    expect(out.rows[0].marginDb!).toBeCloseTo(10 * Math.log10(pTh(1) / 10), 6);
  });
});
