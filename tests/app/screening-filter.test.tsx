/**
 * Screening at scale: the filters (result, market, transmitter, use position) on real engine rows,
 * a tapped summary count filtering the table, the page-at-a-time table, the grouping by transmitter
 * with its worst result, and the CSV export.
 */
import { fireEvent, screen } from '@testing-library/react-native';
import { screeningInput } from '../../calc/screening/input';
import { SCREENING_CAUTIONS, screenParsed } from '../../calc/screening/screen';
import { filterRows, groupByTransmitter, NO_FILTER, screeningCsv, worstRow } from '../../components/filings/screening-filter';
import { ROWS_PAGE, ScreeningView } from '../../components/filings/screening-view';
import type { FilingDetail } from '../../constants/schemas/filings';
import { installFetchMock } from './support/fetch-mock';
import { renderWithClient } from './support/render';

jest.mock('../../components/charts/depth-profile-chart', () => ({ DepthProfileChart: () => null }));
jest.setTimeout(60_000);

const antennas = [{ id: 'A1', gainDbi: 0, location: '' }];
const transmitters = Array.from({ length: 12 }, (_, i) => ({
  id: `T${i + 1}`,
  technology: 'LTE',
  band: `B${i + 1}`,
  frequencyMinHz: 700e6 + i * 400e6,
  frequencyMaxHz: 740e6 + i * 400e6,
  maxTuneUpPowerDbm: 2 + 2 * i,
  dutyCycle: 1,
  antennaId: 'A1',
}));
const usePositions = [
  { id: 'belt', kind: 'body-worn' as const, separations: [{ antennaId: 'A1', separationM: 0.01 }] },
  { id: 'desk', kind: 'far-field' as const, separations: [{ antennaId: 'A1', separationM: 0.3 }] },
];
const markets = [
  { regime: 'fcc' as const, tier: 'general' as const },
  { regime: 'eu' as const, tier: 'general' as const },
];
const output = screenParsed(screeningInput.parse({ markets, antennas, transmitters, usePositions }));
const SCREENING = { ...output, filingId: 9, version: 1, engineVersion: 'e', ruleSetVersion: 'r', computedAt: '2026-03-01T10:00:00.000Z', complete: true, cautions: SCREENING_CAUTIONS };
const FILING = {
  id: 9,
  device: { name: 'Scale test', model: 'S-1', applicant: 'Northfold Telemetry', productType: 'phone' },
  version: { id: 9, number: 1, state: 'draft' },
  markets: ['fcc', 'eu'],
  owner: { id: 2, name: 'Tomas Lindqvist' },
  updatedAt: '2026-03-01T10:00:00.000Z',
  createdAt: '2026-03-01T10:00:00.000Z',
  editable: true,
  steps: [],
  data: { device: FILING_DEVICE(), radios: { antennas, transmitters }, 'use-positions': { usePositions: [] }, markets: { markets } },
  drafts: {},
} as unknown as FilingDetail;
function FILING_DEVICE() {
  return { name: 'Scale test', model: 'S-1', applicant: 'Northfold Telemetry', productType: 'phone', hardwareVersion: '', firmwareVersion: '' };
}

