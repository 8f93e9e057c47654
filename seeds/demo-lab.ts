/**
 * Lab results for the demo tracker filing: a fictional but plausible set of SAR measurements (one
 * per combination that screening sends to SAR), liquid and system checks, instruments and an
 * uncertainty budget. One liquid check (2450 MHz, σ +7.2 %) is out of tolerance, so its flag and
 * the two Wi-Fi measurements that relied on it show what a failing check looks like.
 */
import type { BudgetComponent, Instrument, LiquidCheck, MeasurementInput, SystemCheck } from '../constants/schemas/lab';

type Row = [
  tx: string,
  position: string,
  testPosition: string,
  channel: string,
  mhz: number,
  sepMm: number,
  powerDbm: number,
  sar1g: number | null,
  sar10g: number | null,
  drift: number,
  date: string,
  peak: [number, number],
  liquid: string,
  system: string,
];

const ROWS: Row[] = [
  ['LTE-B12', 'belt-clip', 'back, 10 mm', '23095', 707.5, 10, 23.6, 0.62, 0.41, -0.04, '2026-11-16', [12, 35], 'L-750', 'S-750'],
  ['LTE-B12', 'in-hand', 'front, touching', '23095', 707.5, 0, 23.6, null, 1.35, 0.02, '2026-11-16', [14, 30], 'L-750', 'S-750'],
  ['LTE-B12', 'wrist-strap', 'strap side, 4 mm', '23095', 707.5, 4, 23.6, null, 0.98, -0.06, '2026-11-16', [16, 38], 'L-750', 'S-750'],
  ['LTE-B11', 'belt-clip', 'back, 10 mm', '8665', 1447.9, 10, 22.7, 0.48, 0.3, 0.03, '2026-11-17', [10, 33], 'L-1450', 'S-1900'],
  ['LTE-B11', 'in-hand', 'front, touching', '8665', 1447.9, 0, 22.7, null, 1.12, -0.08, '2026-11-17', [12, 31], 'L-1450', 'S-1900'],
  ['LTE-B11', 'wrist-strap', 'strap side, 4 mm', '8665', 1447.9, 4, 22.7, null, 0.86, 0.05, '2026-11-17', [15, 36], 'L-1450', 'S-1900'],
  ['LTE-B2', 'belt-clip', 'back, 10 mm', '18900', 1880, 10, 23.1, 0.91, 0.55, -0.07, '2026-11-17', [-22, 60], 'L-1900', 'S-1900'],
  ['LTE-B2', 'in-hand', 'bottom edge, 3 mm', '18900', 1880, 3, 23.1, null, 1.64, 0.04, '2026-11-17', [-25, 64], 'L-1900', 'S-1900'],
  ['LTE-B2', 'wrist-strap', 'strap side, 20 mm', '18900', 1880, 20, 23.1, null, 0.44, -0.02, '2026-11-17', [-24, 62], 'L-1900', 'S-1900'],
  ['WLAN-2G4', 'belt-clip', 'back, 12 mm', '6', 2437, 12, 16.4, 0.38, 0.17, 0.06, '2026-11-18', [30, 18], 'L-2450', 'S-2450'],
  ['WLAN-2G4', 'in-hand', 'back, touching', '6', 2437, 0, 16.4, null, 0.52, -0.03, '2026-11-18', [31, 17], 'L-2450', 'S-2450'],
  ['WLAN-5G', 'belt-clip', 'back, 12 mm', '100', 5500, 12, 13.2, 0.29, 0.1, 0.08, '2026-11-18', [33, 15], 'L-5500', 'S-5500'],
  ['WLAN-5G', 'in-hand', 'back, touching', '100', 5500, 0, 13.2, null, 0.41, -0.05, '2026-11-18', [32, 16], 'L-5500', 'S-5500'],
];

export const DEMO_MEASUREMENTS: MeasurementInput[] = ROWS.map(
  ([transmitterId, usePositionId, testPosition, channel, mhz, sepMm, powerDbm, sar1g, sar10g, drift, testDate, peak, liquid, system], i) => ({
    id: `M${String(i + 1).padStart(2, '0')}`,
    transmitterId,
    usePositionId,
    testPosition,
    channel,
    frequencyHz: mhz * 1e6,
    testSeparationM: sepMm / 1000,
    measuredPowerDbm: powerDbm,
    // Wi-Fi scans at the transmitter's own duty cycle: no duty-cycle scaling.
    testDutyCycle: transmitterId === 'WLAN-2G4' ? 0.98 : transmitterId === 'WLAN-5G' ? 0.95 : 1,
    sar1gWPerKg: sar1g,
    sar10gWPerKg: sar10g,
    // LTE Band 2 body-worn is at 0.91 W/kg (≥ 0.80): the lab repeated it once.
    repeatSarWPerKg: transmitterId === 'LTE-B2' && usePositionId === 'belt-clip' ? [0.88] : [],
    driftDb: drift,
    testDate,
    peakXMm: peak[0],
    peakYMm: peak[1],
    liquidCheckId: liquid,
    systemCheckId: system,
  }),
);

