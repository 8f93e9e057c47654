/**
 * The Use positions step's reduced powers and standard positions: a reduction is added under a
 * position (transmitter, power in dBm, trigger) and autosaved with the step; a power that is not
 * below the transmitter's maximum is said at the field as it is typed; the server's message lands
 * on the field it names; the handset's standard positions are added once, with their kind and
 * every used antenna at the position's test separation (FCC KDB 648474 D04 / 941225 D06, from
 * memory).
 */
import { fireEvent, screen } from '@testing-library/react-native';
import { UsePositionsStep } from '../../components/filings/use-positions-step';
import { zDeviceStep, zRadiosStep, type FilingDetail } from '../../constants/schemas/filings';
import { STANDARD_POSITION_SETS } from '../../constants/standard-positions';
import { apiError, installFetchMock } from './support/fetch-mock';
import { renderWithClient } from './support/render';

const FILING: FilingDetail = {
  id: 9,
  device: { name: 'Kestrel handset', model: 'KH-2', applicant: 'Northfold Telemetry', productType: 'phone' },
  version: { id: 9, number: 1, state: 'draft' },
  markets: [],
  owner: { id: 2, name: 'Tomas Lindqvist' },
  updatedAt: '2026-03-01T10:00:00.000Z',
  createdAt: '2026-03-01T10:00:00.000Z',
  editable: true,
  archivedAt: null,
  steps: [],
  data: {
    device: zDeviceStep.parse({ name: 'Kestrel handset', model: 'KH-2', applicant: 'Northfold Telemetry', productType: 'phone' }),
    radios: zRadiosStep.parse({
      antennas: [{ id: 'ANT-1', gainDbi: 0, location: '' }],
      transmitters: [{ id: 'LTE-B4', technology: 'LTE', band: 'Band 4', frequencyMinHz: 1710e6, frequencyMaxHz: 1755e6, maxTuneUpPowerDbm: 24, dutyCycle: 1, antennaId: 'ANT-1' }],
    }),
    'use-positions': { usePositions: [{ rowId: 3, id: 'hotspot-back', kind: 'hotspot', separations: [{ antennaId: 'ANT-1', separationM: 0.01 }] }] },
    markets: { markets: [] },
  },
  drafts: {},
  revisions: { device: 'r1', radios: 'r2', 'use-positions': 'r3', markets: 'r4' },
};

jest.setTimeout(30_000);

describe('UsePositionsStep: reduced powers', () => {
  it('adds a hotspot back-off under a position and autosaves it with the step', async () => {
    const { calls } = installFetchMock({
      'PUT /api/filings/9/steps/use-positions': { status: 200, body: { saved: true, filing: FILING } },
      'GET /api/filings/9': { status: 200, body: { filing: FILING } },
    });
    renderWithClient(<UsePositionsStep filing={FILING} />);
    expect(screen.getByTestId('positions-more-0')).toHaveTextContent(/none — every transmitter at its maximum/);
    fireEvent.press(screen.getByTestId('positions-more-0'));
    fireEvent.press(screen.getByTestId('pos-0-add-mode'));
    fireEvent.press(screen.getByTestId('pos-0-mode-0-trigger-hotspot-back-off'));
    fireEvent.changeText(screen.getByTestId('pos-0-mode-0-power'), '18.5');

    await screen.findByText(/Saved/, {}, { timeout: 4000 });
    const put = calls.filter((c) => c.method === 'PUT');
    expect(put.at(-1)!.body).toEqual({
      usePositions: [
        {
          rowId: 3,
          id: 'hotspot-back',
          kind: 'hotspot',
          separations: [{ antennaId: 'ANT-1', separationM: 0.01 }],
          powerModes: [{ transmitterId: 'LTE-B4', reducedTuneUpPowerDbm: 18.5, trigger: 'hotspot-back-off' }],
        },
      ],
    });
    // One transmitter, already reduced here: nothing more to add.
    expect(screen.queryByTestId('pos-0-add-mode')).toBeNull();
  });

  it('says at the field when the reduced power is not below the maximum, and shows the server’s message there', async () => {
    const message = 'A reduced power must be below LTE-B4’s maximum tune-up power (24 dBm).';
    installFetchMock({
      'PUT /api/filings/9/steps/use-positions': apiError(422, 'invalid_input', 'Some fields need fixing; your input is kept as a draft until they do.', {
        'usePositions.0.powerModes.0.reducedTuneUpPowerDbm': message,
      }),
      'GET /api/filings/9': { status: 200, body: { filing: FILING } },
    });
    renderWithClient(<UsePositionsStep filing={FILING} />);
    fireEvent.press(screen.getByTestId('positions-more-0'));
    fireEvent.press(screen.getByTestId('pos-0-add-mode'));
    fireEvent.changeText(screen.getByTestId('pos-0-mode-0-power'), '24');
    expect(screen.getByTestId('pos-0-mode-0-power-problem')).toHaveTextContent(message);
    expect(await screen.findByTestId('pos-0-mode-0-power-error', {}, { timeout: 4000 })).toHaveTextContent(message);
    // One message, not two.
    expect(screen.queryByTestId('pos-0-mode-0-power-problem')).toBeNull();
    fireEvent.changeText(screen.getByTestId('pos-0-mode-0-power'), '20');
    expect(screen.queryByTestId('pos-0-mode-0-power-problem')).toBeNull();
  });
});

