/**
 * Lab results entered by the test engineer: SAR measurements, liquid checks, system checks,
 * instruments and the uncertainty budget. One schema per row, used by the forms, the API and the
 * import (which maps a lab's spreadsheet onto these rows). Ids are the user's own ids.
 */
import { z } from 'zod';
import { FREQUENCY_MAX_HZ, FREQUENCY_MIN_HZ, POWER_MAX_DBM, POWER_MIN_DBM, SEPARATION_MAX_M, TEXT_MAX, zItemId } from './device-file';

export const MAX_MEASUREMENTS = 10_000;
export const MAX_CHECKS = 500;
export const MAX_INSTRUMENTS = 100;
export const MAX_BUDGET_COMPONENTS = 60;
/** Physical range accepted for a measured psSAR, W/kg (a value above it is a typing or unit error). */
export const SAR_MAX_W_PER_KG = 100;
export const DRIFT_MAX_DB = 10;
export const PEAK_MAX_MM = 1000;
export const TEMPERATURE_MIN_C = 0;
export const TEMPERATURE_MAX_C = 50;
export const MAX_REPEATS = 3;

export const INSTRUMENT_KINDS = ['probe', 'dipole', 'dae', 'power-meter'] as const;
export type InstrumentKind = (typeof INSTRUMENT_KINDS)[number];
export const INSTRUMENT_KIND_LABELS: Record<InstrumentKind, string> = {
  probe: 'E-field probe',
  dipole: 'Reference dipole',
  dae: 'Data acquisition electronics',
  'power-meter': 'Power meter',
};
export const LIQUID_KINDS = ['head', 'body'] as const;
export const AVERAGING_MASSES = ['1g', '10g'] as const;
export const DISTRIBUTIONS = ['normal', 'rectangular', 'u-shaped', 'triangular'] as const;

const finite = (label: string) => z.number({ error: `Enter the ${label} as a number.` }).refine(Number.isFinite, `The ${label} must be a finite number.`);
const between = (label: string, min: number, max: number, unit: string) =>
  finite(label).pipe(z.number().min(min, `The ${label} must be at least ${min} ${unit}.`).max(max, `The ${label} must be at most ${max} ${unit}.`));
const text = (label: string, max = TEXT_MAX) => z.string().trim().max(max, `The ${label} has at most ${max} characters.`).default('');
export const zIsoDate = z
  .string({ error: 'Enter a date as YYYY-MM-DD.' })
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'Enter a date as YYYY-MM-DD.')
  .refine((s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)) && new Date(`${s}T00:00:00Z`).toISOString().startsWith(s), 'That date does not exist.');
const zFrequencyHz = between('frequency', FREQUENCY_MIN_HZ, FREQUENCY_MAX_HZ, 'Hz');
const zSar = (label: string) =>
  finite(label).pipe(z.number().gt(0, `The ${label} must be above 0 W/kg.`).max(SAR_MAX_W_PER_KG, `The ${label} must be at most ${SAR_MAX_W_PER_KG} W/kg; check the unit.`));
const zPower = (label: string) => between(label, POWER_MIN_DBM, POWER_MAX_DBM, 'dBm');

export const zMeasurement = z
  .strictObject({
    id: zItemId,
    transmitterId: zItemId,
    usePositionId: zItemId,
    testPosition: text('test position', 80),
    channel: text('channel', 40),
    frequencyHz: zFrequencyHz,
    testSeparationM: between('test separation', 0, SEPARATION_MAX_M, 'm'),
    measuredPowerDbm: zPower('measured power'),
    /** Blank → the transmitter's maximum tune-up power. */
    tuneUpPowerDbm: zPower('tune-up power').nullable().default(null),
    testDutyCycle: finite('test duty cycle').pipe(z.number().gt(0, 'The test duty cycle must be above 0.').max(1, 'The test duty cycle must be at most 1.')).default(1),
    sar1gWPerKg: zSar('1 g SAR').nullable().default(null),
    sar10gWPerKg: zSar('10 g SAR').nullable().default(null),
    /** Repeated measurements of the same configuration (same averaging mass as the first SAR given). */
    repeatSarWPerKg: z.array(zSar('repeat SAR')).max(MAX_REPEATS, `At most ${MAX_REPEATS} repeats.`).default([]),
    driftDb: between('power drift', -DRIFT_MAX_DB, DRIFT_MAX_DB, 'dB').nullable().default(null),
    testDate: zIsoDate,
    peakXMm: between('peak x', -PEAK_MAX_MM, PEAK_MAX_MM, 'mm').nullable().default(null),
    peakYMm: between('peak y', -PEAK_MAX_MM, PEAK_MAX_MM, 'mm').nullable().default(null),
    liquidCheckId: zItemId.nullable().default(null),
    systemCheckId: zItemId.nullable().default(null),
  })
  .refine((m) => m.sar1gWPerKg !== null || m.sar10gWPerKg !== null, { path: ['sar1gWPerKg'], message: 'Give the 1 g SAR, the 10 g SAR or both.' });
