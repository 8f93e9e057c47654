/**
 * The device description file, format "fieldfile.device/1": what a lab's own tools can write to
 * create a filing, and what GET /api/filings/:id/device.json exports. Published as JSON Schema at
 * /api/schema/device.json. Units are SI and part of every field name.
 *
 * The per-part schemas are also the wizard's step schemas, so a form and the file agree.
 */
import { z } from 'zod';
import { MAX_ANTENNAS, MAX_MODULES, MAX_TRANSMITTERS, MAX_USE_POSITIONS } from '../../calc/input-limits';
import { ANTENNA_USES, POWER_MODE_TRIGGERS, type PowerModeTrigger } from '../../calc/screening/input';
import { DUTY_FACTOR_PRESET_KEYS, findDutyFactorPreset } from '../duty-factors';
import { pairIssues, zGranteeCode, zIsedCompanyNumber, zIsedUpn, zProductCode } from './grant-ids';

export const DEVICE_FILE_FORMAT = 'fieldfile.device/1';

export const TEXT_MAX = 120;
export const ID_MAX = 40;
// One set of limits for the wizard, the device file and the engine.
export { MAX_ANTENNAS, MAX_MODULES, MAX_TRANSMITTERS, MAX_USE_POSITIONS };
export const FREQUENCY_MIN_HZ = 100e3;
export const FREQUENCY_MAX_HZ = 300e9;
export const POWER_MIN_DBM = -30;
export const POWER_MAX_DBM = 60;
export const GAIN_MIN_DBI = -30;
export const GAIN_MAX_DBI = 30;
export const SEPARATION_MAX_M = 10;
export const MAX_MODEL_VARIANTS = 20;
export const TOLERANCE_MAX_DB = 10;
/** Target ± tolerance must give the stated maximum to this precision (the dBm fields print two decimals). */
export const TUNE_UP_MATCH_DB = 0.005;

