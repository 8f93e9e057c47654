/**
 * A wizard step form: typing autosaves the whole step (frequencies typed in MHz, sent in Hz), and
 * the server's field messages land inline on the field named by their dotted path.
 */
import { fireEvent, screen } from '@testing-library/react-native';
import { RadiosStep } from '../../components/filings/radios-step';
import { zDeviceStep, zRadiosStep, type FilingDetail } from '../../constants/schemas/filings';
import { apiError, installFetchMock } from './support/fetch-mock';
import { renderWithClient } from './support/render';

const FILING: FilingDetail = {
  id: 7,
  device: { name: 'Stridebeacon wrist tag', model: 'SB-1', applicant: 'Northfold Telemetry', productType: 'wearable' },
  version: { id: 7, number: 1, state: 'draft' },
  markets: [],
  owner: { id: 2, name: 'Tomas Lindqvist' },
  updatedAt: '2026-03-01T10:00:00.000Z',
  createdAt: '2026-03-01T10:00:00.000Z',
  archivedAt: null,
  editable: true,
  steps: [],
  data: {
    device: zDeviceStep.parse({ name: 'Stridebeacon wrist tag', model: 'SB-1', applicant: 'Northfold Telemetry', productType: 'wearable', hardwareVersion: '', firmwareVersion: '' }),
    radios: zRadiosStep.parse({
      antennas: [{ id: 'ANT-1', gainDbi: 2, location: '' }],
      transmitters: [{ id: 'TX-1', technology: 'Bluetooth LE', band: '2.4 GHz ISM', frequencyMinHz: 2402e6, frequencyMaxHz: 2480e6, maxTuneUpPowerDbm: 10, dutyCycle: 0.5, antennaId: 'ANT-1' }],
    }),
    'use-positions': { usePositions: [] },
    markets: { markets: [] },
  },
  drafts: {},
  revisions: { device: 'r-device-1', radios: 'r-radios-1', 'use-positions': 'r-positions-1', markets: 'r-markets-1' },
};

const MESSAGE = 'The highest frequency must not be below the lowest.';

// The first render of a cold run loads most of the app; small CI machines need the headroom.
jest.setTimeout(30_000);

