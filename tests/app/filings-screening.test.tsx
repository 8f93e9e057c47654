/**
 * The screening step: the summary per market, and a row's "how computed" panel showing the
 * engine's own formula, inputs and source clause. The rows come from the real engine
 * (calc/screening) for a small device, served through a mocked API.
 */
import { screeningInput } from '../../calc/screening/input';
import { SCREENING_CAUTIONS, screenParsed } from '../../calc/screening/screen';
import { ScreeningView } from '../../components/filings/screening-view';
import type { FilingDetail } from '../../constants/schemas/filings';
import { installFetchMock } from './support/fetch-mock';
import { renderWithClient } from './support/render';
import { byTestId, findByTestId, press, queryByTestId } from './filings-support/by-test-id';

// d3-scale ships ESM only, which this jest config does not transform; the chart is not under test here.
jest.mock('../../components/charts/depth-profile-chart', () => ({ DepthProfileChart: () => null }));
// The sheet's Modal portals into document.body, which the test renderer cannot hold: render its
// content in place (the real sheet is exercised in the browser tests).
jest.mock('../../components/ui/sheet', () => {
  const { View } = jest.requireActual('react-native-web');
  return { Sheet: ({ visible, children, testID }: { visible: boolean; children: React.ReactNode; testID?: string }) => (visible ? <View testID={testID}>{children}</View> : null) };
});

const transmitters = [{ id: 'BT-LE', technology: 'Bluetooth LE', band: '2.4 GHz ISM', frequencyMinHz: 2402e6, frequencyMaxHz: 2480e6, maxTuneUpPowerDbm: 10, dutyCycle: 0.5, antennaId: 'ANT-1' }];
const usePositions = [{ id: 'wrist', kind: 'extremity' as const, separations: [{ antennaId: 'ANT-1', separationM: 0.004 }] }];
const markets = [{ regime: 'fcc' as const, tier: 'general' as const, fccSarScreening: 'exemption' as const }];
const antennas = [{ id: 'ANT-1', gainDbi: 2, location: '' }];

const FILING = {
  id: 7,
  device: { name: 'Stridebeacon wrist tag', model: 'SB-1', applicant: 'Northfold Telemetry', productType: 'wearable' },
  version: { id: 7, number: 1, state: 'draft' },
  markets: ['fcc'],
  owner: { id: 2, name: 'Tomas Lindqvist' },
  updatedAt: '2026-03-01T10:00:00.000Z',
  createdAt: '2026-03-01T10:00:00.000Z',
  editable: true,
  steps: [],
  data: {
    device: { name: 'Stridebeacon wrist tag', model: 'SB-1', applicant: 'Northfold Telemetry', productType: 'wearable', hardwareVersion: '', firmwareVersion: '' },
    radios: { antennas, transmitters },
    // No use positions here keeps the depth chart (its own request) out of this test.
    'use-positions': { usePositions: [] },
    markets: { markets },
  },
  drafts: {},
} as FilingDetail;

const output = screenParsed(screeningInput.parse({ markets, antennas, transmitters, usePositions }));
const SCREENING = { ...output, filingId: 7, version: 1, engineVersion: 'test-engine', ruleSetVersion: 'test-rules', computedAt: '2026-03-01T10:00:00.000Z', complete: true, cautions: SCREENING_CAUTIONS };

// The first render of a cold run loads most of the app; small CI machines need the headroom.
jest.setTimeout(30_000);

describe('ScreeningView', () => {
  it('opens a row’s "how computed" panel with the formula and the source clause', async () => {
    installFetchMock({ 'GET /api/filings/7/screening': { status: 200, body: SCREENING } });
    renderWithClient(<ScreeningView filing={FILING} />);

    expect(await findByTestId('summary-fcc')).toHaveTextContent(/1\s*Combinations/);
    expect(byTestId('screening-cautions')).toHaveTextContent(/accredited laboratory’s measurement counts/);
    expect(byTestId('screening-versions')).toHaveTextContent(/Engine test-engine · rule set test-rules/);
    expect(queryByTestId('how-computed-derivation')).toBeNull();

    const row = output.rows[0];
    press(byTestId('cell-0-threshold'));

    const formula = await findByTestId('how-computed-derivation-formula');
    expect(formula).toHaveTextContent(row.derivation.formula);
    expect(byTestId('how-computed-derivation-source')).toHaveTextContent(row.derivation.source);
    // 47 CFR §1.1307(b)(3): the rule the FCC row is screened under.
    expect(row.derivation.source).toMatch(/§1\.1307\(b\)\(3\)/);
    // The band's edges are among the frequencies checked.
    expect(byTestId('how-computed-candidates')).toHaveTextContent(/2402 MHz/);
    expect(byTestId('how-computed-candidates')).toHaveTextContent(/2480 MHz/);
  });
});