export type Measurement = z.output<typeof zMeasurement>;
export type MeasurementInput = z.input<typeof zMeasurement>;

export const zLiquidCheck = z.strictObject({
  id: zItemId,
  date: zIsoDate,
  liquid: z.enum(LIQUID_KINDS, { error: 'Pick head or body liquid.' }).default('head'),
  frequencyHz: zFrequencyHz,
  relativePermittivity: between('measured εr', 1, 200, ''),
  conductivitySPerM: between('measured σ', 0.01, 20, 'S/m'),
  temperatureC: between('liquid temperature', TEMPERATURE_MIN_C, TEMPERATURE_MAX_C, '°C').nullable().default(null),
});
export type LiquidCheck = z.output<typeof zLiquidCheck>;

export const zSystemCheck = z.strictObject({
  id: zItemId,
  date: zIsoDate,
  frequencyHz: zFrequencyHz,
  dipoleSerial: text('dipole serial', 60),
  averagingMass: z.enum(AVERAGING_MASSES).default('1g'),
  /** Measured psSAR normalised to 1 W input power, W/kg per W. */
  measuredSarWPerKgPerW: zSar('measured system-check SAR'),
  targetSarWPerKgPerW: zSar('target system-check SAR'),
});
export type SystemCheck = z.output<typeof zSystemCheck>;

export const zInstrument = z
  .strictObject({
    id: zItemId,
    kind: z.enum(INSTRUMENT_KINDS, { error: `Pick a kind (${INSTRUMENT_KINDS.join(', ')}).` }),
    model: text('model', 60),
    serial: text('serial', 60),
    calibrationDate: zIsoDate,
    dueDate: zIsoDate,
  })
  .refine((i) => i.dueDate > i.calibrationDate, { path: ['dueDate'], message: 'The due date must be after the calibration date.' });
export type Instrument = z.output<typeof zInstrument>;

export const zBudgetComponent = z.strictObject({
  name: z.string().trim().min(1, 'Name the contribution.').max(TEXT_MAX),
  valuePct: between('uncertainty value', 0, 100, '%'),
  distribution: z.enum(DISTRIBUTIONS, { error: `Pick a distribution (${DISTRIBUTIONS.join(', ')}).` }),
  divisor: finite('divisor').pipe(z.number().gt(0, 'The divisor must be above 0.')).nullable().default(null),
  sensitivity: between('sensitivity coefficient', -10, 10, ''),
  degreesOfFreedom: finite('degrees of freedom').pipe(z.number().gt(0, 'Degrees of freedom must be above 0.')).nullable().default(null),
});
export type BudgetComponent = z.output<typeof zBudgetComponent>;

const uniqueIds = (label: string) => (items: { id: string }[], ctx: z.RefinementCtx) => {
  const seen = new Set<string>();
  items.forEach((item, i) => {
    if (seen.has(item.id)) ctx.addIssue({ code: 'custom', path: [i, 'id'], message: `Duplicate ${label} id "${item.id}".` });
    seen.add(item.id);
  });
};

export const zMeasurementsBody = z.strictObject({
  measurements: z.array(zMeasurement).max(MAX_MEASUREMENTS).superRefine(uniqueIds('measurement')),
});
export const zLiquidChecksBody = z.strictObject({ liquidChecks: z.array(zLiquidCheck).max(MAX_CHECKS).superRefine(uniqueIds('liquid check')) });
export const zSystemChecksBody = z.strictObject({ systemChecks: z.array(zSystemCheck).max(MAX_CHECKS).superRefine(uniqueIds('system check')) });
export const zInstrumentsBody = z.strictObject({ instruments: z.array(zInstrument).max(MAX_INSTRUMENTS).superRefine(uniqueIds('instrument')) });
export const zUncertaintyBody = z.strictObject({
  components: z
    .array(zBudgetComponent)
    .max(MAX_BUDGET_COMPONENTS)
    .superRefine((list, ctx) => {
      const seen = new Set<string>();
      list.forEach((c, i) => {
        if (seen.has(c.name)) ctx.addIssue({ code: 'custom', path: [i, 'name'], message: `Duplicate contribution "${c.name}".` });
        seen.add(c.name);
      });
    }),
});