describe('RadiosStep', () => {
  it('shows the stored values in display units (MHz, %)', () => {
    installFetchMock({});
    renderWithClient(<RadiosStep filing={FILING} />);
    expect(screen.getByTestId('tx-0-fmin').props.value).toBe('2402');
    expect(screen.getByTestId('tx-0-duty').props.value).toBe('50');
  });

  it('autosaves in Hz and puts the server’s field error on the field it names', async () => {
    const { calls } = installFetchMock({
      'PUT /api/filings/7/steps/radios': { ...apiError(422, 'invalid_input', 'Some fields need fixing; your input is kept as a draft until they do.', { 'transmitters.0.frequencyMaxHz': MESSAGE }) },
      'GET /api/filings/7': { status: 200, body: { filing: FILING } },
    });
    renderWithClient(<RadiosStep filing={FILING} />);

    // The band's name changes: valid for the client schema, refused by this (mocked) server.
    fireEvent.changeText(screen.getByTestId('tx-0-band'), 'ISM 2.4');
    fireEvent.changeText(screen.getByTestId('tx-0-fmax'), '2480.5');

    expect(await screen.findByTestId('tx-0-fmax-error', {}, { timeout: 4000 })).toHaveTextContent(MESSAGE);
    expect(screen.getByTestId('save-status')).toHaveTextContent(/Not saved — fix the highlighted field/);
    const put = calls.filter((c) => c.method === 'PUT');
    // Debounced: two quick changes make one request, with the whole step.
    expect(put).toHaveLength(1);
    expect(put[0].body).toEqual({
      antennas: [{ id: 'ANT-1', gainDbi: 2, location: '' }],
      transmitters: [{ ...FILING.data.radios.transmitters[0], band: 'ISM 2.4', frequencyMaxHz: 2480.5e6 }],
    });
  });

  it('names the revision it started from, and on a 409 shows what the other save changed until the person chooses', async () => {
    const theirs = {
      antennas: [{ rowId: 1, id: 'ANT-1', gainDbi: 3.5, location: '' }],
      transmitters: [{ ...FILING.data.radios.transmitters[0], maxTuneUpPowerDbm: 12 }],
    };
    let puts = 0;
    const { calls } = installFetchMock({
      'PUT /api/filings/7/steps/radios': () => {
        puts += 1;
        if (puts === 1)
          return {
            status: 409,
            body: { error: { code: 'stale_step', message: 'Someone saved this step after you opened it.' }, current: { data: theirs, revision: 'r-radios-2', updatedAt: '2026-03-01T11:00:00.000Z' } },
          };
        return { status: 200, body: { saved: true, filing: { ...FILING, revisions: { ...FILING.revisions, radios: 'r-radios-3' } } } };
      },
      'GET /api/filings/7': { status: 200, body: { filing: FILING } },
    });
    renderWithClient(<RadiosStep filing={FILING} />);
    fireEvent.changeText(screen.getByTestId('tx-0-band'), 'ISM 2.4');

    const notice = await screen.findByTestId('step-conflict', {}, { timeout: 4000 });
    expect(calls.find((c) => c.method === 'PUT')?.headers['If-Match']).toBe('"r-radios-1"');
    // The differences, row by row in words: their gain and tune-up power, my band.
    expect(notice).toHaveTextContent(/Antenna “ANT-1”: gain \(dBi\)/);
    expect(notice).toHaveTextContent(/Transmitter “TX-1”: band, maximum tune-up power/);
    expect(screen.getByTestId('save-status')).toHaveTextContent(/Not saved — someone else saved this step/);

    // Further typing is kept in the form but nothing is sent while the choice waits.
    fireEvent.changeText(screen.getByTestId('tx-0-band'), 'ISM 2.4 GHz');
    await new Promise((r) => setTimeout(r, 1200));
    expect(calls.filter((c) => c.method === 'PUT')).toHaveLength(1);

    // Keeping mine sends it over theirs, naming their revision.
    fireEvent.press(screen.getByTestId('conflict-mine'));
    await screen.findByText(/^Saved /, {}, { timeout: 4000 });
    const second = calls.filter((c) => c.method === 'PUT')[1];
    expect(second.headers['If-Match']).toBe('"r-radios-2"');
    expect((second.body as { transmitters: { band: string }[] }).transmitters[0].band).toBe('ISM 2.4 GHz');
    expect(screen.queryByTestId('step-conflict')).toBeNull();
  });

  it('loads the other person’s version when asked', async () => {
    const theirs = { antennas: FILING.data.radios.antennas, transmitters: [{ ...FILING.data.radios.transmitters[0], band: 'Their band' }] };
    installFetchMock({
      'PUT /api/filings/7/steps/radios': {
        status: 409,
        body: { error: { code: 'stale_step', message: 'Stale.' }, current: { data: theirs, revision: 'r-radios-2', updatedAt: '2026-03-01T11:00:00.000Z' } },
      },
      'GET /api/filings/7': { status: 200, body: { filing: FILING } },
    });
    renderWithClient(<RadiosStep filing={FILING} />);
    fireEvent.changeText(screen.getByTestId('tx-0-band'), 'Mine');
    await screen.findByTestId('step-conflict', {}, { timeout: 4000 });
    fireEvent.press(screen.getByTestId('conflict-theirs'));
    expect(screen.queryByTestId('step-conflict')).toBeNull();
    expect(screen.getByTestId('tx-0-band').props.value).toBe('Their band');
  });

  it('is read-only with a notice when the filing is not editable', () => {
    installFetchMock({});
    renderWithClient(<RadiosStep filing={{ ...FILING, editable: false }} />);
    expect(screen.getByTestId('step-read-only')).toBeTruthy();
    // Plain text, not a greyed-out input: the value with its unit where it has one.
    expect(screen.getByTestId('tx-0-id')).toHaveTextContent('TX-1');
    expect(screen.getByTestId('tx-0-id').props.editable).toBeUndefined();
    expect(screen.getByTestId('tx-0-power')).toHaveTextContent(/^-?\d+(\.\d+)? dBm$/);
    expect(screen.queryByTestId('transmitters-add')).toBeNull();
  });
});
