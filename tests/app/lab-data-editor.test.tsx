/**
 * Entering lab data by hand and the co-transmission groups (component tests with a stand-in API):
 * a measurement row is added, a value out of the schema's range is named at its field and nothing
 * is sent, the fixed table is sent whole with its revision as If-Match; the server's 422 message
 * lands on the field it names; a 409 offers the other person's table; the specialist's group editor
 * asks for two transmitters and sends the groups of one position with their position. Also the
 * pure filtering and sorting of the lab results table, and the lab's own id pattern for new rows.
 */
import { fireEvent, screen, waitFor } from '@testing-library/react-native';
import type { LabRow } from '../../calc/lab/lab-results';
import { CoTransmissionEditor } from '../../components/filings/co-transmission-editor';
import { LabDataEditor, nextLabId } from '../../components/filings/lab-data-editor';
import { ALL, FLAGGED, filterLabRows, marginFor, sortLabRows } from '../../components/filings/lab-filter';
import { zDeviceStep, zRadiosStep, type FilingDetail } from '../../constants/schemas/filings';
import { apiError, installFetchMock } from './support/fetch-mock';
import { renderWithClient } from './support/render';

const FILING: FilingDetail = {
  id: 7,
  device: { name: 'Kestrel handset', model: 'KH-2', applicant: 'Northfold Telemetry', productType: 'phone' },
  version: { id: 7, number: 1, state: 'draft' },
  markets: ['fcc'],
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
      transmitters: [
        { id: 'LTE-B4', technology: 'LTE', band: 'Band 4', frequencyMinHz: 1710e6, frequencyMaxHz: 1755e6, maxTuneUpPowerDbm: 24, dutyCycle: 1, antennaId: 'ANT-1' },
        { id: 'WLAN', technology: 'Wi-Fi', band: '2.4 GHz', frequencyMinHz: 2412e6, frequencyMaxHz: 2462e6, maxTuneUpPowerDbm: 18, dutyCycle: 1, antennaId: 'ANT-1' },
      ],
    }),
    'use-positions': {
      usePositions: [
        { rowId: 3, id: 'head', kind: 'head', separations: [{ antennaId: 'ANT-1', separationM: 0 }] },
        { rowId: 4, id: 'hotspot-back', kind: 'hotspot', separations: [{ antennaId: 'ANT-1', separationM: 0.01 }] },
      ],
    },
    markets: { markets: [] },
  },
  drafts: {},
  revisions: { device: 'r1', radios: 'r2', 'use-positions': 'r3', markets: 'r4' },
};

const M1 = {
  id: 'M1',
  transmitterId: 'LTE-B4',
  usePositionId: 'head',
  testPosition: 'left cheek',
  channel: '20175',
  frequencyHz: 1732.5e6,
  testSeparationM: 0,
  measuredPowerDbm: 23.4,
  tuneUpPowerDbm: null,
  testDutyCycle: 1,
  sar1gWPerKg: 0.81,
  sar10gWPerKg: null,
  repeatSarWPerKg: [],
  driftDb: 0.05,
  testDate: '2026-02-10',
  peakXMm: null,
  peakYMm: null,
  liquidCheckId: null,
  systemCheckId: null,
};

const emptySets = {
  'GET /api/filings/7/liquid-checks': { status: 200, body: { version: 1, liquidChecks: [], revision: 'l0' } },
  'GET /api/filings/7/system-checks': { status: 200, body: { version: 1, systemChecks: [], revision: 's0' } },
  'GET /api/filings/7/instruments': { status: 200, body: { version: 1, instruments: [], revision: 'i0' } },
  'GET /api/filings/7/uncertainty-budget': { status: 200, body: { version: 1, components: [], revision: 'u0' } },
};

jest.setTimeout(30_000);