/** The lab data sets the API reads and replaces, by URL segment. */
export const LAB_SETS = {
  measurements: { body: zMeasurementsBody, key: 'measurements' },
  'liquid-checks': { body: zLiquidChecksBody, key: 'liquidChecks' },
  'system-checks': { body: zSystemChecksBody, key: 'systemChecks' },
  instruments: { body: zInstrumentsBody, key: 'instruments' },
  'uncertainty-budget': { body: zUncertaintyBody, key: 'components' },
} as const;
export type LabSet = keyof typeof LAB_SETS;
export const LAB_SET_NAMES = Object.keys(LAB_SETS) as LabSet[];

export interface LabData {
  measurements: Measurement[];
  liquidChecks: LiquidCheck[];
  systemChecks: SystemCheck[];
  instruments: Instrument[];
  components: BudgetComponent[];
}

// ---------------------------------------------------------------------------------------------
// Import: the CSV header that needs no mapping, and the units a mapped column may carry.

export const IMPORT_FIELDS = [
  'transmitter_id',
  'use_position_id',
  'test_position',
  'channel',
  'frequency_mhz',
  'test_separation_mm',
  'measured_power_dbm',
  'tune_up_power_dbm',
  'test_duty_cycle',
  'sar_1g_w_kg',
  'sar_10g_w_kg',
  'drift_db',
  'test_date',
  'peak_x_mm',
  'peak_y_mm',
  // Optional extras a lab's export may carry.
  'measurement_id',
  'repeat_sar_w_kg',
  'liquid_check_id',
  'system_check_id',
] as const;
export type ImportField = (typeof IMPORT_FIELDS)[number];
export const REQUIRED_IMPORT_FIELDS: readonly ImportField[] = ['transmitter_id', 'use_position_id', 'frequency_mhz', 'test_separation_mm', 'measured_power_dbm', 'test_date'];

export const UNIT_FACTORS = {
  frequency: { Hz: 1, kHz: 1e3, MHz: 1e6, GHz: 1e9 },
  length: { mm: 1e-3, cm: 1e-2, m: 1 },
  power: { dBm: 0, mW: 0, W: 0 },
  sar: { 'W/kg': 1, 'mW/g': 1, 'mW/kg': 1e-3 },
} as const;
export type UnitKind = keyof typeof UNIT_FACTORS;
export const FIELD_UNIT_KIND: Partial<Record<ImportField, UnitKind>> = {
  frequency_mhz: 'frequency',
  test_separation_mm: 'length',
  measured_power_dbm: 'power',
  tune_up_power_dbm: 'power',
  sar_1g_w_kg: 'sar',
  sar_10g_w_kg: 'sar',
  repeat_sar_w_kg: 'sar',
};
export const FIELD_DEFAULT_UNIT: Partial<Record<ImportField, string>> = {
  frequency_mhz: 'MHz',
  test_separation_mm: 'mm',
  measured_power_dbm: 'dBm',
  tune_up_power_dbm: 'dBm',
  sar_1g_w_kg: 'W/kg',
  sar_10g_w_kg: 'W/kg',
  repeat_sar_w_kg: 'W/kg',
};

/** A column mapping: for each field, the file's column header and the unit its values are in. */
export const zImportMapping = z.partialRecord(z.enum(IMPORT_FIELDS), z.strictObject({ column: z.string().min(1).max(TEXT_MAX), unit: z.string().max(10).optional() }));
export type ImportMapping = z.output<typeof zImportMapping>;

export interface ImportProblem {
  /** 1-based line of the file (the header is line 1; XLSX: the sheet's row number). */
  line: number;
  /** The file's column header, or null for a problem with the whole row or file. */
  column: string | null;
  field: ImportField | null;
  message: string;
}

/** What an import (or its dry run) answers: how the file was read, the preview and every problem. */
export interface ImportPreview {
  format: 'csv' | 'xlsx';
  delimiter: string | null;
  decimalComma: boolean;
  headers: string[];
  mapping: ImportMapping;
  mappingSource: 'given' | 'remembered' | 'header' | 'guessed';
  rowCount: number;
  /** The first rows (and every row with a problem), cells as the file gives them, by field. */
  rows: { line: number; cells: Partial<Record<ImportField, string>> }[];
  problems: ImportProblem[];
  dryRun: boolean;
  imported: number;
}