export const PRODUCT_TYPES = ['phone', 'tablet', 'wearable', 'tracker', 'hotspot', 'iot-module', 'two-way-radio', 'laptop', 'other'] as const;
export type ProductType = (typeof PRODUCT_TYPES)[number];
export const PRODUCT_TYPE_LABELS: Record<ProductType, string> = {
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

/**
 * Whether the product is a host (its radios are its own), a module (certified to go inside hosts)
 * or a host with a certified module inside, whose grant and its conditions carry into the host's
 * screening.
 */
export const INTEGRATIONS = ['host', 'module', 'host-with-module'] as const;
export type Integration = (typeof INTEGRATIONS)[number];
export const INTEGRATION_LABELS: Record<Integration, string> = {
  host: 'A product with its own radios',
  module: 'A module, certified to go inside hosts',
  'host-with-module': 'A host with a certified module inside',
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

export { POWER_MODE_TRIGGERS, type PowerModeTrigger };
export const POWER_MODE_TRIGGER_LABELS: Record<PowerModeTrigger, string> = {
  'hotspot-back-off': 'Hotspot back-off',
  'proximity-sensor': 'Proximity sensor',
  'time-averaged-sar': 'Time-averaged SAR limit',
};

const text = (label: string, max = TEXT_MAX) =>
  z
    .string({ error: `Enter the ${label}.` })
    .trim()
    .min(1, `Enter the ${label}.`)
    .max(max, `The ${label} has at most ${max} characters.`);
const optionalText = (label: string, max = TEXT_MAX) => z.string().trim().max(max, `The ${label} has at most ${max} characters.`).default('');

export const zItemId = z
  .string({ error: 'Enter an id.' })
  .trim()
  .min(1, 'Enter an id.')
  .max(ID_MAX, `An id has at most ${ID_MAX} characters.`)
  .regex(/^[A-Za-z0-9][A-Za-z0-9._-]*$/, 'Use letters, digits, ".", "_" or "-" (start with a letter or digit).');

const finite = (label: string) => z.number({ error: `Enter the ${label} as a number.` }).refine(Number.isFinite, `The ${label} must be a finite number.`);

const zSeparationM = (label: string) => finite(label).pipe(z.number().min(0, `A ${label} cannot be negative.`).max(SEPARATION_MAX_M, `A ${label} is at most ${SEPARATION_MAX_M} m.`));

/** Another model number the filing covers, and how it differs from the tested one. */
export const zModelVariant = z.strictObject({
  model: text('variant’s model number'),
  difference: optionalText('difference', 240).describe('How the variant differs from the tested model (e.g. colour, housing, no GNSS).'),
});

/** A certified module inside a host: its grant, and the grant's conditions that bind the host. */
export const zModuleGrant = z
  .strictObject({
    id: zItemId.describe('The module’s label in this file; transmitters name it in moduleId.'),
    name: optionalText('module name').describe('The module’s maker and model, e.g. "Acme LM-20 LTE-M module".'),
    fccGranteeCode: zGranteeCode,
    fccProductCode: zProductCode,
    isedCompanyNumber: zIsedCompanyNumber,
    isedUpn: zIsedUpn,
    minSeparationM: zSeparationM('minimum separation').optional().describe('The module grant’s minimum separation from the body, m; screening warns where a use position is closer.'),
    conditions: optionalText('grant conditions', 400).describe('Other conditions of the module’s grant, as the grant states them.'),
  })
  .superRefine((m, ctx) => {
    pairIssues(m, ctx);
    if (!m.fccGranteeCode && !m.fccProductCode && !m.isedCompanyNumber && !m.isedUpn) {
      ctx.addIssue({ code: 'custom', path: ['fccGranteeCode'], message: 'Enter the module’s FCC ID or its ISED certification number.' });
    }
  });
export type ModuleGrant = z.output<typeof zModuleGrant>;

/** The device's identity; `module` is the module-grant schema (the wizard's adds a row number). */
export function deviceInfoSchema<M extends z.ZodType<{ id: string }>>(module: M) {
  return z
    .strictObject({
      name: text('device name'),
      model: text('model number'),
      applicant: text('applicant'),
      productType: z.enum(PRODUCT_TYPES, { error: 'Pick a product type.' }),
      hardwareVersion: optionalText('hardware version'),
      firmwareVersion: optionalText('firmware version'),
      fccGranteeCode: zGranteeCode,
      fccProductCode: zProductCode,
      isedCompanyNumber: zIsedCompanyNumber,
      isedUpn: zIsedUpn,
      hvin: optionalText('HVIN', 60).describe('Hardware version identification number (ISED RSP-100).'),
      pmn: optionalText('PMN').describe('Product marketing name (ISED RSP-100).'),
      fvin: optionalText('FVIN', 60).describe('Firmware version identification number (ISED RSP-100), when the firmware decides RF behaviour.'),
      modelVariants: z.array(zModelVariant).max(MAX_MODEL_VARIANTS, `At most ${MAX_MODEL_VARIANTS} model variants.`).default([]),
      integration: z.enum(INTEGRATIONS, { error: 'Pick host, module or host with a module.' }).default('host'),
      modules: z.array(module).max(MAX_MODULES, `At most ${MAX_MODULES} modules.`).default([]).describe('Certified modules inside a host (integration "host-with-module").'),
    })
    .superRefine((d, ctx) => {
      pairIssues(d, ctx);
      const modules = d.modules as { id: string }[];
      if (modules.length && d.integration !== 'host-with-module') {
        ctx.addIssue({ code: 'custom', path: ['integration'], message: 'Module grants are listed for a host with a certified module inside: pick that, or remove the modules.' });
      }
      const seen = new Set<string>();
      modules.forEach((m, i) => {
        if (seen.has(m.id)) ctx.addIssue({ code: 'custom', path: ['modules', i, 'id'], message: `Duplicate id "${m.id}".` });
        seen.add(m.id);
      });
      const models = new Set([d.model.toUpperCase()]);
      d.modelVariants.forEach((v, i) => {
        if (models.has(v.model.toUpperCase())) ctx.addIssue({ code: 'custom', path: ['modelVariants', i, 'model'], message: `Model "${v.model}" is already listed.` });
        models.add(v.model.toUpperCase());
      });
    });
}

export const zDeviceInfo = deviceInfoSchema(zModuleGrant);
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
  gainDbi: finite('antenna gain').pipe(z.number().min(GAIN_MIN_DBI, `Gain must be at least ${GAIN_MIN_DBI} dBi.`).max(GAIN_MAX_DBI, `Gain must be at most ${GAIN_MAX_DBI} dBi.`)),
  location: optionalText('antenna location'),
});
export type Antenna = z.output<typeof zAntenna>;

const zFrequencyHz = (label: string) =>
  finite(label).pipe(z.number().min(FREQUENCY_MIN_HZ, `The ${label} must be at least 100 kHz (0.1 MHz).`).max(FREQUENCY_MAX_HZ, `The ${label} must be at most 300 GHz (300 000 MHz).`));

