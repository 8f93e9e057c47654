/**
 * Input of the `screening` calculation: the parts of a device description that decide exemption —
 * markets, antennas, transmitters and use positions. Field names match the device file
 * ("fieldfile.device/1") so the server can pass its parts straight through; calc/ may not import
 * that schema, so it is restated here. Unknown keys (device info, antenna location, simultaneous
 * combinations) are accepted and ignored.
 */
import { MAX_ANTENNAS, MAX_ID_CHARS, MAX_MODULES, MAX_TEXT_CHARS, MAX_TRANSMITTERS, MAX_USE_POSITIONS } from '../input-limits';
import { z } from 'zod';

export const SCREENING_REGIMES = ['fcc', 'ised', 'eu', 'icnirp-2020'] as const;
export type ScreeningRegime = (typeof SCREENING_REGIMES)[number];
export const SCREENING_TIERS = ['general', 'occupational'] as const;
export type ScreeningTier = (typeof SCREENING_TIERS)[number];
/** FCC: the §1.1307(b)(3) exemptions (default) or the legacy KDB 447498 D01 v06 §4.3.1 test exclusion. */
export const FCC_SAR_SCREENINGS = ['exemption', 'kdb-test-exclusion'] as const;
export type FccSarScreening = (typeof FCC_SAR_SCREENINGS)[number];
/** How a transmitter with several antennas uses them: all at once (MIMO) or one at a time. */
export const ANTENNA_USES = ['mimo', 'switched'] as const;
export type AntennaUse = (typeof ANTENNA_USES)[number];
export const USE_POSITION_KINDS = ['head', 'body-worn', 'hotspot', 'extremity', 'far-field'] as const;
export type UsePositionKind = (typeof USE_POSITION_KINDS)[number];
/**
 * What makes a transmitter reduce its tune-up power in a use position: a hotspot mode's back-off,
 * a proximity sensor, or a time-averaged SAR algorithm's limit (power.ts names their sources).
 */
export const POWER_MODE_TRIGGERS = ['hotspot-back-off', 'proximity-sensor', 'time-averaged-sar'] as const;
export type PowerModeTrigger = (typeof POWER_MODE_TRIGGERS)[number];

const id = z.string().trim().min(1, 'an id is required').max(MAX_ID_CHARS);
const finite = z.number().refine(Number.isFinite, 'must be a finite number');

const market = z.object({
  regime: z.enum(SCREENING_REGIMES),
  tier: z.enum(SCREENING_TIERS).default('general'),
  fccSarScreening: z.enum(FCC_SAR_SCREENINGS).optional().describe('FCC only; default "exemption"'),
});

const antenna = z.object({
  id,
  gainDbi: finite.pipe(z.number().min(-30).max(30)).describe('Antenna gain, dBi'),
});

const transmitter = z.object({
  id,
  technology: z.string().max(MAX_TEXT_CHARS).optional(),
  band: z.string().max(MAX_TEXT_CHARS).optional(),
  frequencyMinHz: finite.pipe(z.number().positive()).describe('Lowest frequency of the band, Hz'),
  frequencyMaxHz: finite.pipe(z.number().positive()).describe('Highest frequency of the band, Hz'),
  maxTuneUpPowerDbm: finite.pipe(z.number().min(-30).max(60)).describe('Maximum tune-up (conducted) power, dBm'),
  dutyCycle: finite.pipe(z.number().gt(0).max(1)).default(1).describe('Maximum transmit duty cycle, (0, 1]'),
  antennaId: id.describe('The transmitter’s (first) antenna'),
  moreAntennaIds: z.array(id).max(MAX_ANTENNAS).optional().describe('Further antennas it uses; each antenna × use position is screened and the least favourable reported'),
  antennaUse: z.enum(ANTENNA_USES).optional().describe('With several antennas: "mimo" (all at once, the streams’ powers add; the default) or "switched" (one at a time)'),
  moduleId: id.optional().describe('The certified module (modules) this transmitter is part of'),
});

/** A certified module inside the host, with the grant's minimum separation from the body. */
const moduleGrant = z.object({
  id,
  minSeparationM: finite.pipe(z.number().min(0).max(10)).optional().describe('The module grant’s minimum separation from the body, m'),
});

const usePosition = z.object({
  id,
  kind: z.enum(USE_POSITION_KINDS),
  separations: z.array(z.object({ antennaId: id, separationM: finite.pipe(z.number().min(0).max(10)).describe('Separation distance, m') })).max(MAX_ANTENNAS),
  /** Only where a transmitter reduces its power here (absent otherwise, so older inputs hash as before). */
  powerModes: z
    .array(
      z.object({
        transmitterId: id,
        reducedTuneUpPowerDbm: finite.pipe(z.number().min(-30).max(60)).describe('The tune-up power that applies in this position, dBm'),
        trigger: z.enum(POWER_MODE_TRIGGERS),
      }),
    )
    .max(MAX_TRANSMITTERS)
    .optional()
    .describe('Reduced tune-up powers in this use position, each with what triggers it'),
});

const duplicateIssues = (ids: string[], path: string, ctx: z.RefinementCtx) => {
  ids.forEach((value, i) => {
    if (ids.indexOf(value) !== i) ctx.addIssue({ code: 'custom', path: [path, i, 'id'], message: `duplicate id "${value}"` });
  });
};

