/**
 * The screening step: the summary per market, and a row's "how computed" panel showing the
 * engine's own formula, inputs and source clause. The rows come from the real engine
 * (calc/screening) for a small device, served through a mocked API.
 */
import { fireEvent, screen } from '@testing-library/react-native';
import { screeningInput } from '../../calc/screening/input';
import { SCREENING_CAUTIONS, screenParsed } from '../../calc/screening/screen';
import { ScreeningView } from '../../components/filings/screening-view';
import { zDeviceStep, zRadiosStep, type FilingDetail } from '../../constants/schemas/filings';
import { installFetchMock } from './support/fetch-mock';
import { renderWithClient } from './support/render';

// The chart is not under test here.
jest.mock('../../components/charts/depth-profile-chart', () => ({ DepthProfileChart: () => null }));

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
  archivedAt: null,
  editable: true,
  revisions: { device: 'r-device', radios: 'r-radios', 'use-positions': 'r-positions', markets: 'r-markets' },
  steps: [],
  data: {
    device: zDeviceStep.parse({ name: 'Stridebeacon wrist tag', model: 'SB-1', applicant: 'Northfold Telemetry', productType: 'wearable' }),
    radios: zRadiosStep.parse({ antennas, transmitters }),
    // No use positions here keeps the depth chart (its own request) out of this test.
    'use-positions': { usePositions: [] },
    markets: { markets },
  },
  drafts: {},
} as FilingDetail;

const output = screenParsed(screeningInput.parse({ markets, antennas, transmitters, usePositions }));
const SCREENING = {
  ...output,
  filingId: 7,
  version: 1,
  engineVersion: 'test-engine',
  ruleSetVersion: 'test-rules',
  computedAt: '2026-03-01T10:00:00.000Z',
  complete: true,
  cautions: SCREENING_CAUTIONS,
};

// The first render of a cold run loads most of the app; small CI machines need the headroom.
jest.setTimeout(30_000);

describe('ScreeningView', () => {
  it('opens a row’s "how computed" panel with the formula and the source clause', async () => {
    installFetchMock({ 'GET /api/filings/7/screening': { status: 200, body: SCREENING } });
    renderWithClient(<ScreeningView filing={FILING} />);

    expect(await screen.findByTestId('summary-fcc')).toHaveTextContent(/1\s*Combinations/);
    expect(screen.getByTestId('screening-cautions')).toHaveTextContent(/accredited laboratory’s measurement counts/);
    expect(screen.getByTestId('screening-versions')).toHaveTextContent(/Engine test-engine · rule set test-rules/);
    expect(screen.queryByTestId('how-computed-derivation')).toBeNull();

    const row = output.rows[0];
    fireEvent.press(screen.getByTestId('cell-0-threshold'));

    const formula = await screen.findByTestId('how-computed-derivation-formula');
    expect(formula).toHaveTextContent(row.derivation.formula);
    expect(screen.getByTestId('how-computed-derivation-source')).toHaveTextContent(row.derivation.source);
    // 47 CFR §1.1307(b)(3): the rule the FCC row is screened under.
    expect(row.derivation.source).toMatch(/§1\.1307\(b\)\(3\)/);
    // The band's edges are among the frequencies checked.
    expect(screen.getByTestId('how-computed-candidates')).toHaveTextContent(/2402 MHz/);
    expect(screen.getByTestId('how-computed-candidates')).toHaveTextContent(/2480 MHz/);
  });
});
