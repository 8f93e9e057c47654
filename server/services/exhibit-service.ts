/**
 * Assembles the exhibit's data (templates/exhibit/model.ts) from one filing version: the device,
 * radios, use positions and markets as stored for that version, the screening with every
 * figure's derivation, a SAR-against-depth estimate, the version's lab results, readiness
 * checklist and signature (exhibit-sources.ts), and its evidence files through ExhibitSources.
 */
import { createHash } from 'node:crypto';
import type { Db } from '../../db/client';
import { ENGINE_VERSION, RULE_SET_DOCUMENTS, RULE_SET_VERSION } from '../../calc/versions';
import { screeningInput, type ScreeningInput } from '../../calc/screening/input';
import { SCREENING_CAUTIONS, screenParsed, type ScreeningOutput, type ScreeningRow } from '../../calc/screening/screen';
import { POWER_MODE_TRIGGER_LABELS, REGIME_LABELS, USE_POSITION_LABELS, type MarketRegime, type PowerModeTrigger, type UsePositionKind } from '../../constants/schemas/device-file';
import type { ExhibitDepthProfile, ExhibitModel, ExhibitScreeningRow } from '../../templates/exhibit/model';
import { CAUTIONS, REGIME_SHORT } from '../../templates/exhibit/texts';
import * as filingsRepo from '../repos/filings-repo';
import * as packagesRepo from '../repos/packages-repo';
import * as reviewRepo from '../repos/review-repo';
import { labSection, readinessSection, signatureSection, type ExhibitSources, type PackageEvidence } from './exhibit-sources';
import { depthProfileOf } from './screening-service';

const THRESHOLD_UNITS: [keyof ScreeningRow, string][] = [
  ['thresholdMw', 'mW'],
  ['thresholdErpW', 'W ERP'],
  ['thresholdEirpW', 'W EIRP'],
  ['thresholdPowerDensityWPerM2', 'W/m²'],
];

function threshold(row: ScreeningRow): { threshold: number | null; thresholdUnit: string | null } {
  for (const [key, unit] of THRESHOLD_UNITS) {
    const v = row[key];
    if (typeof v === 'number') return { threshold: v, thresholdUnit: unit };
  }
  return { threshold: null, thresholdUnit: null };
}

const categorySlug = (s: string) =>
  s
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-|-$/g, '') || 'other';

/** Evidence paths inside the zip: evidence/<category id>/<file>, unique, in a fixed order. */
export function evidencePaths(items: PackageEvidence[]): string[] {
  const used = new Set<string>();
  return items.map((e) => {
    const base = `evidence/${categorySlug(e.categoryId)}/${e.fileName.replace(/[\\/]/g, '_')}`;
    let candidate = base;
    for (let i = 2; used.has(candidate); i++) candidate = base.replace(/(\.[^./]*)?$/, (ext) => `-${i}${ext}`);
    used.add(candidate);
    return candidate;
  });
}

export interface AssembledExhibit {
  model: ExhibitModel;
  version: packagesRepo.VersionRow;
  evidence: (PackageEvidence & { path: string })[];
  /** SHA-256 of the model: a preview is rebuilt only when it changes. */
  modelSha256: string;
}

function screeningOf(db: Db, versionId: number, parsed: ScreeningInput): ScreeningOutput {
  const inputSha256 = createHash('sha256').update(JSON.stringify(parsed)).digest('hex');
  const stored = packagesRepo.findScreeningOutput(db, versionId, inputSha256, ENGINE_VERSION, RULE_SET_VERSION);
  return stored ? (JSON.parse(stored) as ScreeningOutput) : screenParsed(parsed);
}

/** The SAR-against-depth estimate for the near-body combination with the smallest margin, if any can be computed. */
function depthProfile(input: ScreeningInput, rows: ScreeningRow[], ref: string): { profile: ExhibitDepthProfile; derivation: ScreeningRow['derivation'] } | null {
  const candidates = rows.filter((r) => r.usePositionKind !== 'far-field' && r.marginDb !== null).sort((a, b) => a.marginDb! - b.marginDb!);
  for (const row of candidates) {
    try {
      const p = depthProfileOf(input, { transmitterId: row.transmitterId, usePositionId: row.usePositionId, regime: row.regime });
      let start = 0;
      const layers = p.stack.map((l) => {
        const out = { name: l.name, startDepthM: start };
        start += l.thicknessM ?? 0;
        return out;
      });
      return {
        profile: {
          transmitterId: row.transmitterId,
          usePositionId: row.usePositionId,
          frequencyHz: p.basis.frequencyHz,
          distanceUsedM: p.distanceUsedM,
          stackTitle: p.stackTitle,
          scale: p.scale,
          scaleReason: p.scaleReason,
          points: p.absolute ? p.absolute.sarProfile.map((pt) => ({ depthM: pt.depthM, value: pt.sarWPerKg })) : p.relativeProfile.map((pt) => ({ depthM: pt.depthM, value: pt.relativeSar })),
          layers,
          averagedSarWPerKg: p.absolute?.averagedSarWPerKg ?? null,
          appendixRef: ref,
        },
        derivation: p.derivation,
      };
    } catch {
      // Outside the model's frequency range: try the next combination.
    }
  }
  return null;
}

/**
 * The exhibit model of one version, read from that version's own rows; `sources` supplies the
 * evidence files (with their bytes).
 */