const zPowerDbm = (label: string) =>
  finite(label).pipe(z.number().min(POWER_MIN_DBM, `The ${label} must be at least ${POWER_MIN_DBM} dBm.`).max(POWER_MAX_DBM, `The ${label} must be at most ${POWER_MAX_DBM} dBm.`));

export const zTransmitter = z
  .strictObject({
    id: zItemId,
    technology: text('technology', 60),
    band: text('band', 60),
    frequencyMinHz: zFrequencyHz('lowest frequency'),
    frequencyMaxHz: zFrequencyHz('highest frequency'),
    maxTuneUpPowerDbm: zPowerDbm('maximum tune-up power').describe('The upper bound of the tune-up power (target + tolerance), dBm: what screening uses.'),
    /** Target ± tolerance, when the tune-up procedure states them; their sum is maxTuneUpPowerDbm. */
    tuneUpTargetDbm: zPowerDbm('tune-up target').optional().describe('Tune-up target power, dBm.'),
    tuneUpToleranceDb: finite('tune-up tolerance')
      .pipe(z.number().min(0, 'A tolerance cannot be negative.').max(TOLERANCE_MAX_DB, `A tolerance is at most ${TOLERANCE_MAX_DB} dB.`))
      .optional()
      .describe('Tune-up tolerance, ± dB, around the target.'),
    mode: optionalText('mode', 60).describe('Operating mode as the lab names it, e.g. "QPSK 1 RB", "802.11b".'),
    modulation: optionalText('modulation', 60).describe('Modulation, e.g. "QPSK", "GFSK".'),
    bandwidth: optionalText('bandwidth', 60).describe('Channel bandwidth as text, e.g. "10 MHz", "20/40/80 MHz".'),
    /** Maximum transmit duty cycle, 0 < d ≤ 1 (1 = continuous). */
    dutyCycle: finite('duty cycle').pipe(z.number().gt(0, 'Duty cycle must be above 0 %.').max(1, 'Duty cycle must be at most 100 %.')).default(1),
    dutyCyclePreset: z
      .enum(['', ...DUTY_FACTOR_PRESET_KEYS] as [string, ...string[]], { error: 'Pick one of the duty-factor presets, or none.' })
      .default('')
      .describe('The duty-factor preset the duty cycle comes from (with its source), or "" for a typed value.'),
    antennaId: zItemId.describe('The transmitter’s antenna (with several, its first).'),
    moreAntennaIds: z
      .array(zItemId)
      .max(MAX_ANTENNAS - 1)
      .default([])
      .describe('Further antennas the transmitter uses (MIMO or switched); every antenna × use position is screened.'),
    antennaUse: z
      .enum(ANTENNA_USES, { error: 'Pick MIMO (all at once) or switched (one at a time).' })
      .default('mimo')
      .describe('With several antennas: "mimo" — all at once, the streams’ powers add (maxTuneUpPowerDbm is per stream); "switched" — one at a time.'),
    moduleId: zItemId.optional().describe('The certified module (device.modules) this transmitter is part of; its grant conditions apply.'),
  })
  .refine((t) => t.frequencyMinHz <= t.frequencyMaxHz, {
    path: ['frequencyMaxHz'],
    message: 'The highest frequency must not be below the lowest.',
  })
  .superRefine((t, ctx) => {
    const hasTarget = t.tuneUpTargetDbm !== undefined;
    const hasTolerance = t.tuneUpToleranceDb !== undefined;
    if (hasTarget && !hasTolerance) ctx.addIssue({ code: 'custom', path: ['tuneUpToleranceDb'], message: 'Enter the tolerance that goes with the target (0 if none).' });
    if (!hasTarget && hasTolerance) ctx.addIssue({ code: 'custom', path: ['tuneUpTargetDbm'], message: 'Enter the target that goes with the tolerance.' });
    if (hasTarget && hasTolerance) {
      const upper = t.tuneUpTargetDbm! + t.tuneUpToleranceDb!;
      if (Math.abs(upper - t.maxTuneUpPowerDbm) > TUNE_UP_MATCH_DB) {
        ctx.addIssue({
          code: 'custom',
          path: ['maxTuneUpPowerDbm'],
          message: `Target ${t.tuneUpTargetDbm} dBm + tolerance ${t.tuneUpToleranceDb} dB gives ${Number(upper.toFixed(2))} dBm: the maximum is that upper bound.`,
        });
      }
    }
    t.moreAntennaIds.forEach((a, j) => {
      if (a === t.antennaId || t.moreAntennaIds.indexOf(a) !== j)
        ctx.addIssue({ code: 'custom', path: ['moreAntennaIds', j], message: `Antenna "${a}" is already one of this transmitter’s antennas.` });
    });
    const preset = t.dutyCyclePreset ? findDutyFactorPreset(t.dutyCyclePreset) : undefined;
    if (preset && Math.abs(preset.dutyCycle - t.dutyCycle) > 1e-6) {
      ctx.addIssue({ code: 'custom', path: ['dutyCycle'], message: `${preset.label} gives ${Number((preset.dutyCycle * 100).toFixed(2))} %; clear the preset to type another duty cycle.` });
    }
  });