export const screeningInput = z
  .object({
    markets: z.array(market).max(SCREENING_REGIMES.length),
    antennas: z.array(antenna).max(MAX_ANTENNAS),
    transmitters: z.array(transmitter).max(MAX_TRANSMITTERS),
    usePositions: z.array(usePosition).max(MAX_USE_POSITIONS),
    /** Only when the host has certified modules inside (absent otherwise, so older inputs hash as before). */
    modules: z.array(moduleGrant).max(MAX_MODULES).optional(),
  })
  .superRefine((input, ctx) => {
    const antennaIds = new Set(input.antennas.map((a) => a.id));
    duplicateIssues(
      input.antennas.map((a) => a.id),
      'antennas',
      ctx,
    );
    duplicateIssues(
      input.transmitters.map((t) => t.id),
      'transmitters',
      ctx,
    );
    duplicateIssues(
      input.usePositions.map((p) => p.id),
      'usePositions',
      ctx,
    );
    const regimes = input.markets.map((m) => m.regime);
    regimes.forEach((r, i) => {
      if (regimes.indexOf(r) !== i) ctx.addIssue({ code: 'custom', path: ['markets', i, 'regime'], message: `market "${r}" is listed twice` });
    });
    const moduleIds = new Set((input.modules ?? []).map((m) => m.id));
    input.transmitters.forEach((t, i) => {
      if (t.moduleId !== undefined && !moduleIds.has(t.moduleId)) ctx.addIssue({ code: 'custom', path: ['transmitters', i, 'moduleId'], message: `unknown module id "${t.moduleId}"` });
      if (t.frequencyMinHz > t.frequencyMaxHz) ctx.addIssue({ code: 'custom', path: ['transmitters', i, 'frequencyMaxHz'], message: 'frequencyMaxHz is below frequencyMinHz' });
      if (!antennaIds.has(t.antennaId)) ctx.addIssue({ code: 'custom', path: ['transmitters', i, 'antennaId'], message: `unknown antenna id "${t.antennaId}"` });
      (t.moreAntennaIds ?? []).forEach((a, j) => {
        if (!antennaIds.has(a)) ctx.addIssue({ code: 'custom', path: ['transmitters', i, 'moreAntennaIds', j], message: `unknown antenna id "${a}"` });
        if (a === t.antennaId || t.moreAntennaIds!.indexOf(a) !== j) ctx.addIssue({ code: 'custom', path: ['transmitters', i, 'moreAntennaIds', j], message: `antenna "${a}" is named twice` });
      });
    });
    const maxDbmOf = new Map(input.transmitters.map((t) => [t.id, t.maxTuneUpPowerDbm]));
    input.usePositions.forEach((p, i) =>
      (p.powerModes ?? []).forEach((m, j) => {
        const at = ['usePositions', i, 'powerModes', j];
        const max = maxDbmOf.get(m.transmitterId);
        if (max === undefined) ctx.addIssue({ code: 'custom', path: [...at, 'transmitterId'], message: `unknown transmitter id "${m.transmitterId}"` });
        else if (m.reducedTuneUpPowerDbm >= max)
          ctx.addIssue({ code: 'custom', path: [...at, 'reducedTuneUpPowerDbm'], message: `a reduced power must be below the maximum tune-up power (${max} dBm)` });
        if (p.powerModes!.findIndex((o) => o.transmitterId === m.transmitterId) !== j)
          ctx.addIssue({ code: 'custom', path: [...at, 'transmitterId'], message: `transmitter "${m.transmitterId}" has two power modes in this use position` });
      }),
    );
    input.usePositions.forEach((p, i) =>
      p.separations.forEach((s, j) => {
        if (!antennaIds.has(s.antennaId)) ctx.addIssue({ code: 'custom', path: ['usePositions', i, 'separations', j, 'antennaId'], message: `unknown antenna id "${s.antennaId}"` });
        if (p.separations.findIndex((o) => o.antennaId === s.antennaId) !== j) {
          ctx.addIssue({ code: 'custom', path: ['usePositions', i, 'separations', j, 'antennaId'], message: `antenna "${s.antennaId}" has two separations in this use position` });
        }
      }),
    );
  });

export type ScreeningInput = z.output<typeof screeningInput>;
export type ScreeningInputRaw = z.input<typeof screeningInput>;
export type ScreeningTransmitter = ScreeningInput['transmitters'][number];
export type ScreeningMarket = ScreeningInput['markets'][number];
export type ScreeningUsePosition = ScreeningInput['usePositions'][number];
export type ScreeningModule = NonNullable<ScreeningInput['modules']>[number];

/** The antennas a transmitter uses, its first one first. */
export const antennasOf = (tx: Pick<ScreeningTransmitter, 'antennaId' | 'moreAntennaIds'>): string[] => (tx.moreAntennaIds?.length ? [tx.antennaId, ...tx.moreAntennaIds] : [tx.antennaId]);

/** MIMO streams on the band: every antenna at once (the default with several), else one. */
export const streamsOf = (tx: Pick<ScreeningTransmitter, 'antennaId' | 'moreAntennaIds' | 'antennaUse'>): number => {
  const n = antennasOf(tx).length;
  return n > 1 && (tx.antennaUse ?? 'mimo') === 'mimo' ? n : 1;
};

export type ScreeningPowerMode = NonNullable<ScreeningUsePosition['powerModes']>[number];

/** The reduced power a transmitter has in a use position, if any. */
export const powerModeOf = (position: Pick<ScreeningUsePosition, 'powerModes'>, transmitterId: string): ScreeningPowerMode | undefined =>
  position.powerModes?.find((m) => m.transmitterId === transmitterId);
