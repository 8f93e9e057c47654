/**
 * Reading rows pasted from a spreadsheet into the transmitter table. The blocks below are what
 * spreadsheets put on the clipboard (tab-separated, quoted cells with doubled quotes, CRLF line
 * ends) and CSV text with commas or semicolons; the demo tracker's radios are the context.
 * Messages are checked as the person reads them: the line, the column's label, what to fix.
 */
import { describe, expect, it } from 'vitest';
import { decimalMarkOf, headerName, isBlock, readNumber, readTransmitterBlock, splitBlock, type PasteContext } from '../../components/filings/paste-rows';

const VISIBLE = ['id', 'technology', 'band', 'frequencyMinHz', 'frequencyMaxHz', 'maxTuneUpPowerDbm', 'dutyCycle', 'antennaId'];
const ctx: PasteContext = {
  visibleOrder: VISIBLE,
  antennas: ['ANT-MAIN', 'ANT-DIV', 'ANT-WLAN'],
  transmitters: [
    { id: 'LTE-B12', antennaId: 'ANT-MAIN', moreAntennaIds: [] },
    { id: 'LTE-B2', antennaId: 'ANT-DIV', moreAntennaIds: ['ANT-MAIN'] },
  ],
};

describe('splitBlock', () => {
  it('splits a spreadsheet copy: tabs, quoted cells with tabs, line breaks and doubled quotes, CRLF, blank lines counted', () => {
    const text = 'TX-A\tLTE\t"Band ""12"" low\tedge"\r\n\r\n"two\nlines"\tx\r\n';
    expect(splitBlock(text)).toEqual([
      { line: 1, cells: ['TX-A', 'LTE', 'Band "12" low\tedge'] },
      { line: 3, cells: ['two\nlines', 'x'] },
    ]);
  });

  it('takes semicolons or commas when there is no tab, whichever the first line has more of', () => {
    expect(splitBlock('a;b;23,5\nc;d;1')).toEqual([
      { line: 1, cells: ['a', 'b', '23,5'] },
      { line: 2, cells: ['c', 'd', '1'] },
    ]);
    expect(splitBlock('a, b ,"1,5"')).toEqual([{ line: 1, cells: ['a', 'b', '1,5'] }]);
  });

  it('tells a block of cells from one value pasted into one field', () => {
    expect(isBlock('a\tb')).toBe(true);
    expect(isBlock('a\nb\n')).toBe(true);
    expect(isBlock('Band 12, low part\n')).toBe(false);
  });
});

describe('readNumber', () => {
  it('reads decimal points and commas, grouped digits, a typographic minus', () => {
    expect(readNumber('23.5')).toEqual({ ok: true, value: 23.5 });
    expect(readNumber('23,5')).toEqual({ ok: true, value: 23.5 });
    expect(readNumber('1 710,7')).toEqual({ ok: true, value: 1710.7 });
    expect(readNumber('1\u202f710.7')).toEqual({ ok: true, value: 1710.7 });
    expect(readNumber('1,710.7')).toEqual({ ok: true, value: 1710.7 });
    expect(readNumber('1.710,7')).toEqual({ ok: true, value: 1710.7 });
    expect(readNumber('\u22125')).toEqual({ ok: true, value: -5 });
    expect(readNumber('abc')).toEqual({ ok: false, reason: 'not-a-number' });
    expect(readNumber('1..2')).toEqual({ ok: false, reason: 'not-a-number' });
  });

  it('reads "1,710" by the block’s decimal mark, and calls it ambiguous when the block does not say', () => {
    expect(readNumber('1,710', '.')).toEqual({ ok: true, value: 1710 });
    expect(readNumber('1,710', ',')).toEqual({ ok: true, value: 1.71 });
    expect(readNumber('1,710')).toEqual({ ok: false, reason: 'ambiguous' });
    expect(readNumber('1.710', ',')).toEqual({ ok: true, value: 1710 });
    expect(readNumber('1,710,000')).toEqual({ ok: true, value: 1710000 });
    expect(decimalMarkOf(['699', '23,5', '1,710'])).toBe(',');
    expect(decimalMarkOf(['699', '23.5 dBm', '1,710'])).toBe('.');
    expect(decimalMarkOf(['699', '1,710'])).toBe(null);
  });
});

describe('headerName', () => {
  it('separates a column name from the unit it states', () => {
    expect(headerName('Lowest (MHz)')).toEqual({ name: 'lowest', unit: 'MHz' });
    expect(headerName('Max tune-up (dBm)')).toEqual({ name: 'maxtuneup', unit: 'dBm' });
    expect(headerName('Power dBm')).toEqual({ name: 'power', unit: 'dbm' });
    expect(headerName('Duty %')).toEqual({ name: 'duty', unit: '%' });
  });
});