export type Transmitter = z.output<typeof zTransmitter>;

export const zSeparation = z.strictObject({
  antennaId: zItemId,
  separationM: zSeparationM('separation distance'),
});

/** A transmitter's reduced tune-up power in one use position, and what triggers the reduction. */
export const zPowerMode = z.strictObject({
  transmitterId: zItemId.describe('The transmitter (transmitters[].id) that runs at a reduced power in this use position.'),
  reducedTuneUpPowerDbm: zPowerDbm('reduced tune-up power').describe(
    'The tune-up power that applies in this use position, dBm (tolerance included, like maxTuneUpPowerDbm); below the transmitter’s maximum. Screening uses it here.',
  ),
  trigger: z
    .enum(POWER_MODE_TRIGGERS, { error: 'Pick what triggers the reduction: hotspot back-off, proximity sensor or time-averaged SAR limit.' })
    .describe(
      'What holds the power down in this position: "hotspot-back-off" (hotspot mode on), "proximity-sensor" (a body within the sensor’s triggering distance) or "time-averaged-sar" (a time-averaged SAR algorithm’s power limit).',
    ),
});
export type PowerMode = z.output<typeof zPowerMode>;

export const zUsePosition = z.strictObject({
  id: zItemId,
  kind: z.enum(USE_POSITION_KINDS, { error: `Pick a kind (${USE_POSITION_KINDS.join(', ')}).` }),
  separations: z.array(zSeparation).max(MAX_ANTENNAS),
  powerModes: z
    .array(zPowerMode)
    .max(MAX_TRANSMITTERS)
    .optional()
    .describe('Optional: transmitters that reduce their tune-up power in this use position (one entry per transmitter); the others use their maximum.'),
});
export type UsePosition = z.output<typeof zUsePosition>;

const duplicates = (ids: string[]) => ids.filter((id, i) => ids.indexOf(id) !== i);

type Loose = Record<string, unknown>;
const isRecord = (v: unknown): v is Loose => typeof v === 'object' && v !== null && !Array.isArray(v);
const records = (v: unknown): Loose[] => (Array.isArray(v) ? v.map((x) => (isRecord(x) ? x : {})) : []);
const str = (v: unknown): string | undefined => (typeof v === 'string' ? v : undefined);

/**
 * A use position's power modes against the transmitters: each names a known transmitter once, at
 * a power below its maximum. Shared by the device file and the wizard's step check.
 */
