/**
 * Filings and the wizard's steps: states, step ids, the step schemas (built from the device
 * file's parts, so a form and the file agree) and the shapes the API returns.
 */
import { z } from 'zod';
import { MAX_ANTENNAS, MAX_TRANSMITTERS, MAX_USE_POSITIONS, REGIMES, deviceInfoSchema, zAntenna, zDeviceInfo, zModuleGrant, zMarket, zTransmitter, zUsePosition } from './device-file';

/** A version's life: draft → in review → returned (with comments) → in review → signed. */
export const VERSION_STATES = ['draft', 'in-review', 'returned', 'signed'] as const;
export type VersionState = (typeof VERSION_STATES)[number];
export const VERSION_STATE_LABELS: Record<VersionState, string> = {
  draft: 'Draft',
  'in-review': 'In review',
  returned: 'Returned',
  signed: 'Signed',
};
/** States in which the wizard's data may change. */
export const EDITABLE_STATES: readonly VersionState[] = ['draft', 'returned'];

/** Steps whose data the user enters (autosaved); the wizard's further steps are computed. */
export const DATA_STEPS = ['device', 'radios', 'use-positions', 'markets'] as const;
export type DataStep = (typeof DATA_STEPS)[number];
export const WIZARD_STEPS = [...DATA_STEPS, 'screening', 'measurements', 'co-transmission', 'evidence'] as const;
export type WizardStep = (typeof WIZARD_STEPS)[number];
export const STEP_LABELS: Record<WizardStep, string> = {
  device: 'Device',
  radios: 'Radios',
  'use-positions': 'Use positions',
  markets: 'Markets',
  screening: 'Screening',
  measurements: 'Measurements',
  'co-transmission': 'Co-transmission',
  evidence: 'Evidence',
};

/** Where a cross-row rule reports: a zod refinement context, or a plain collector (the paste reader). */
export interface IssueSink {
  addIssue: (issue: { code: 'custom'; path: (string | number)[]; message: string }) => void;
}

const duplicateIdIssues = (items: { id: string }[], path: string, ctx: IssueSink) => {
  const seen = new Set<string>();
  items.forEach((item, i) => {
    if (seen.has(item.id)) ctx.addIssue({ code: 'custom', path: [path, i, 'id'], message: `Duplicate id "${item.id}".` });
    seen.add(item.id);
  });
};

/**
 * A saved row's own number. The ids a user types are labels: a row sent back with its rowId keeps
 * its relations (separations, co-transmission combinations) when its label changes. A row without
 * one is matched by label, or added.
 */
export const zRowId = z.number().int().positive().optional();
const withRowId = { rowId: zRowId };

/** The Device step: the device's identity, its module grants carrying their row numbers. */
export const zDeviceStep = deviceInfoSchema(zModuleGrant.safeExtend(withRowId));
export type DeviceStep = z.output<typeof zDeviceStep>;
export type DeviceStepInput = z.input<typeof zDeviceStep>;

/** One transmitter row of the Radios step (the form's row, and what a pasted row is checked with). */
export const zRadiosTransmitter = zTransmitter.safeExtend(withRowId);

/**
 * The Radios step's rules across rows: ids are unique, and every antenna a transmitter names is
 * listed. Also run on their own by the paste reader, since a refinement does not run while a
 * row has errors of its own.
 */
export function radiosCrossIssues(v: { antennas: { id: string }[]; transmitters: { id: string; antennaId: string; moreAntennaIds: string[] }[] }, ctx: IssueSink) {
  duplicateIdIssues(v.antennas, 'antennas', ctx);
  duplicateIdIssues(v.transmitters, 'transmitters', ctx);
  const antennaIds = new Set(v.antennas.map((a) => a.id));
  v.transmitters.forEach((t, i) => {
    if (!antennaIds.has(t.antennaId)) ctx.addIssue({ code: 'custom', path: ['transmitters', i, 'antennaId'], message: `Pick one of the antennas above (no antenna "${t.antennaId}").` });
    t.moreAntennaIds.forEach((a, j) => {
      if (!antennaIds.has(a)) ctx.addIssue({ code: 'custom', path: ['transmitters', i, 'moreAntennaIds', j], message: `Pick among the antennas above (no antenna "${a}").` });
    });
  });
}

