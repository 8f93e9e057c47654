/**
 * The SAR-against-depth section: the tissue stack follows the use position's kind (head; trunk
 * for body-worn, hotspot and far-field; limb for extremity) and the chart switches from W/kg to a
 * profile relative to the surface inside the reactive near field, d ≤ λ/2π (Wheeler 1959; Balanis,
 * Antenna Theory 4th ed. §4.2 — section from memory). The profiles come from the real engine
 * (calc/screening/depth-profile.ts), served through a mocked API.
 */
import { fireEvent, screen } from '@testing-library/react-native';
import { screeningDepthProfile } from '../../calc/screening/depth-profile';
import type { UsePositionKind } from '../../calc/screening/input';
import { DepthSection } from '../../components/filings/depth-section';
import { zDeviceStep, zRadiosStep, type FilingDetail } from '../../constants/schemas/filings';
import { installFetchMock } from './support/fetch-mock';
import { renderWithClient } from './support/render';

const FREQUENCY_HZ = 2.45e9; // λ/2π = 19.47 mm
const POSITIONS: { id: string; kind: UsePositionKind; separationM: number }[] = [
  { id: 'cheek', kind: 'head', separationM: 0 },
  { id: 'belt-clip', kind: 'body-worn', separationM: 0.01 },
  { id: 'hotspot-edge', kind: 'hotspot', separationM: 0.01 },
  { id: 'wrist', kind: 'extremity', separationM: 0.005 },
  { id: 'desk', kind: 'far-field', separationM: 0.2 },
];
const transmitters = [
  {
    id: 'WLAN-2G4',
    technology: 'Wi-Fi',
    band: '2.4 GHz ISM',
    frequencyMinHz: 2412e6,
    frequencyMaxHz: 2472e6,
    maxTuneUpPowerDbm: 18,
    dutyCycle: 1,
    antennaId: 'ANT-1',
  },
];

const FILING = {
  id: 9,
  device: {
    name: 'Trailhound',
    model: 'TH-4',
    applicant: 'Northfold Telemetry',
    productType: 'phone',
  },
  version: { id: 9, number: 1, state: 'draft' },
  markets: ['fcc'],
  owner: { id: 2, name: 'Tomas Lindqvist' },
  updatedAt: '2026-03-01T10:00:00.000Z',
  createdAt: '2026-03-01T10:00:00.000Z',
  editable: true,
  revisions: { device: 'a', radios: 'b', 'use-positions': 'c', markets: 'd' },
  steps: [],
  data: {
    device: zDeviceStep.parse({
      name: 'Trailhound',
      model: 'TH-4',
      applicant: 'Northfold Telemetry',
      productType: 'phone',
    }),
    radios: zRadiosStep.parse({
      antennas: [{ id: 'ANT-1', gainDbi: 2, location: '' }],
      transmitters,
    }),
    'use-positions': {
      usePositions: POSITIONS.map((p) => ({
        id: p.id,
        kind: p.kind,
        separations: [{ antennaId: 'ANT-1', separationM: p.separationM }],
      })),
    },
    markets: {
      markets: [{ regime: 'fcc', tier: 'general', fccSarScreening: 'exemption' }],
    },
  },
  drafts: {},
} as unknown as FilingDetail;

jest.setTimeout(30_000);

function serveProfiles() {
  return installFetchMock({
    'GET /api/filings/9/screening/depth-profile': ({ query }) => {
      const position = POSITIONS.find((p) => p.id === query.get('usePositionId'))!;
      const profile = screeningDepthProfile({
        frequencyHz: FREQUENCY_HZ,
        eirpW: 0.1,
        separationM: position.separationM,
        usePositionKind: position.kind,
      });
      return {
        status: 200,
        body: {
          transmitterId: 'WLAN-2G4',
          usePositionId: position.id,
          basis: {
            regime: 'fcc',
            frequencyHz: FREQUENCY_HZ,
            eirpW: 0.1,
            separationM: position.separationM,
            method: 'x',
          },
          ...profile,
          cautions: ['A screening estimate.'],
        },
      };
    },
  });
}

async function showPosition(id: string) {
  fireEvent.press(screen.getByTestId(`depth-position-${id}`));
  expect(await screen.findByText(`Screening estimate: WLAN-2G4 at ${id}`)).toBeTruthy();
  fireEvent(screen.getByTestId('depth-chart-plot'), 'layout', {
    nativeEvent: { layout: { width: 360, height: 280 } },
  });
}

describe('DepthSection', () => {
  it.each([
    ['cheek', 'Model: Head: skin, fat, skull bone, brain', 'First 20 mm (skin, fat, bone)'],
    ['belt-clip', 'Model: Trunk: skin, fat, muscle', 'First 20 mm (skin, fat)'],
    ['hotspot-edge', 'Model: Trunk: skin, fat, muscle', 'First 20 mm (skin, fat)'],
    ['wrist', 'Model: Limb: skin, fat, muscle, bone', 'First 20 mm (skin, fat, muscle)'],
    ['desk', 'Model: Trunk: skin, fat, muscle', 'First 20 mm (skin, fat)'],
  ])('%s: picks the stack of its kind and says which model it is', async (id, model, closeUp) => {
    serveProfiles();
    renderWithClient(<DepthSection filing={FILING} initial={null} />);
    await showPosition(id);
    expect(screen.getByTestId('depth-model')).toHaveTextContent(new RegExp(`^${model.replace(/[()]/g, '\\$&')}`));
    expect(screen.getByTestId('depth-view-layers')).toHaveTextContent(closeUp);
    expect(screen.getByLabelText(/against depth, model estimate, layers/)).toBeTruthy();
  });

  it('inside λ/2π (10 mm at 2.45 GHz) shows the shape relative to the surface, with the reason and no W/kg', async () => {
    serveProfiles();
    renderWithClient(<DepthSection filing={FILING} initial={null} />);
    await showPosition('belt-clip');
    expect(screen.getByTestId('depth-scale-reason')).toHaveTextContent(/within the reactive near field \(λ\/2π = 19\.5 mm/);
    expect(screen.getByLabelText('Relative SAR (surface = 1) against depth, model estimate, layers skin, fat, muscle')).toBeTruthy();
    expect(screen.queryByLabelText(/W\/kg/)).toBeNull();
    expect(screen.getByTestId('depth-figures')).not.toHaveTextContent(/W\/kg/);
    expect(screen.getByTestId('depth-chart-caption')).toHaveTextContent(/not a measured SAR/);
  });

  it('beyond λ/2π (200 mm) shows W/kg as an estimate, still captioned as not a measured SAR', async () => {
    serveProfiles();
    renderWithClient(<DepthSection filing={FILING} initial={null} />);
    await showPosition('desk');
    expect(screen.getByTestId('depth-scale-reason')).toHaveTextContent(/beyond the reactive near field/);
    expect(screen.getByLabelText('Local SAR (W/kg, log scale) against depth, model estimate, layers skin, fat, muscle')).toBeTruthy();
    expect(screen.getByTestId('depth-figures')).toHaveTextContent(/1 g average \(estimate\)\s*[\d.e+-]+ W\/kg/);
    expect(screen.getByTestId('depth-chart-caption')).toHaveTextContent(/not a measured SAR/);
  });
});