describe('screening filters', () => {
  it('filter by each dimension and combine them', () => {
    const rows = output.rows;
    expect(rows.length).toBe(48);
    expect(filterRows(rows, NO_FILTER)).toHaveLength(48);
    expect(filterRows(rows, { ...NO_FILTER, regime: 'eu' }).every((r) => r.regime === 'eu')).toBe(true);
    expect(filterRows(rows, { ...NO_FILTER, transmitterId: 'T3' })).toHaveLength(4);
    expect(filterRows(rows, { ...NO_FILTER, transmitterId: 'T3', usePositionId: 'desk', regime: 'fcc' })).toHaveLength(1);
    const exempt = filterRows(rows, { ...NO_FILTER, result: 'exempt' });
    expect(exempt.length).toBeGreaterThan(0);
    expect(exempt.length).toBeLessThan(48);
    expect(exempt.every((r) => r.result === 'exempt')).toBe(true);
  });

  it('exports the rows as CSV, one line each, with quoted fields where needed', () => {
    const csv = screeningCsv(output.rows.slice(0, 3));
    const lines = csv.trimEnd().split('\r\n');
    expect(lines).toHaveLength(4);
    expect(lines[0]).toBe('Transmitter,Use position,Position kind,Antenna,Separation (mm),Power mode,Market,Tier,Method,Frequency (MHz),Evaluated,Threshold,Result,Margin (dB),Source');
    expect(lines[1]).toMatch(/^T1,belt,[^,]+,A1,10,Full power,/);
    // The source names a clause with commas or not; either way the line has 15 fields.
    const fields = lines[1]!.match(/("([^"]|"")*"|[^,]*)(,|$)/g)!.filter((f) => f !== '');
    expect(fields).toHaveLength(15);
    // A row screened at a reduced power names the reduction's trigger.
    const reduced = screeningCsv([{ ...output.rows[0], powerMode: 'hotspot-back-off' }]).split('\r\n')[1];
    expect(reduced).toMatch(/^T1,belt,[^,]+,A1,10,Reduced: hotspot back-off,/);
  });

  it('a tapped summary count filters the table; long tables come a page at a time', async () => {
    installFetchMock({ 'GET /api/filings/9/screening': { status: 200, body: SCREENING } });
    renderWithClient(<ScreeningView filing={FILING} />);
    expect(await screen.findByTestId('screening-shown')).toHaveTextContent('48 combinations');
    // A page of rows, then "show more".
    expect(screen.getByTestId(`screening-row-${ROWS_PAGE - 1}`)).toBeTruthy();
    expect(screen.queryByTestId(`screening-row-${ROWS_PAGE}`)).toBeNull();
    fireEvent.press(screen.getByTestId('screening-more'));
    expect(screen.getByTestId('screening-row-47')).toBeTruthy();
    // Tap "Exempt" in the FCC summary: only the FCC's exempt rows remain.
    const fccExempt = output.rows.filter((r) => r.regime === 'fcc' && r.result === 'exempt').length;
    fireEvent.press(screen.getByTestId('summary-fcc-exempt'));
    expect(screen.getByTestId('screening-shown')).toHaveTextContent(`${fccExempt} of 48 combinations match`);
    fireEvent.press(screen.getByTestId('screening-clear'));
    expect(screen.getByTestId('screening-shown')).toHaveTextContent('48 combinations');
  });

  it('groups by transmitter with the worst result: SAR over MPE over exempt, then the smallest margin', () => {
    const groups = groupByTransmitter(output.rows);
    expect(groups.map((g) => g.transmitterId)).toEqual(transmitters.map((t) => t.id));
    for (const g of groups) {
      expect(g.rows).toHaveLength(4);
      expect(g.counts.exempt + g.counts['evaluate-sar'] + g.counts['evaluate-mpe']).toBe(4);
      // No row of the group is worse than the one named.
      const weight = { 'evaluate-sar': 3, 'evaluate-mpe': 2, exempt: 1 } as const;
      for (const r of g.rows) expect(weight[r.result]).toBeLessThanOrEqual(weight[g.worst.result]);
    }
    const base = output.rows[0]!;
    const row = (result: typeof base.result, marginDb: number | null, provisional = false) => ({ ...base, result, marginDb, provisional });
    expect(worstRow([row('exempt', 1), row('evaluate-mpe', 5), row('exempt', -1)]).result).toBe('evaluate-mpe');
    expect(worstRow([row('evaluate-mpe', 5), row('evaluate-sar', 9)]).result).toBe('evaluate-sar');
    expect(worstRow([row('exempt', 1), row('exempt', 0.5)]).marginDb).toBe(0.5);
    expect(worstRow([row('exempt', 0.5), row('exempt', 6, true)]).provisional).toBe(true);
    // A known margin says more than none.
    expect(worstRow([row('evaluate-sar', null), row('evaluate-sar', -3)]).marginDb).toBe(-3);
  });

  it('shows one collapsed card per transmitter that opens to its rows, and follows the filters', async () => {
    installFetchMock({ 'GET /api/filings/9/screening': { status: 200, body: SCREENING } });
    renderWithClient(<ScreeningView filing={FILING} />);
    await screen.findByTestId('screening-shown');
    fireEvent.press(screen.getByRole('radio', { name: 'By transmitter' }));
    expect(screen.getByTestId('screening-group-11')).toBeTruthy();
    expect(screen.queryByTestId('screening-row-0')).toBeNull();
    const last = groupByTransmitter(output.rows)[11]!;
    expect(screen.getByTestId('screening-group-11-worst')).toHaveTextContent(new RegExp(`^Worst: ${last.worst.usePositionId} · `));
    expect(screen.getByTestId('screening-group-0-counts')).toHaveTextContent(/^4 combinations · ((\d+ needs? (SAR|MPE)|\d+ exempt)( · |$))+$/);
    fireEvent.press(screen.getByTestId('screening-group-2-toggle'));
    expect(screen.getByTestId('g2-screening-row-3')).toBeTruthy();
    expect(screen.queryByTestId('g2-screening-row-4')).toBeNull();
    expect(screen.queryByTestId('g1-screening-row-0')).toBeNull();
    // A tapped count narrows the groups to the transmitters that have such a row.
    fireEvent.press(screen.getByTestId('summary-eu-evaluate-sar'));
    const sarTx = new Set(output.rows.filter((r) => r.regime === 'eu' && r.result === 'evaluate-sar').map((r) => r.transmitterId));
    expect(sarTx.size).toBeGreaterThan(0);
    expect(screen.queryByTestId(`screening-group-${sarTx.size}`)).toBeNull();
    expect(screen.getByTestId(`screening-group-${sarTx.size - 1}`)).toBeTruthy();
  });
});
