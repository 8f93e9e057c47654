/** What the stale-save notice lists: fields in the step's own words, rows by their label. */
import { describe, expect, it } from 'vitest';
import { stepDifferences } from '../../components/filings/step-differences';

describe('stepDifferences', () => {
  it('names device fields as the form labels them, regulators’ terms in capitals', () => {
    expect(stepDifferences({ name: 'A', hvin: 'HW-1', pmn: null, maxTuneUpPowerDbm: 1 }, { name: 'A', hvin: 'HW-2', pmn: 'Trailhound', maxTuneUpPowerDbm: 1 })).toEqual(['HVIN', 'PMN']);
  });

  it('matches rows by stored row number, then by label, and names the fields that differ', () => {
    const mine = {
      transmitters: [
        { rowId: 1, id: 'LTE-B2', maxTuneUpPowerDbm: 23, gainDbi: 1 },
        { id: 'WLAN-5G', band: 'U-NII-1' },
      ],
    };
    const theirs = {
      transmitters: [
        { rowId: 1, id: 'LTE-B2', maxTuneUpPowerDbm: 24, gainDbi: 1 },
        { rowId: 7, id: 'BT', band: '2.4 GHz' },
      ],
    };
    expect(stepDifferences(mine, theirs)).toEqual(['Transmitter “LTE-B2”: maximum tune-up power', 'Transmitter “WLAN-5G”: only in yours', 'Transmitter “BT”: only in theirs']);
  });

  it('says nothing when the two hold the same values, and falls back to plain words for an unknown field', () => {
    expect(stepDifferences({ a: [1] }, { a: [1] })).toEqual([]);
    expect(stepDifferences({ someNewField: 1 }, { someNewField: 2 })).toEqual(['Some new field']);
  });
});
