/**
 * The device description file, format "fieldfile.device/1": what a lab's own tools can write to
 * create a filing, and what GET /api/filings/:id/device.json exports. Published as JSON Schema at
 * /api/schema/device.json. Units are SI and part of every field name.
 *
 * The per-part schemas are also the wizard's step schemas, so a form and the file agree.
 */
import { z } from 'zod';
import { MAX_ANTENNAS, MAX_TRANSMITTERS, MAX_USE_POSITIONS } from '../../calc/input-limits';

export const DEVICE_FILE_FORMAT = 'fieldfile.device/1';

export const TEXT_MAX = 120;
export const ID_MAX = 40;
// One set of limits for the wizard, the device file and the engine.
export { MAX_ANTENNAS, MAX_TRANSMITTERS, MAX_USE_POSITIONS };
export const FREQUENCY_MIN_HZ = 100e3;
export const FREQUENCY_MAX_HZ = 300e9;
export const POWER_MIN_DBM = -30;
export const POWER_MAX_DBM = 60;
export const GAIN_MIN_DBI = -30;
export const GAIN_MAX_DBI = 30;
export const SEPARATION_MAX_M = 10;

export const PRODUCT_TYPES = ['phone', 'tablet', 'wearable', 'tracker', 'hotspot', 'iot-module', 'two-way-radio', 'laptop', 'other'] as const;
export const PRODUCT_TYPE_LABELS: Record<(typeof PRODUCT_TYPES)[number], string> = {
  phone: 'Phone',
  tablet: 'Tablet',
  wearable: 'Wearable',
  tracker: 'Tracker',
  hotspot: 'Mobile hotspot',
  'iot-module': 'IoT module',
  'two-way-radio': 'Two-way radio',
  laptop: 'Laptop',
  other: 'Other',
};

export const REGIMES = ['fcc', 'ised', 'eu', 'icnirp-2020'] as const;
export type MarketRegime = (typeof REGIMES)[number];
export const REGIME_LABELS: Record<MarketRegime, string> = {
  fcc: 'United States — FCC (47 CFR §1.1307, §1.1310)',
  ised: 'Canada — ISED (RSS-102)',
  eu: 'European Union — RED art. 3.1(a) (1999/519/EC, EN 62479)',
  'icnirp-2020': 'ICNIRP 2020 guidelines',
};
export const TIERS = ['general', 'occupational'] as const;
export type ExposureTier = (typeof TIERS)[number];
/** For FCC: the §1.1307(b)(3) exemptions, or the KDB 447498 D01 §4.3.1 SAR test exclusion. */
export const FCC_SAR_SCREENINGS = ['exemption', 'kdb-test-exclusion'] as const;

export const USE_POSITION_KINDS = ['head', 'body-worn', 'hotspot', 'extremity', 'far-field'] as const;
export type UsePositionKind = (typeof USE_POSITION_KINDS)[number];
export const USE_POSITION_LABELS: Record<UsePositionKind, string> = {
  head: 'Against the head',
  'body-worn': 'Body-worn',
  hotspot: 'Hotspot (near the body)',
  extremity: 'Held in the hand / on a limb',
  'far-field': 'Away from the body (far field)',
};

const text = (label: string, max = TEXT_MAX) =>
  z
    .string({ error: `Enter the ${label}.` })
    .trim()
    .min(1, `Enter the ${label}.`)
    .max(max, `The ${label} has at most ${max} characters.`);
const optionalText = (label: string, max = TEXT_MAX) =>
  z.string().trim().max(max, `The ${label} has at most ${max} characters.`).default('');

export const zItemId = z
  .string({ error: 'Enter an id.' })
  .trim()
  .min(1, 'Enter an id.')
  .max(ID_MAX, `An id has at most ${ID_MAX} characters.`)
  .regex(/^[A-Za-z0-9][A-Za-z0-9._-]*$/, 'Use letters, digits, ".", "_" or "-" (start with a letter or digit).');