describe('LabDataEditor: measurements by hand', () => {
  it('adds a row, names a value out of range at its field without sending, then sends the fixed table with If-Match', async () => {
    const { calls } = installFetchMock({
      ...emptySets,
      'GET /api/filings/7/measurements': { status: 200, body: { version: 1, measurements: [M1], revision: 'm0' } },
      'PUT /api/filings/7/measurements': ({ body }) => ({ status: 200, body: { version: 1, ...(body as object), revision: 'm1' } }),
    });
    renderWithClient(<LabDataEditor filing={FILING} editable />);
    await screen.findByTestId('lab-m-row-0');
    fireEvent.press(screen.getByTestId('lab-m-add'));
    await screen.findByTestId('lab-m-row-1');
    // The lab's pattern: after M1 comes M2.
    expect(screen.getByTestId('m-1-id').props.value).toBe('M2');
    fireEvent.changeText(screen.getByTestId('m-1-freq'), '1732.5');
    fireEvent.changeText(screen.getByTestId('m-1-sep'), '10');
    fireEvent.changeText(screen.getByTestId('m-1-power'), '23.1');
    fireEvent.changeText(screen.getByTestId('m-1-sar1g'), '140');
    fireEvent.press(screen.getByTestId('lab-measurements-save'));
    expect(await screen.findByTestId('m-1-sar1g-error')).toHaveTextContent(/at most 100 W\/kg; check the unit/);
    expect(screen.getByTestId('lab-measurements-status')).toHaveTextContent(/Not saved/);
    expect(calls.filter((c) => c.method === 'PUT')).toHaveLength(0);

    fireEvent.changeText(screen.getByTestId('m-1-sar1g'), '1.4');
    await waitFor(() => expect(screen.queryByTestId('m-1-sar1g-error')).toBeNull(), { timeout: 5000 });
    fireEvent.press(screen.getByTestId('lab-measurements-save'));
    await screen.findByText(/Saved \d\d:\d\d/);
    const put = calls.filter((c) => c.method === 'PUT');
    expect(put).toHaveLength(1);
    expect(put[0].headers['If-Match']).toBe('"m0"');
    const sent = (put[0].body as { measurements: (typeof M1)[] }).measurements;
    expect(sent.map((m) => m.id)).toEqual(['M1', 'M2']);
    expect(sent[1]).toMatchObject({ transmitterId: 'LTE-B4', usePositionId: 'head', frequencyHz: 1732.5e6, testSeparationM: 0.01, measuredPowerDbm: 23.1, sar1gWPerKg: 1.4, testDutyCycle: 1 });
  });

  it('shows the server’s 422 message at the field it names, and a 409 offers the other person’s rows', async () => {
    let reply = apiError(422, 'invalid_input', '1 id(s) do not match this filing; nothing was saved.', {
      'measurements.0.usePositionId': 'Unknown use position “head”; this filing has hotspot-back.',
    });
    installFetchMock({
      ...emptySets,
      'GET /api/filings/7/measurements': { status: 200, body: { version: 1, measurements: [M1], revision: 'm0' } },
      'PUT /api/filings/7/measurements': () => reply,
    });
    renderWithClient(<LabDataEditor filing={FILING} editable />);
    await screen.findByTestId('lab-m-row-0');
    fireEvent.changeText(screen.getByTestId('m-0-power'), '23.3');
    fireEvent.press(screen.getByTestId('lab-measurements-save'));
    expect(await screen.findByTestId('m-0-pos-error')).toHaveTextContent(/Unknown use position “head”/);
    expect(screen.getByTestId('lab-measurements-status')).toHaveTextContent(/do not match this filing/);

    reply = {
      status: 409,
      body: { error: { code: 'stale_lab_set', message: 'Someone saved this table after you opened it.' }, current: { version: 1, measurements: [{ ...M1, measuredPowerDbm: 22 }], revision: 'm9' } },
    };
    fireEvent.press(screen.getByTestId('lab-measurements-save'));
    await screen.findByTestId('lab-measurements-theirs');
    expect(screen.getByTestId('lab-measurements-status')).toHaveTextContent(/someone else saved the measurements/);
    fireEvent.press(screen.getByTestId('lab-measurements-theirs'));
    await waitFor(() => expect(screen.getByTestId('m-0-power').props.value).toBe('22'));
  });

  it('reads only, for a role that does not enter lab data', async () => {
    installFetchMock({ ...emptySets, 'GET /api/filings/7/measurements': { status: 200, body: { version: 1, measurements: [M1], revision: 'm0' } } });
    renderWithClient(<LabDataEditor filing={FILING} editable={false} />);
    await screen.findByTestId('lab-m-row-0');
    expect(screen.queryByTestId('lab-m-add')).toBeNull();
    expect(screen.queryByTestId('lab-measurements-save')).toBeNull();
  });
});