describe('UsePositionsStep: standard test positions', () => {
  it('offers the handset set for a phone and adds the positions not yet listed, each once', async () => {
    const { calls } = installFetchMock({
      'PUT /api/filings/9/steps/use-positions': { status: 200, body: { saved: true, filing: FILING } },
      'GET /api/filings/9': { status: 200, body: { filing: FILING } },
    });
    renderWithClient(<UsePositionsStep filing={FILING} />);
    const handset = STANDARD_POSITION_SETS.handset.positions;
    // hotspot-back is already there: the rest are offered.
    expect(screen.getByTestId('standard-positions-add')).toHaveTextContent(`Add ${handset.length - 1} standard positions`);
    expect(screen.getByTestId('standard-left-cheek')).toHaveTextContent(/against the head, 1 g, 0 mm\. Source: FCC KDB 648474 D04.*; check against the current edition\.$/);
    expect(screen.getByTestId('standard-hotspot-top')).toHaveTextContent(/hotspot \(near the body\), 1 g, 10 mm\. Source: FCC KDB 941225 D06/);
    expect(screen.queryByTestId('standard-hotspot-back')).toBeNull();
    fireEvent.press(screen.getByTestId('standard-positions-add'));
    expect(screen.getByTestId('standard-positions-all-there')).toBeTruthy();

    await screen.findByText(/Saved/, {}, { timeout: 4000 });
    const body = calls.filter((c) => c.method === 'PUT').at(-1)!.body as { usePositions: { id: string; kind: string; separations: unknown[] }[] };
    expect(body.usePositions.map((p) => p.id)).toEqual(['hotspot-back', ...handset.filter((p) => p.id !== 'hotspot-back').map((p) => p.id)]);
    expect(body.usePositions.find((p) => p.id === 'left-tilt')).toEqual({ id: 'left-tilt', kind: 'head', separations: [{ antennaId: 'ANT-1', separationM: 0 }] });
    expect(body.usePositions.find((p) => p.id === 'body-worn')).toEqual({ id: 'body-worn', kind: 'body-worn', separations: [{ antennaId: 'ANT-1', separationM: 0.015 }] });
  });

  it('for a module, asks for the host’s kind of product first', () => {
    installFetchMock({});
    renderWithClient(<UsePositionsStep filing={{ ...FILING, data: { ...FILING.data, device: { ...FILING.data.device, productType: 'iot-module' } } }} />);
    expect(screen.getByTestId('standard-positions-module')).toHaveTextContent(/positions of the host/);
    expect(screen.queryByTestId('standard-positions-add')).toBeNull();
    fireEvent.press(screen.getByTestId('standard-set-wrist-worn'));
    expect(screen.getByTestId('standard-wrist')).toHaveTextContent(/held in the hand \/ on a limb, 10 g, 0 mm/);
    expect(screen.getByTestId('standard-face')).toHaveTextContent(/against the head, 1 g, 10 mm/);
  });
});