const finite = (label: string) => z.number({ error: `Enter the ${label} as a number.` }).refine(Number.isFinite, `The ${label} must be a finite number.`);

export const zDeviceInfo = z.strictObject({
  name: text('device name'),
  model: text('model number'),
  applicant: text('applicant'),
  productType: z.enum(PRODUCT_TYPES, { error: 'Pick a product type.' }),
  hardwareVersion: optionalText('hardware version'),
  firmwareVersion: optionalText('firmware version'),
});
export type DeviceInfo = z.output<typeof zDeviceInfo>;

export const zMarket = z.strictObject({
  regime: z.enum(REGIMES, { error: 'Pick a market.' }),
  tier: z.enum(TIERS, { error: 'Pick general population or occupational.' }).default('general'),
  /** FCC only: how SAR screening is done. Default: the §1.1307(b)(3) exemptions. */
  fccSarScreening: z.enum(FCC_SAR_SCREENINGS).optional(),
});
export type Market = z.output<typeof zMarket>;

export const zAntenna = z.strictObject({
  id: zItemId,
  gainDbi: finite('antenna gain')
    .pipe(z.number().min(GAIN_MIN_DBI, `Gain must be at least ${GAIN_MIN_DBI} dBi.`).max(GAIN_MAX_DBI, `Gain must be at most ${GAIN_MAX_DBI} dBi.`)),
  location: optionalText('antenna location'),
});
export type Antenna = z.output<typeof zAntenna>;

const zFrequencyHz = (label: string) =>
  finite(label).pipe(
    z
      .number()
      .min(FREQUENCY_MIN_HZ, `The ${label} must be at least 100 kHz (0.1 MHz).`)
      .max(FREQUENCY_MAX_HZ, `The ${label} must be at most 300 GHz (300 000 MHz).`),
  );

export const zTransmitter = z
  .strictObject({
    id: zItemId,
    technology: text('technology', 60),
    band: text('band', 60),
    frequencyMinHz: zFrequencyHz('lowest frequency'),
    frequencyMaxHz: zFrequencyHz('highest frequency'),
    maxTuneUpPowerDbm: finite('maximum tune-up power').pipe(
      z.number().min(POWER_MIN_DBM, `Tune-up power must be at least ${POWER_MIN_DBM} dBm.`).max(POWER_MAX_DBM, `Tune-up power must be at most ${POWER_MAX_DBM} dBm.`),
    ),
    /** Maximum transmit duty cycle, 0 < d ≤ 1 (1 = continuous). */
    dutyCycle: finite('duty cycle').pipe(z.number().gt(0, 'Duty cycle must be above 0 %.').max(1, 'Duty cycle must be at most 100 %.')).default(1),
    antennaId: zItemId,
  })
  .refine((t) => t.frequencyMinHz <= t.frequencyMaxHz, {
    path: ['frequencyMaxHz'],
    message: 'The highest frequency must not be below the lowest.',
  });
export type Transmitter = z.output<typeof zTransmitter>;

export const zSeparation = z.strictObject({
  antennaId: zItemId,
  separationM: finite('separation distance').pipe(
    z.number().min(0, 'A separation distance cannot be negative.').max(SEPARATION_MAX_M, `A separation distance is at most ${SEPARATION_MAX_M} m.`),
  ),
});

export const zUsePosition = z.strictObject({
  id: zItemId,
  kind: z.enum(USE_POSITION_KINDS, { error: `Pick a kind (${USE_POSITION_KINDS.join(', ')}).` }),
  separations: z.array(zSeparation).max(MAX_ANTENNAS),
});
export type UsePosition = z.output<typeof zUsePosition>;

const duplicates = (ids: string[]) => ids.filter((id, i) => ids.indexOf(id) !== i);

type Loose = Record<string, unknown>;
const isRecord = (v: unknown): v is Loose => typeof v === 'object' && v !== null && !Array.isArray(v);
const records = (v: unknown): Loose[] => (Array.isArray(v) ? v.map((x) => (isRecord(x) ? x : {})) : []);
const str = (v: unknown): string | undefined => (typeof v === 'string' ? v : undefined);

