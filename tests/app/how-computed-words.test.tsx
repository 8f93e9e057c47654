/**
 * The "how computed" panel speaks the filing reader's language: for real engine rows (every
 * market, a head, a body-worn, a limb and a far-field position) no derivation key, camelCase
 * field name, internal code or remark for the engine's authors ("from memory") reaches the screen; each quantity has a label, the inputs say where
 * their value came from, and the panel starts with the quantities behind the tapped figure.
 */
import { render, screen } from '@testing-library/react-native';
import { screeningInput } from '../../calc/screening/input';
import { screenParsed } from '../../calc/screening/screen';
import { HowComputed } from '../../components/filings/how-computed';
import { humanise, quantityWords } from '../../components/filings/quantity-words';
import type { FigureKey } from '../../components/filings/screening-figures';

jest.setTimeout(30_000);

const antennas = [{ id: 'ANT-1', gainDbi: 2, location: '' }];
const transmitters = [
  { id: 'LTE-B12', technology: 'LTE', band: 'Band 12', frequencyMinHz: 699e6, frequencyMaxHz: 716e6, maxTuneUpPowerDbm: 24, dutyCycle: 1, antennaId: 'ANT-1' },
  { id: 'WLAN-5G', technology: 'Wi-Fi', band: '5 GHz', frequencyMinHz: 5150e6, frequencyMaxHz: 5850e6, maxTuneUpPowerDbm: 17, dutyCycle: 0.9, antennaId: 'ANT-1' },
];
const usePositions = [
  { id: 'at-ear', kind: 'head' as const, separations: [{ antennaId: 'ANT-1', separationM: 0.005 }] },
  { id: 'belt', kind: 'body-worn' as const, separations: [{ antennaId: 'ANT-1', separationM: 0.01 }] },
  { id: 'wrist', kind: 'extremity' as const, separations: [{ antennaId: 'ANT-1', separationM: 0.004 }] },
  { id: 'desk', kind: 'far-field' as const, separations: [{ antennaId: 'ANT-1', separationM: 0.2 }] },
];
const markets = (['fcc', 'ised', 'eu', 'icnirp-2020'] as const).map((regime) => ({ regime, tier: 'general' as const }));
const rows = screenParsed(screeningInput.parse({ markets, antennas, transmitters, usePositions })).rows;

/** Every text node of the rendered tree, joined. */
function shownText(): string {
  const out: string[] = [];
  const walk = (node: unknown): void => {
    if (typeof node === 'string') out.push(node);
    else if (Array.isArray(node)) node.forEach(walk);
    else if (node && typeof node === 'object' && 'children' in node) walk((node as { children: unknown }).children);
  };
  walk(screen.toJSON());
  return out.join(' ');
}

const CAMEL = /\b[a-z]{2,}[A-Z][a-z]+[A-Za-z]*\b/; // maxTuneUpPowerDbm, evaluatedValue … (not units such as mW, dBm)
const CODES = /\b(evaluate-sar|evaluate-mpe|icnirp-2020|head-trunk|exempt (true|false))\b/;
/** Remarks for the engine's authors, said on screen the way a lab says them instead. */
const TEAM_WORDS = /from memory|verify before release|secondary sources?\b|as recalled/i;

describe('how computed, in words', () => {
  it('covers every market and position kind in the sample', () => {
    expect(new Set(rows.map((r) => r.regime)).size).toBe(4);
    expect(new Set(rows.map((r) => r.usePositionKind)).size).toBe(4);
  });

  it.each(['threshold', 'evaluated', 'margin', 'frequency', 'result'] as FigureKey[])('shows no field name or code for the %s of any row', (figure) => {
    const found: string[] = [];
    for (const row of rows) {
      const view = render(<HowComputed row={row} figure={figure} />);
      const text = shownText();
      const bad = text.match(CAMEL) ?? text.match(CODES) ?? text.match(TEAM_WORDS);
      if (bad) found.push(`${row.transmitterId}/${row.usePositionId}/${row.regime}: "${bad[0]}"`);
      view.unmount();
    }
    expect(found).toEqual([]);
  });

  it('labels each input with where it came from, and starts with the quantities behind the figure', () => {
    const row = rows.find((r) => r.regime === 'fcc' && r.usePositionKind === 'body-worn')!;
    render(<HowComputed row={row} figure="threshold" />);
    expect(screen.getByTestId('how-computed-figure-quantities')).toHaveTextContent(/Exemption threshold/);
    const text = shownText();
    expect(text).toMatch(/Maximum tune-up power\s+P_dBm/);
    expect(text).toMatch(/the transmitter’s tune-up power, from the Radios step/);
    expect(text).toMatch(/the use position’s separation for this antenna, from the Use positions step/);
  });

  it('gives a readable label to a key it has not been told about', () => {
    expect(quantityWords('peakSpatialAverageSarWPerKg').label).toBe('Peak spatial average sar');
    expect(humanise('table_835MHz_10mm')).not.toMatch(CAMEL);
    expect(quantityWords('table_835MHz_10mm').label).toBe('Table entry at 835 MHz, 10 mm');
  });
});
