/**
 * Band presets against the tables they cite, for a sample of bands, and the downlink / duplex-gap
 * warnings for typed ranges.
 */
import { describe, expect, it } from 'vitest';
import { BAND_PRESETS, bandRangeWarnings, findBandPreset } from '../../constants/band-presets';

const ul = (key: string) => {
  const b = findBandPreset(key)!;
  return [b.ulMinMhz, b.ulMaxMhz, b.dlMinMhz ?? null, b.dlMaxMhz ?? null];
};

describe('cellular presets', () => {
  it('LTE uplinks and downlinks as in 3GPP TS 36.101 Table 5.5-1', () => {
    // TS 36.101 Table 5.5-1: band 2 UL 1850–1910, DL 1930–1990 MHz (FDD).
    expect(ul('lte-2')).toEqual([1850, 1910, 1930, 1990]);
    // Band 12 UL 699–716, DL 729–746 MHz.
    expect(ul('lte-12')).toEqual([699, 716, 729, 746]);
    // Band 13 is reverse duplex: UL 777–787 above DL 746–756 MHz.
    expect(ul('lte-13')).toEqual([777, 787, 746, 756]);
    // Band 66 UL 1710–1780, DL 2110–2200 MHz.
    expect(ul('lte-66')).toEqual([1710, 1780, 2110, 2200]);
    // Band 71 UL 663–698, DL 617–652 MHz.
    expect(ul('lte-71')).toEqual([663, 698, 617, 652]);
    // Band 41 TDD 2496–2690 MHz.
    expect(ul('lte-41')).toEqual([2496, 2690, null, null]);
  });

  it('NR bands as in 3GPP TS 38.101-1 Table 5.2-1 and TS 38.101-2 Table 5.2-1', () => {
    // TS 38.101-1 Table 5.2-1: n77 TDD 3300–4200, n78 TDD 3300–3800, n79 TDD 4400–5000 MHz.
    expect(ul('nr-n77')).toEqual([3300, 4200, null, null]);
    expect(ul('nr-n78')).toEqual([3300, 3800, null, null]);
    expect(ul('nr-n79')).toEqual([4400, 5000, null, null]);
    // n71 UL 663–698, DL 617–652 MHz; n66 UL 1710–1780, DL 2110–2200 MHz.
    expect(ul('nr-n71')).toEqual([663, 698, 617, 652]);
    expect(ul('nr-n66')).toEqual([1710, 1780, 2110, 2200]);
    // TS 38.101-2 Table 5.2-1: n261 27500–28350 MHz, n260 37000–40000 MHz.
    expect(ul('nr-n261')).toEqual([27500, 28350, null, null]);
    expect(ul('nr-n260')).toEqual([37000, 40000, null, null]);
  });

  it('never offers a downlink-only band as a transmit range', () => {
    // TS 36.101 Table 5.5-1: band 29 is downlink only (UL "N/A").
    expect(BAND_PRESETS.some((b) => b.key === 'lte-29')).toBe(false);
  });
});

describe('Wi-Fi and Bluetooth presets', () => {
  it('match the channel-centre formulas of the IEEE 802.11 channel plans', () => {
    // IEEE Std 802.11-2020, 2.4 GHz: centre = 2407 + 5·n MHz → ch 1 = 2412, ch 11 = 2462, ch 13 = 2472.
    const centre24 = (n: number) => 2407 + 5 * n;
    expect(ul('wifi-2g4-us').slice(0, 2)).toEqual([centre24(1), centre24(11)]);
    expect(ul('wifi-2g4-13').slice(0, 2)).toEqual([centre24(1), centre24(13)]);
    // 5 GHz: centre = 5000 + 5·n MHz → ch 36 = 5180, ch 48 = 5240, ch 100 = 5500, ch 144 = 5720, ch 165 = 5825.
    const centre5 = (n: number) => 5000 + 5 * n;
    expect(ul('wifi-unii-1').slice(0, 2)).toEqual([centre5(36), centre5(48)]);
    expect(ul('wifi-unii-2c').slice(0, 2)).toEqual([centre5(100), centre5(144)]);
    expect(ul('wifi-unii-3').slice(0, 2)).toEqual([centre5(149), centre5(165)]);
    // IEEE Std 802.11ax-2021, 6 GHz: centre = 5950 + 5·n MHz → ch 1 = 5955, ch 233 = 7115.
    expect(ul('wifi-6g').slice(0, 2)).toEqual([5950 + 5, 5950 + 5 * 233]);
  });

  it('Bluetooth LE spans its 40 channels, 2402 + 2·k MHz (Bluetooth Core Specification)', () => {
    expect(ul('bt-le').slice(0, 2)).toEqual([2402, 2402 + 2 * 39]);
  });
});

describe('warnings for a typed range', () => {
  it('says when a range is a downlink', () => {
    // Band 4 DL 2110–2155 MHz (TS 36.101 Table 5.5-1), inside no uplink of the presets.
    expect(bandRangeWarnings(2110, 2155).join(' ')).toMatch(/is a downlink.*Band 1, LTE Band 4/);
    // Band 2 DL 1930–1990 MHz overlaps band 1's uplink 1920–1980 MHz: only 1980–1990 MHz is no uplink.
    expect(bandRangeWarnings(1930, 1990).join(' ')).toMatch(/^1980–1990 MHz of this range is no uplink/);
    expect(bandRangeWarnings(1930, 1990, 'Band 2').join(' ')).toMatch(/LTE Band 2 transmits at 1850–1910 MHz.*into its downlink/);
    // Band 12 DL 729–746 MHz lies inside band 28's uplink (703–748 MHz), so only the label tells.
    expect(bandRangeWarnings(729, 746)).toEqual([]);
    expect(bandRangeWarnings(729, 746, 'Band 12').join(' ')).toMatch(/into its downlink/);
  });

  it('says when a range spans a duplex gap', () => {
    // Band 21: UL 1447.9–1462.9, DL 1495.9–1510.9 MHz; 1427.9–1510.9 reaches into the gap and DL.
    expect(bandRangeWarnings(1427.9, 1510.9).join(' ')).toMatch(/duplex gap/);
    // Labelled band 12 (UL 699–716 MHz), typed up to the top of its downlink (746 MHz).
    expect(bandRangeWarnings(699, 746, 'Band 12').join(' ')).toMatch(/LTE Band 12 transmits at 699–716 MHz.*into its downlink/);
    // Labelled n78 (TDD 3300–3800 MHz) typed as n77's 3300–4200 MHz.
    expect(bandRangeWarnings(3300, 4200, 'n78').join(' ')).toMatch(/NR n78 transmits at 3300–3800 MHz/);
  });

  it('is quiet for an uplink, a Wi-Fi range and a range the tables do not know', () => {
    expect(bandRangeWarnings(699, 716)).toEqual([]);
    expect(bandRangeWarnings(699, 716, 'Band 12')).toEqual([]);
    expect(bandRangeWarnings(1427.9, 1462.9)).toEqual([]); // bands 11 + 21 uplinks, adjacent
    expect(bandRangeWarnings(2412, 2472)).toEqual([]);
    expect(bandRangeWarnings(6240, 6740)).toEqual([]); // UWB-like, no preset: no opinion
  });
});