describe('readTransmitterBlock', () => {
  it('fills rows in the table’s visible order without a header, in stored units (Hz, 0–1), antennas matched without regard to case', () => {
    const r = readTransmitterBlock('LTE-B5\tLTE\tBand 5\t824\t849\t23,5\t50\tant-main\n', ctx);
    expect(r.headerFound).toBe(false);
    expect(r.notes).toEqual([]);
    expect(r.rows).toEqual([
      {
        id: 'LTE-B5',
        technology: 'LTE',
        band: 'Band 5',
        frequencyMinHz: 824e6,
        frequencyMaxHz: 849e6,
        maxTuneUpPowerDbm: 23.5,
        mode: '',
        modulation: '',
        bandwidth: '',
        dutyCycle: 0.5,
        dutyCyclePreset: '',
        antennaId: 'ANT-MAIN',
        moreAntennaIds: [],
        antennaUse: 'mimo',
      },
    ]);
  });

  it('recognises a header by column names in any order, with units it states; unknown columns are named as left out', () => {
    const text = ['Antenna;Id;Max tune-up power (dBm);Highest (GHz);Lowest (GHz);Technology;Band;Notes;Target;Tolerance', 'ANT-WLAN;WLAN-6E;;7,125;5,925;Wi-Fi;U-NII-5–8;lab A;17;1,5'].join('\n');
    const r = readTransmitterBlock(text, ctx);
    expect(r.headerFound).toBe(true);
    expect(r.delimiter).toBe(';');
    expect(r.ignored).toEqual(['column ‘Notes’ is not a column of this table']);
    expect(r.columns).toEqual(['Antenna', 'Transmitter id', 'Max tune-up power', 'Highest frequency', 'Lowest frequency', 'Technology', 'Band', 'Tune-up target', 'Tolerance']);
    expect(r.lines).toEqual([2]);
    expect(r.notes).toEqual([]);
    // No maximum given: target + tolerance, as the form derives it.
    expect(r.rows[0]).toMatchObject({ id: 'WLAN-6E', antennaId: 'ANT-WLAN', frequencyMinHz: 5.925e9, frequencyMaxHz: 7.125e9, tuneUpTargetDbm: 17, tuneUpToleranceDb: 1.5, maxTuneUpPowerDbm: 18.5 });
  });

  it('marks each bad cell with its line and column and says what to fix; the other cells are kept', () => {
    const text = [
      'Id\tTechnology\tBand\tLowest (MHz)\tHighest (MHz)\tMax tune-up (dBm)\tDuty (%)\tAntenna',
      'LTE-B5\tLTE\tBand 5\t824\t849\t23\t100\tANT-MAIN',
      'LTE-B13\tLTE\tBand 13\t777\t787\tabc\t100\tANT-MAIN',
      'LTE-B12\tLTE\tBand 12\t699\t716\t99\t0\tANT-TOP',
    ].join('\n');
    const r = readTransmitterBlock(text, ctx);
    expect(r.rows.map((x) => [x.id, x.maxTuneUpPowerDbm, x.antennaId])).toEqual([
      ['LTE-B5', 23, 'ANT-MAIN'],
      ['LTE-B13', null, 'ANT-MAIN'],
      ['LTE-B12', 99, 'ANT-TOP'],
    ]);
    expect(r.notes.map((n) => n.message)).toEqual([
      'line 3, Max tune-up power: ‘abc’ is not a number in dBm',
      'line 4, Transmitter id: ‘LTE-B12’: Duplicate id "LTE-B12".',
      'line 4, Max tune-up power: ‘99’: The maximum tune-up power must be at most 60 dBm.',
      'line 4, Duty cycle: ‘0’: Duty cycle must be above 0 %.',
      'line 4, Antenna: ‘ANT-TOP’ is not one of the antennas above (ANT-MAIN, ANT-DIV, ANT-WLAN); add it under Antennas or pick one',
    ]);
    expect(r.notes[0]).toMatchObject({ row: 1, field: 'maxTuneUpPowerDbm', text: 'abc', line: 3 });
  });

  it('names a wrong unit and an ambiguous grouping rather than guessing', () => {
    const r = readTransmitterBlock('TX-9\tLTE\tBand 3\t1,710\t1785\t200 mW\t100\tANT-DIV', ctx);
    expect(r.notes.map((n) => n.message)).toEqual([
      'line 1, Lowest frequency: ‘1,710’ could be 1710 or 1.710 MHz; write it without the thousands separator',
      'line 1, Max tune-up power: ‘200 mW’ is in mW; give it in dBm',
    ]);
    expect(r.rows[0].frequencyMinHz).toBeNull();
  });

  it('gives an empty id the next free TX-n, says what a row lacks, and leaves out lines past the limit', () => {
    const r = readTransmitterBlock('\tBLE\t2.4 GHz\t2402\t2480\n\tBLE\t\t2402\t2480', { ...ctx, transmitters: [{ id: 'TX-1', antennaId: 'ANT-MAIN' }], maxRows: 2 });
    expect(r.rows.map((x) => x.id)).toEqual(['TX-2']);
    expect(r.leftOut).toEqual([2]);
    expect(r.notes.map((n) => n.message)).toEqual(['line 1, Max tune-up power: Enter the maximum tune-up power as a number.']);
  });

  it('says when cells reach past the table’s columns', () => {
    const r = readTransmitterBlock('a\tLTE\tB\t1\t2\t3\t100\tANT-MAIN\textra', ctx);
    expect(r.ignored).toEqual(['cells after the 8th column (Antenna) have no column here']);
  });
});