export function assembleExhibit(db: Db, organisationId: number, filingId: number, versionNumber: number, sources: ExhibitSources): AssembledExhibit | undefined {
  const version = packagesRepo.findVersion(db, organisationId, filingId, versionNumber);
  if (!version) return undefined;
  const versionId = version.version.id;
  const radios = filingsRepo.readRadios(db, versionId);
  const positions = filingsRepo.readUsePositions(db, versionId);
  const markets = filingsRepo.readMarkets(db, versionId);
  const input = screeningInput.parse({
    markets: markets.markets,
    antennas: radios.antennas.map((a) => ({ id: a.id, gainDbi: a.gainDbi })),
    transmitters: radios.transmitters,
    usePositions: positions.usePositions,
  });
  const screening = screeningOf(db, versionId, input);

  const appendix: ExhibitModel['appendix'] = [];
  const rows: ExhibitScreeningRow[] = screening.rows.map((r, i) => {
    const ref = `S${i + 1}`;
    appendix.push({ ref, title: `${r.transmitterId} at ${r.usePositionId}, ${REGIME_SHORT[r.regime] ?? r.regime} — ${r.methodLabel}`, derivation: r.derivation });
    return {
      transmitterId: r.transmitterId,
      usePositionId: r.usePositionId,
      usePositionKind: r.usePositionKind,
      regime: r.regime,
      tier: r.tier,
      method: r.method,
      methodLabel: r.methodLabel,
      frequencyHz: r.frequencyHz,
      separationM: r.separationM,
      // Results stored before power modes existed were all at full power.
      powerMode: r.powerMode ?? 'full',
      evaluatedPowerMw: r.evaluatedPowerMw,
      evaluatedQuantity: r.evaluatedQuantity,
      ...threshold(r),
      result: r.result,
      marginDb: r.marginDb,
      estimatedSarWPerKg: r.estimatedSarWPerKg,
      appendixRef: ref,
    };
  });
  const depth = depthProfile(input, screening.rows, 'D1');
  if (depth) appendix.push({ ref: 'D1', title: `SAR against depth, ${depth.profile.transmitterId} at ${depth.profile.usePositionId} (estimate)`, derivation: depth.derivation });

  const lab = labSection(db, versionId, { markets: markets.markets, transmitters: radios.transmitters, usePositions: positions.usePositions }, screening.rows);
  if (lab) appendix.push(...lab.appendix);
  const signed = version.version.state === 'signed' ? reviewRepo.findSignature(db, versionId) : undefined;
  const signature = signed ? signatureSection(signed) : null;
  const evidenceItems = sources.evidence(db, versionId);
  const paths = evidencePaths(evidenceItems);
  const evidence = evidenceItems.map((e, i) => ({ ...e, path: paths[i] }));
  // A draft's date is fixed by its data: the last change of the filing for its latest version,
  // otherwise the version's creation. Never the build time.
  const documentDate = signature?.signedAt ?? (version.isLatest ? version.filing.updatedAt : version.version.createdAt);

  const model: ExhibitModel = {
    organisation: version.organisationName,
    filingId,
    versionNumber,
    draft: !signature,
    documentDate,
    device: {
      name: version.device.name,
      model: version.device.model,
      applicant: version.device.applicant,
      productType: version.device.productType,
      hardwareVersion: version.device.hardwareVersion,
      firmwareVersion: version.device.firmwareVersion,
    },
    antennas: radios.antennas.map((a) => ({ id: a.id, gainDbi: a.gainDbi, location: a.location ?? '' })),
    transmitters: radios.transmitters.map((t) => ({ ...t })),
    usePositions: positions.usePositions.map((p) => ({
      id: p.id,
      kind: p.kind,
      kindLabel: USE_POSITION_LABELS[p.kind as UsePositionKind] ?? p.kind,
      separations: p.separations,
      powerModes: (p.powerModes ?? []).map((x) => ({ ...x, triggerLabel: POWER_MODE_TRIGGER_LABELS[x.trigger as PowerModeTrigger] ?? x.trigger })),
    })),
    markets: markets.markets.map((m) => ({ regime: m.regime, label: REGIME_LABELS[m.regime as MarketRegime] ?? m.regime, tier: m.tier, fccSarScreening: m.fccSarScreening ?? null })),
    simultaneousGroups: filingsRepo.readSimultaneous(db, versionId),
    screening: { engineVersion: ENGINE_VERSION, ruleSetVersion: RULE_SET_VERSION, ruleSetDocuments: [...RULE_SET_DOCUMENTS], rows, gaps: screening.gaps },
    depthProfile: depth?.profile ?? null,
    lab: lab?.lab ?? null,
    readiness: readinessSection(db, version.version, version.filing.deviceId, signed, documentDate),
    signature,
    evidence: evidence.map((e) => ({
      categoryId: e.categoryId,
      category: e.category,
      title: e.title,
      path: e.path,
      fileName: e.fileName,
      sizeBytes: e.sizeBytes,
      sha256: e.sha256,
      uploadedAt: e.uploadedAt,
    })),
    appendix,
    cautions: [...CAUTIONS, ...SCREENING_CAUTIONS],
  };
  const modelSha256 = createHash('sha256').update(JSON.stringify(model)).digest('hex');
  return { model, version, evidence, modelSha256 };
}