export const DEMO_LIQUID_CHECKS: LiquidCheck[] = [
  { id: 'L-750', date: '2026-11-16', liquid: 'head', frequencyHz: 750e6, relativePermittivity: 42.6, conductivitySPerM: 0.91, temperatureC: 21.4 },
  { id: 'L-1450', date: '2026-11-17', liquid: 'head', frequencyHz: 1450e6, relativePermittivity: 41.1, conductivitySPerM: 1.22, temperatureC: 21.8 },
  { id: 'L-1900', date: '2026-11-17', liquid: 'head', frequencyHz: 1900e6, relativePermittivity: 39.3, conductivitySPerM: 1.43, temperatureC: 22.0 },
  // σ 1.93 S/m against the 1.80 S/m target: +7.2 %, outside ±5 %.
  { id: 'L-2450', date: '2026-11-18', liquid: 'head', frequencyHz: 2450e6, relativePermittivity: 38.6, conductivitySPerM: 1.93, temperatureC: 22.3 },
  { id: 'L-5500', date: '2026-11-18', liquid: 'head', frequencyHz: 5500e6, relativePermittivity: 35.1, conductivitySPerM: 5.02, temperatureC: 22.1 },
];

export const DEMO_SYSTEM_CHECKS: SystemCheck[] = [
  { id: 'S-750', date: '2026-11-16', frequencyHz: 750e6, dipoleSerial: 'HR-D750-1042', averagingMass: '1g', measuredSarWPerKgPerW: 8.72, targetSarWPerKgPerW: 8.49 },
  { id: 'S-1900', date: '2026-11-17', frequencyHz: 1900e6, dipoleSerial: 'HR-D1900-2217', averagingMass: '1g', measuredSarWPerKgPerW: 40.5, targetSarWPerKgPerW: 39.7 },
  { id: 'S-2450', date: '2026-11-18', frequencyHz: 2450e6, dipoleSerial: 'HR-D2450-0871', averagingMass: '1g', measuredSarWPerKgPerW: 53.9, targetSarWPerKgPerW: 52.4 },
  { id: 'S-5500', date: '2026-11-18', frequencyHz: 5500e6, dipoleSerial: 'HR-D5G-0356', averagingMass: '1g', measuredSarWPerKgPerW: 78.2, targetSarWPerKgPerW: 80.1 },
];

export const DEMO_INSTRUMENTS: Instrument[] = [
  { id: 'PROBE-1', kind: 'probe', model: 'Isotropic E-field probe', serial: 'EP-7462', calibrationDate: '2026-05-18', dueDate: '2027-05-18' },
  { id: 'DAE-1', kind: 'dae', model: 'Data acquisition unit', serial: 'DA-1583', calibrationDate: '2026-02-10', dueDate: '2027-02-10' },
  { id: 'DIP-750', kind: 'dipole', model: '750 MHz validation dipole', serial: 'HR-D750-1042', calibrationDate: '2025-03-03', dueDate: '2028-03-02' },
  { id: 'DIP-1900', kind: 'dipole', model: '1900 MHz validation dipole', serial: 'HR-D1900-2217', calibrationDate: '2026-01-12', dueDate: '2027-01-12' },
  { id: 'DIP-2450', kind: 'dipole', model: '2450 MHz validation dipole', serial: 'HR-D2450-0871', calibrationDate: '2026-01-12', dueDate: '2027-01-12' },
  { id: 'DIP-5G', kind: 'dipole', model: '5 GHz validation dipole', serial: 'HR-D5G-0356', calibrationDate: '2026-04-07', dueDate: '2027-04-07' },
  { id: 'PM-1', kind: 'power-meter', model: 'Dual-channel power meter', serial: 'PM-30917', calibrationDate: '2026-06-22', dueDate: '2027-06-22' },
];

/** A psSAR budget in the usual IEEE 1528 shape (values plausible, not from any report). */
export const DEMO_BUDGET: BudgetComponent[] = (
  [
    ['Probe calibration', 6.0, 'normal', 1, null],
    ['Axial isotropy', 4.7, 'rectangular', 0.7, null],
    ['Hemispherical isotropy', 9.6, 'rectangular', 0.7, null],
    ['Boundary effect', 1.0, 'rectangular', 1, null],
    ['Linearity', 4.7, 'rectangular', 1, null],
    ['Readout electronics', 0.3, 'normal', 1, null],
    ['Response time', 0.8, 'rectangular', 1, null],
    ['Integration time', 2.6, 'rectangular', 1, null],
    ['RF ambient conditions', 3.0, 'rectangular', 1, null],
    ['Probe positioning', 2.9, 'rectangular', 1, null],
    ['Post-processing', 1.0, 'rectangular', 1, null],
    ['Test sample positioning', 2.9, 'normal', 1, 145],
    ['Device holder', 3.6, 'normal', 1, 5],
    ['Power drift', 5.0, 'rectangular', 1, null],
    ['Phantom shell', 4.0, 'rectangular', 1, null],
    ['Liquid conductivity (target)', 5.0, 'rectangular', 0.64, null],
    ['Liquid conductivity (measured)', 2.5, 'normal', 0.64, 5],
    ['Liquid permittivity (target)', 5.0, 'rectangular', 0.6, null],
    ['Liquid permittivity (measured)', 2.5, 'normal', 0.6, 5],
  ] as const
).map(([name, valuePct, distribution, sensitivity, degreesOfFreedom]) => ({ name, valuePct, distribution, divisor: null, sensitivity, degreesOfFreedom }));