describe('CoTransmissionEditor', () => {
  it('asks for two transmitters, then sends a group of one position with its position', async () => {
    const { calls } = installFetchMock({
      'GET /api/filings/7/co-transmission': { status: 200, body: { version: 1, groups: [{ usePositionId: null, transmitterIds: ['LTE-B4', 'WLAN'] }], revision: 'c0' } },
      'PUT /api/filings/7/co-transmission': ({ body }) => ({ status: 200, body: { version: 1, ...(body as object), revision: 'c1' } }),
    });
    renderWithClient(<CoTransmissionEditor filing={FILING} />);
    await screen.findByTestId('cotx-section-hotspot-back');
    fireEvent.press(screen.getByTestId('cotx-hotspot-back-add'));
    fireEvent.press(await screen.findByTestId('cotx-group-1-WLAN'));
    fireEvent.press(screen.getByTestId('cotx-save'));
    expect(await screen.findByTestId('cotx-group-1-error')).toHaveTextContent(/at least two transmitters/);
    expect(calls.filter((c) => c.method === 'PUT')).toHaveLength(0);
    fireEvent.press(screen.getByTestId('cotx-group-1-LTE-B4'));
    fireEvent.press(screen.getByTestId('cotx-save'));
    await screen.findByText(/Saved \d\d:\d\d/);
    const put = calls.filter((c) => c.method === 'PUT');
    expect(put[0].headers['If-Match']).toBe('"c0"');
    // Ticked in any order, kept in the order of the Radios step.
    expect(put[0].body).toEqual({
      groups: [
        { usePositionId: null, transmitterIds: ['LTE-B4', 'WLAN'] },
        { usePositionId: 'hotspot-back', transmitterIds: ['LTE-B4', 'WLAN'] },
      ],
    });
  });

  it('is read only for a role that does not edit the device data', async () => {
    installFetchMock({ 'GET /api/filings/7/co-transmission': { status: 200, body: { version: 1, groups: [{ usePositionId: null, transmitterIds: ['LTE-B4', 'WLAN'] }], revision: 'c0' } } });
    renderWithClient(<CoTransmissionEditor filing={{ ...FILING, editable: false }} />);
    await screen.findByTestId('cotx-section-every');
    expect(screen.queryByTestId('cotx-save')).toBeNull();
    expect(screen.queryByTestId('cotx-every-add')).toBeNull();
    expect(screen.getByText(/The compliance specialist edits these groups/)).toBeTruthy();
  });
});

const row = (id: string, over: Partial<LabRow>): LabRow =>
  ({
    measurementId: id,
    transmitterId: 'LTE-B4',
    usePositionId: 'head',
    frequencyHz: 1.7e9,
    scalingFactor: 1,
    reportedSar1gWPerKg: null,
    reportedSar10gWPerKg: null,
    margins: [],
    flags: [],
    ...over,
  }) as LabRow;

describe('lab results table: filter and sort (pure)', () => {
  const limitFlag = (id: string, regime: string) => ({ id: `limit:${id}:${regime}`, kind: 'limit', status: 'fail' }) as LabRow['flags'][number];
  const rows = [
    row('M1', { reportedSar1gWPerKg: 0.9, margins: [{ regime: 'fcc', marginDb: 2.5 } as LabRow['margins'][number], { regime: 'eu', marginDb: 4 } as LabRow['margins'][number]] }),
    row('M2', {
      usePositionId: 'hotspot-back',
      reportedSar1gWPerKg: 1.7,
      margins: [{ regime: 'fcc', marginDb: -0.26 } as LabRow['margins'][number], { regime: 'eu', marginDb: 1 } as LabRow['margins'][number]],
      flags: [limitFlag('M2', 'fcc')],
    }),
    row('M3', { reportedSar1gWPerKg: null }),
  ];

  it('filters by position, by flag, and leaves out another market’s limit flag', () => {
    expect(filterLabRows(rows, { usePositionId: 'head', regime: ALL, flag: ALL }).map((r) => r.measurementId)).toEqual(['M1', 'M3']);
    expect(filterLabRows(rows, { usePositionId: ALL, regime: ALL, flag: FLAGGED }).map((r) => r.measurementId)).toEqual(['M2']);
    expect(filterLabRows(rows, { usePositionId: ALL, regime: 'eu', flag: FLAGGED }).map((r) => r.measurementId)).toEqual([]);
    expect(filterLabRows(rows, { usePositionId: ALL, regime: ALL, flag: 'limit' }).map((r) => r.measurementId)).toEqual(['M2']);
  });

  it('sorts highest SAR first with unmeasured rows last, and by the least margin of the market shown', () => {
    expect(sortLabRows(rows, { key: 'sar1g', descending: true }).map((r) => r.measurementId)).toEqual(['M2', 'M1', 'M3']);
    expect(sortLabRows(rows, { key: 'sar1g', descending: false }).map((r) => r.measurementId)).toEqual(['M1', 'M2', 'M3']);
    expect(sortLabRows(rows, { key: 'margin', descending: false }).map((r) => r.measurementId)).toEqual(['M2', 'M1', 'M3']);
    expect(marginFor(rows[1], ALL)).toBe(-0.26);
    expect(marginFor(rows[1], 'eu')).toBe(1);
    expect(sortLabRows(rows, { key: 'id', descending: true }).map((r) => r.measurementId)).toEqual(['M3', 'M2', 'M1']);
  });

  it('numbers a new row in the lab’s own pattern', () => {
    expect(nextLabId('M', ['M9', 'M10', 'M11'])).toBe('M12');
    expect(nextLabId('L', ['L-2450', 'L-5500'])).toBe('L-5501');
    expect(nextLabId('M', [])).toBe('M-1');
  });
});