export function powerModeIssues(
  modes: { transmitterId?: unknown; reducedTuneUpPowerDbm?: unknown }[],
  maxDbmOf: Map<string | undefined, number | undefined>,
  at: (string | number)[],
  ctx: { addIssue: (issue: { code: 'custom'; path: (string | number)[]; message: string }) => void },
  unknownMessage: (id: string) => string,
) {
  const seen = new Set<string>();
  modes.forEach((m, j) => {
    const id = str(m.transmitterId);
    if (id === undefined) return;
    const path = [...at, 'powerModes', j];
    if (!maxDbmOf.has(id)) ctx.addIssue({ code: 'custom', path: [...path, 'transmitterId'], message: unknownMessage(id) });
    if (seen.has(id)) ctx.addIssue({ code: 'custom', path: [...path, 'transmitterId'], message: `Transmitter "${id}" already has a reduced power in this use position.` });
    seen.add(id);
    const max = maxDbmOf.get(id);
    if (typeof m.reducedTuneUpPowerDbm === 'number' && max !== undefined && m.reducedTuneUpPowerDbm >= max) {
      ctx.addIssue({ code: 'custom', path: [...path, 'reducedTuneUpPowerDbm'], message: `A reduced power must be below ${id}’s maximum tune-up power (${max} dBm).` });
    }
  });
}

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
  const moduleIds = new Set(records(isRecord(value.device) ? value.device.modules : []).map((m) => str(m.id)));
  transmitters.forEach((t, i) => {
    const ref = str(t.antennaId);
    if (ref !== undefined && !antennaIds.has(ref)) ctx.addIssue({ code: 'custom', path: ['transmitters', i, 'antennaId'], message: `Unknown antenna id "${ref}".` });
    (Array.isArray(t.moreAntennaIds) ? t.moreAntennaIds : []).forEach((a: unknown, j: number) => {
      if (typeof a === 'string' && !antennaIds.has(a)) ctx.addIssue({ code: 'custom', path: ['transmitters', i, 'moreAntennaIds', j], message: `Unknown antenna id "${a}".` });
    });
    const mod = str(t.moduleId);
    if (mod !== undefined && !moduleIds.has(mod)) ctx.addIssue({ code: 'custom', path: ['transmitters', i, 'moduleId'], message: `Unknown module id "${mod}" (device.modules).` });
  });
  const maxDbmOf = new Map(transmitters.map((t) => [str(t.id), typeof t.maxTuneUpPowerDbm === 'number' ? t.maxTuneUpPowerDbm : undefined]));
  usePositions.forEach((p, i) => powerModeIssues(records(p.powerModes), maxDbmOf, ['usePositions', i], ctx, (id) => `Unknown transmitter id "${id}".`));
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
  const positionIds = new Set(usePositions.map((p) => str(p.id)));
  (Array.isArray(value.simultaneous) ? value.simultaneous : []).forEach((entry: unknown, i: number) => {
    // A bare list holds in every use position; an object may name the one position it holds in.
    const combo = Array.isArray(entry) ? entry : isRecord(entry) && Array.isArray(entry.transmitterIds) ? entry.transmitterIds : undefined;
    const at = Array.isArray(entry) ? ['simultaneous', i] : ['simultaneous', i, 'transmitterIds'];
    if (isRecord(entry)) {
      const pos = str(entry.usePositionId);
      if (pos !== undefined && !positionIds.has(pos)) ctx.addIssue({ code: 'custom', path: ['simultaneous', i, 'usePositionId'], message: `Unknown use position id "${pos}".` });
    }
    if (!combo) return;
    combo.forEach((id: unknown, j: number) => {
      if (typeof id === 'string' && !txIds.has(id)) ctx.addIssue({ code: 'custom', path: [...at, j], message: `Unknown transmitter id "${id}".` });
    });
    if (new Set(combo).size !== combo.length) ctx.addIssue({ code: 'custom', path: at, message: 'A combination names each transmitter once.' });
  });
}

const zCombination = z.array(zItemId).min(2, 'A combination names at least two transmitters.').describe('Transmitter ids that may transmit at the same time, in every use position.');
/** Written only for a combination limited to one use position, so files without any stay as they were. */
const zPositionCombination = z
  .strictObject({
    transmitterIds: zCombination.describe('Transmitter ids that may transmit at the same time.'),
    usePositionId: zItemId.optional().describe('The id of the one use position (usePositions[].id) this combination holds in; absent means every use position.'),
  })
  .describe('A combination with the use position it holds in.');
export type DeviceFileCombination = z.output<typeof zPositionCombination> | string[];

/** The whole file, with the cross-references checked; every problem carries its JSON path. */
export const zDeviceFile = z
  .strictObject({
    format: z.literal(DEVICE_FILE_FORMAT, { error: `"format" must be "${DEVICE_FILE_FORMAT}".` }),
    device: zDeviceInfo,
    markets: z.array(zMarket).max(REGIMES.length).default([]),
    antennas: z.array(zAntenna).max(MAX_ANTENNAS).default([]),
    transmitters: z.array(zTransmitter).max(MAX_TRANSMITTERS).default([]),
    usePositions: z.array(zUsePosition).max(MAX_USE_POSITIONS).default([]),
    simultaneous: z.array(z.union([zCombination, zPositionCombination])).default([]),
  })
  // Runs even when other fields already failed, so one answer lists every problem in the file;
  // hence the defensive reads (a part that failed its own schema may still be raw input).
  .superRefine((file, ctx) => crossReferenceIssues(file as unknown, ctx), { when: (payload) => isRecord(payload.value) });
export type DeviceFile = z.output<typeof zDeviceFile>;
export type DeviceFileInput = z.input<typeof zDeviceFile>;