/** Duplicate ids and references to ids that do not exist, each at its JSON path. */
function crossReferenceIssues(value: unknown, ctx: z.RefinementCtx) {
  if (!isRecord(value)) return;
  const antennas = records(value.antennas);
  const transmitters = records(value.transmitters);
  const usePositions = records(value.usePositions);
  const markets = records(value.markets);
  const antennaIds = new Set(antennas.map((a) => str(a.id)));
  const txIds = new Set(transmitters.map((t) => str(t.id)));
  const dup = (items: Loose[], path: string) => {
    const ids = items.map((x) => str(x.id) ?? '');
    for (const id of new Set(duplicates(ids))) {
      if (id) ctx.addIssue({ code: 'custom', path: [path, ids.lastIndexOf(id), 'id'], message: `Duplicate id "${id}".` });
    }
  };
  dup(antennas, 'antennas');
  dup(transmitters, 'transmitters');
  dup(usePositions, 'usePositions');
  const regimes = markets.map((m) => str(m.regime) ?? '');
  for (const regime of new Set(duplicates(regimes))) {
    if (regime) ctx.addIssue({ code: 'custom', path: ['markets', regimes.lastIndexOf(regime), 'regime'], message: `Market "${regime}" is listed twice.` });
  }
  transmitters.forEach((t, i) => {
    const ref = str(t.antennaId);
    if (ref !== undefined && !antennaIds.has(ref)) ctx.addIssue({ code: 'custom', path: ['transmitters', i, 'antennaId'], message: `Unknown antenna id "${ref}".` });
  });
  usePositions.forEach((p, i) => {
    const seen = new Set<string>();
    records(p.separations).forEach((sep, j) => {
      const ref = str(sep.antennaId);
      if (ref === undefined) return;
      if (!antennaIds.has(ref)) ctx.addIssue({ code: 'custom', path: ['usePositions', i, 'separations', j, 'antennaId'], message: `Unknown antenna id "${ref}".` });
      if (seen.has(ref)) ctx.addIssue({ code: 'custom', path: ['usePositions', i, 'separations', j, 'antennaId'], message: `Antenna "${ref}" has two separations here.` });
      seen.add(ref);
    });
  });
  (Array.isArray(value.simultaneous) ? value.simultaneous : []).forEach((combo: unknown, i: number) => {
    if (!Array.isArray(combo)) return;
    combo.forEach((id: unknown, j: number) => {
      if (typeof id === 'string' && !txIds.has(id)) ctx.addIssue({ code: 'custom', path: ['simultaneous', i, j], message: `Unknown transmitter id "${id}".` });
    });
    if (new Set(combo).size !== combo.length) ctx.addIssue({ code: 'custom', path: ['simultaneous', i], message: 'A combination names each transmitter once.' });
  });
}

/** The whole file, with the cross-references checked; every problem carries its JSON path. */
export const zDeviceFile = z
  .strictObject({
    format: z.literal(DEVICE_FILE_FORMAT, { error: `"format" must be "${DEVICE_FILE_FORMAT}".` }),
    device: zDeviceInfo,
    markets: z.array(zMarket).max(REGIMES.length).default([]),
    antennas: z.array(zAntenna).max(MAX_ANTENNAS).default([]),
    transmitters: z.array(zTransmitter).max(MAX_TRANSMITTERS).default([]),
    usePositions: z.array(zUsePosition).max(MAX_USE_POSITIONS).default([]),
    simultaneous: z.array(z.array(zItemId).min(2, 'A combination names at least two transmitters.')).default([]),
  })
  // Runs even when other fields already failed, so one answer lists every problem in the file;
  // hence the defensive reads (a part that failed its own schema may still be raw input).
  .superRefine((file, ctx) => crossReferenceIssues(file as unknown, ctx), { when: (payload) => isRecord(payload.value) });
export type DeviceFile = z.output<typeof zDeviceFile>;
export type DeviceFileInput = z.input<typeof zDeviceFile>;