/** Antennas and transmitters are saved together: a transmitter names its antenna. */
export const zRadiosStep = z
  .strictObject({
    antennas: z.array(zAntenna.extend(withRowId)).max(MAX_ANTENNAS),
    transmitters: z.array(zRadiosTransmitter).max(MAX_TRANSMITTERS),
  })
  .superRefine((v, ctx) => radiosCrossIssues(v, ctx));
export type RadiosStep = z.output<typeof zRadiosStep>;
export type RadiosStepInput = z.input<typeof zRadiosStep>;

export const zUsePositionsStep = z
  .strictObject({ usePositions: z.array(zUsePosition.extend(withRowId)).max(MAX_USE_POSITIONS) })
  .superRefine((v, ctx) => {
    duplicateIdIssues(v.usePositions, 'usePositions', ctx);
    v.usePositions.forEach((p, i) => {
      const seen = new Set<string>();
      (p.powerModes ?? []).forEach((m, j) => {
        if (seen.has(m.transmitterId)) ctx.addIssue({ code: 'custom', path: ['usePositions', i, 'powerModes', j, 'transmitterId'], message: `${m.transmitterId} already has a reduced power here.` });
        seen.add(m.transmitterId);
      });
    });
  })
  // No power modes is the same as none listed, so an unchanged step compares equal to the stored one.
  .transform((v): typeof v => ({ usePositions: v.usePositions.map(({ powerModes, ...p }) => (powerModes?.length ? { ...p, powerModes } : p)) }));
export type UsePositionsStep = z.output<typeof zUsePositionsStep>;
export type UsePositionsStepInput = z.input<typeof zUsePositionsStep>;

export const zMarketsStep = z.strictObject({ markets: z.array(zMarket).max(REGIMES.length) }).superRefine((v, ctx) => {
  const seen = new Set<string>();
  v.markets.forEach((m, i) => {
    if (seen.has(m.regime)) ctx.addIssue({ code: 'custom', path: ['markets', i, 'regime'], message: `${m.regime} is listed twice.` });
    seen.add(m.regime);
  });
});
export type MarketsStep = z.output<typeof zMarketsStep>;

export const STEP_SCHEMAS = {
  device: zDeviceStep,
  radios: zRadiosStep,
  'use-positions': zUsePositionsStep,
  markets: zMarketsStep,
} as const;

/** Creating a filing starts from the device's identity; the rest is filled step by step. */
export const zNewFiling = z.strictObject({ device: zDeviceInfo });
export type NewFilingInput = z.input<typeof zNewFiling>;

export const FILING_SORTS = ['updated', 'name', 'state'] as const;
export const zFilingListQuery = z.object({
  q: z.string().trim().max(120).optional(),
  sort: z.enum(FILING_SORTS).default('updated'),
  /** '1' lists archived filings too (the default list hides them). */
  archived: z.enum(['0', '1'], { error: 'archived must be 1 (show archived filings) or 0.' }).default('0'),
});

/** POST /api/filings/import?duplicate=refuse: a file this organisation imported before is a 409 instead of a second filing with a warning. */
export const zImportQuery = z.object({
  duplicate: z.enum(['refuse'], { error: 'duplicate must be “refuse” (or left out to import with a warning).' }).optional(),
});

export interface StepStatus {
  step: WizardStep;
  complete: boolean;
  /** What is missing or wrong, in words a user can act on. */
  problems: string[];
  /** Unsaved input with errors is kept as a draft until it validates. */
  hasDraft: boolean;
  /** Cautions that do not block the step (e.g. Canada screened on a superseded RSS-102 issue). */
  warnings: string[];
}

export interface FilingSummary {
  id: number;
  device: { name: string; model: string; applicant: string; productType: string };
  version: { id: number; number: number; state: VersionState };
  markets: string[];
  owner: { id: number; name: string };
  updatedAt: string;
  createdAt: string;
  /** Set while archived (read-only, hidden from the default list). */
  archivedAt: string | null;
}

export interface FilingDetail extends FilingSummary {
  editable: boolean;
  steps: StepStatus[];
  data: {
    device: DeviceStep;
    radios: RadiosStep;
    'use-positions': UsePositionsStep;
    markets: MarketsStep;
  };
  /** Transmitter combinations that can be on together, by transmitter label. */
  simultaneous?: string[][];
  /** Unvalidated step input saved while it still had errors. */
  drafts: Partial<Record<DataStep, { data: unknown; updatedAt: string }>>;
  /** Each step's stored-data revision; a save sends it back as If-Match (409 when stale). */
  revisions: Record<DataStep, string>;
}
