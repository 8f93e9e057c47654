/**
 * The readiness rules: what must hold before an approver may sign a filing version. Each rule is
 * computed from the data (never ticked by hand) and has an id, a severity, a plain message that
 * says how to fix it, the wizard step that fixes it, and its source — a published clause, or
 * "common practice" where it is a reviewer's habit rather than a rule's text.
 *
 * Rules are pure: `check(input)` looks at a ReadinessInput and returns the failing items (empty
 * when the rule holds) or `null` when the rule does not apply to this filing.
 */
import type { FixStep, ReadinessInput } from './input';

export type ReadinessSeverity = 'blocks-signing' | 'warning';

export interface ReadinessFinding {
  /** One thing that fails, in words a user can act on. */
  text: string;
  /** The step that fixes this finding when it is not the rule's own step. */
  step?: FixStep;
}

export interface ReadinessRule {
  id: string;
  severity: ReadinessSeverity;
  /** Short statement of what must hold. */
  title: string;
  /** What to do when it does not hold. */
  fix: string;
  step: FixStep;
  source: string;
  /** Failing findings ([] = holds), or null when the rule does not apply. */
  check(input: ReadinessInput): ReadinessFinding[] | null;
}

/** The hotspot edge distance within which an edge must be tested: 25 mm (KDB 941225 D06 §4.2, from memory). */
export const HOTSPOT_EDGE_DISTANCE_M = 0.025;
/** A screening margin under this is a warning: small changes of tune-up or gain flip it. Common practice. */
export const THIN_MARGIN_DB = 1;
/** Tune-up powers that differ by less than this are the same figure (rounding of printed tables). */
export const TUNE_UP_SAME_WITHIN_DB = 0.05;

const key = (...parts: string[]) => parts.join('\u0000');
const mm = (m: number) => `${Math.round(m * 10000) / 10}`;
const REGIME_WORDS: Record<string, string> = { fcc: 'US FCC', ised: 'Canada ISED', eu: 'EU', 'icnirp-2020': 'ICNIRP 2020' };
const regimeWord = (r: string) => REGIME_WORDS[r] ?? r;

const DEVICE_FIELDS: [keyof ReadinessInput['device'], string][] = [
  ['name', 'device name'],
  ['model', 'model'],
  ['applicant', 'applicant'],
  ['productType', 'product type'],
];

function measuredCombinations(input: ReadinessInput): Set<string> {
  return new Set((input.lab?.measurements ?? []).map((m) => key(m.transmitterId, m.usePositionId)));
}

export const READINESS_RULES: readonly ReadinessRule[] = [
  {
    id: 'device-identity',
    severity: 'blocks-signing',
    title: 'The device is identified',
    fix: 'Fill in the device name, model, applicant and product type.',
    step: 'device',
    source: '47 CFR §2.1033(b)(1); Directive 2014/53/EU Annex V(a)',
    check: (input) =>
      DEVICE_FIELDS.filter(([field]) => !String(input.device[field] ?? '').trim()).map(([, label]) => ({ text: `The ${label} is missing.` })),
  },
  {
    id: 'device-versions',
    severity: 'warning',
    title: 'Hardware and firmware versions are stated',
    fix: 'Give the hardware and firmware versions that were tested.',
    step: 'device',
    source: 'Directive 2014/53/EU Annex V(a) (versions of software or firmware affecting compliance; from memory)',
    check: (input) =>
      [
        ['hardwareVersion', 'hardware version'],
        ['firmwareVersion', 'firmware version'],
      ]
        .filter(([field]) => !input.device[field as 'hardwareVersion' | 'firmwareVersion'].trim())
        .map(([, label]) => ({ text: `No ${label} is given.` })),
  },
  {
    id: 'data-complete',
    severity: 'blocks-signing',
    title: 'Radios, use positions and markets are complete and saved',
    fix: 'Add what is missing in the step named, and fix the fields that keep a step unsaved.',
    step: 'radios',
    source: 'common practice',
    check: (input) => {
      const out: ReadinessFinding[] = [];
      if (!input.antennaIds.length) out.push({ text: 'No antenna is listed.', step: 'radios' });
      if (!input.transmitters.length) out.push({ text: 'No transmitter is listed.', step: 'radios' });
      if (!input.usePositions.length) out.push({ text: 'No use position is listed.', step: 'use-positions' });
      if (!input.regimes.length) out.push({ text: 'No market is chosen.', step: 'markets' });
      const used = [...new Set(input.transmitters.map((t) => t.antennaId))];
      for (const p of input.usePositions) {
        const given = new Set(p.separations.map((s) => s.antennaId));
        const missing = used.filter((a) => !given.has(a));
        if (missing.length) out.push({ text: `Use position “${p.id}” has no separation for antenna ${missing.join(', ')}.`, step: 'use-positions' });
      }
      for (const s of input.unsavedSteps) out.push({ text: `The ${s} step has input with errors that is not saved.`, step: s as FixStep });
      return out;
    },
  },
  {
    id: 'screening-coverage',
    severity: 'blocks-signing',
    title: 'Every transmitter × use position × market has an exemption or a result',
    fix: 'Give the missing separations so that each combination can be screened.',
    step: 'use-positions',
    source: '47 CFR §1.1307(b)(3) and §2.1093; RSS-102 Issue 5 §2.5; EN 62479:2010',
    check: (input) => {
      if (!input.transmitters.length || !input.usePositions.length || !input.regimes.length) return null;
      const rows = new Set((input.screening?.rows ?? []).map((r) => key(r.transmitterId, r.usePositionId, r.regime)));
      const out: ReadinessFinding[] = [];
      for (const t of input.transmitters)
        for (const p of input.usePositions) {
          const missing = input.regimes.filter((r) => !rows.has(key(t.id, p.id, r)));
          if (missing.length) out.push({ text: `${t.id} at “${p.id}” has no screening result for ${missing.map(regimeWord).join(', ')}.` });
        }
      return out;
    },
  },
  {
    id: 'sar-measured',
    severity: 'blocks-signing',
    title: 'Every combination that needs SAR has a measurement',
    fix: 'Enter or import the lab’s measurement for each combination named.',
    step: 'measurements',
    source: '47 CFR §2.1093(d); FCC KDB 865664 D01 v01r04; IEC/IEEE 62209-1528:2020',
    check: (input) => {
      const need = (input.screening?.rows ?? []).filter((r) => r.result === 'evaluate-sar');
      if (!need.length) return null;
      const measured = measuredCombinations(input);
      const missing = new Map<string, string[]>();
      for (const r of need) {
        if (measured.has(key(r.transmitterId, r.usePositionId))) continue;
        const k = key(r.transmitterId, r.usePositionId);
        missing.set(k, [...(missing.get(k) ?? []), regimeWord(r.regime)]);
      }
      return [...missing].map(([k, regimes]) => {
        const [tx, pos] = k.split('\u0000');
        return { text: `${tx} at “${pos}” needs SAR (${regimes.join(', ')}) and has no measurement.` };
      });
    },
  },
  {
    id: 'reported-sar-within-limit',
    severity: 'blocks-signing',
    title: 'Every highest reported SAR is under its limit',
    fix: 'Check the measurement and the tune-up power; a reported SAR over the limit cannot be filed.',
    step: 'measurements',
    source: '47 CFR §1.1310(c); RSS-102 Issue 5 §4 Table 3; Council Recommendation 1999/519/EC Annex II',
    check: (input) => {
      if (!input.lab?.highest.length) return null;
      return input.lab.highest
        .filter((h) => h.reportedSarWPerKg > h.limitWPerKg)
        .map((h) => ({
          text: `${regimeWord(h.regime)}, ${h.usePositionKind}: reported SAR ${h.reportedSarWPerKg.toFixed(2)} W/kg (${h.transmitterId} at “${h.usePositionId}”) is over the limit of ${h.limitWPerKg} W/kg.`,
        }));
    },
  },
  {
    id: 'co-transmission-evaluated',
    severity: 'blocks-signing',
    title: 'Co-transmission is evaluated for every combination',
    fix: 'Evaluate each combination named in every use position and market; over the limit, give the peak locations or a simultaneous measurement.',
    step: 'co-transmission',
    source: 'FCC KDB 447498 D01 v06 §4.3.2; IEC/IEEE 62209-1528:2020 (simultaneous transmission)',
    check: (input) => {
      const groups = input.simultaneous.filter((g) => g.length > 1);
      if (!groups.length || !input.usePositions.length || !input.regimes.length) return null;
      const byKey = new Map((input.lab?.coTransmission ?? []).map((c) => [key([...c.transmitterIds].sort().join('+'), c.usePositionId, c.regime), c]));
      const out: ReadinessFinding[] = [];
      for (const g of groups) {
        const gk = [...g].sort().join('+');
        for (const p of input.usePositions)
          for (const r of input.regimes) {
            const c = byKey.get(key(gk, p.id, r));
            const name = `${g.join(' + ')} at “${p.id}”, ${regimeWord(r)}`;
            if (!c) out.push({ text: `${name} is not evaluated.` });
            else if (c.status === 'over-limit') out.push({ text: `${name}: the sum is over the limit.` });
            else if (c.status === 'needs-simultaneous-measurement') out.push({ text: `${name} needs a simultaneous measurement.` });
          }
      }
      return out;
    },
  },
  {
    id: 'tune-up-consistent',
    severity: 'blocks-signing',
    title: 'The same tune-up power stands in the radios, the measurements and the report',
    fix: 'Make the tune-up power of each transmitter named agree everywhere, or explain the report’s figure.',
    step: 'radios',
    source: 'common practice (FCC KDB 447498 D01 v06 §4.1: SAR is reported at the maximum tune-up tolerance limit)',
    check: (input) => {
      const tuneUp = new Map(input.transmitters.map((t) => [t.id, t.maxTuneUpPowerDbm]));
      const out: ReadinessFinding[] = [];
      const seen = new Set<string>();
      for (const m of input.lab?.measurements ?? []) {
        const radio = tuneUp.get(m.transmitterId);
        if (radio === undefined || m.tuneUpPowerDbm === null || Math.abs(m.tuneUpPowerDbm - radio) < TUNE_UP_SAME_WITHIN_DB) continue;
        const k = key(m.transmitterId, String(m.tuneUpPowerDbm));
        if (seen.has(k)) continue;
        seen.add(k);
        out.push({ text: `${m.transmitterId}: measurements use ${m.tuneUpPowerDbm} dBm, Radios says ${radio} dBm.`, step: 'measurements' });
      }
      for (const r of input.reportTuneUps ?? []) {
        const radio = tuneUp.get(r.transmitterId);
        if (r.explained || radio === undefined || Math.abs(r.reportTuneUpPowerDbm - radio) < TUNE_UP_SAME_WITHIN_DB) continue;
        out.push({ text: `${r.transmitterId}: the report (${r.where}) says ${r.reportTuneUpPowerDbm} dBm, Radios says ${radio} dBm.`, step: 'evidence' });
      }
      return input.lab || input.reportTuneUps ? out : null;
    },
  },
  {
    id: 'measured-power-within-tune-up',
    severity: 'blocks-signing',
    title: 'Measured power is never above the tune-up limit',
    fix: 'A measured power above the tune-up limit means the tune-up power is wrong or the device was set up wrongly; correct one of them.',
    step: 'measurements',
    source: 'FCC KDB 447498 D01 v06 §4.1 (maximum output power including tune-up tolerance; from memory)',
    check: (input) => {
      if (!input.lab?.measurements.length) return null;
      return input.lab.measurements
        .filter((m) => m.measuredPowerDbm !== null && m.tuneUpPowerDbm !== null && m.measuredPowerDbm > m.tuneUpPowerDbm)
        .map((m) => ({ text: `Measurement ${m.measurementId} (${m.transmitterId} at “${m.usePositionId}”): ${m.measuredPowerDbm} dBm measured, tune-up limit ${m.tuneUpPowerDbm} dBm.` }));
    },
  },
  {
    id: 'lab-checks-in-tolerance',
    severity: 'blocks-signing',
    title: 'Liquid, system check, drift and calibrations are in tolerance',
    fix: 'Repeat the check named, or replace the measurements that relied on it.',
    step: 'measurements',
    source: 'IEC/IEEE 62209-1528:2020; FCC KDB 865664 D01 v01r04',
    check: (input) => {
      if (!input.lab?.checks.length) return null;
      return input.lab.checks.filter((c) => !c.ok).map((c) => ({ text: c.source ? `${c.label} (${c.source})` : c.label }));
    },
  },
  {
    id: 'uncertainty-given',
    severity: 'blocks-signing',
    title: 'The uncertainty budget is given where required',
    fix: 'Enter the measurement uncertainty budget: the highest measured SAR is high enough to require it.',
    step: 'measurements',
    source: 'FCC KDB 865664 D01 v01r04 §2.8 (budget required at ≥ 1.5 W/kg 1 g or ≥ 3.75 W/kg 10 g; from memory)',
    check: (input) => {
      const u = input.lab?.uncertainty;
      if (!u?.required) return null;
      return u.given ? [] : [{ text: 'The highest measured SAR requires an uncertainty budget, and none is given.' }];
    },
  },
  {
    id: 'manual-separation',
    severity: 'blocks-signing',
    title: 'The user manual states no separation smaller than the one tested',
    fix: 'Correct the separation stated in the user manual, or test at the stated distance.',
    step: 'evidence',
    source: 'common practice (47 CFR §2.1093 grant conditions: end users must be informed of the tested body-worn distance)',
    check: (input) => {
      if (!input.manualSeparations?.length) return null;
      const tested = new Map<string, number>();
      for (const m of input.lab?.measurements ?? []) {
        if (m.testSeparationM === null) continue;
        tested.set(m.usePositionId, Math.max(tested.get(m.usePositionId) ?? 0, m.testSeparationM));
      }
      for (const p of input.usePositions) {
        if (tested.has(p.id) || !p.separations.length) continue;
        tested.set(p.id, Math.max(...p.separations.map((s) => s.separationM)));
      }
      return input.manualSeparations
        .filter((s) => tested.has(s.usePositionId) && s.statedSeparationM < tested.get(s.usePositionId)! - 1e-9)
        .map((s) => ({ text: `“${s.usePositionId}”: the manual states ${mm(s.statedSeparationM)} mm; it was tested at ${mm(tested.get(s.usePositionId)!)} mm.` }));
    },
  },
  {
    id: 'evidence-present',
    severity: 'blocks-signing',
    title: 'Every required evidence category is present',
    fix: 'Upload a file in each category named.',
    step: 'evidence',
    source: '47 CFR §2.1033(b); RSP-100 Form C; Directive 2014/53/EU Annex V',
    check: (input) => {
      if (!input.evidence?.required.length) return null;
      return input.evidence.required.filter((c) => !c.present).map((c) => ({ text: `Nothing filed under “${c.label}”.` }));
    },
  },
  {
    id: 'hotspot-edges',
    severity: 'blocks-signing',
    title: 'Hotspot edges within 25 mm of an antenna are evaluated',
    fix: 'Add a hotspot use position for each edge named, and measure every transmitter on an antenna within 25 mm of it that needs SAR.',
    step: 'use-positions',
    source: 'FCC KDB 941225 D06 (hotspot mode: surfaces and edges with an antenna within 25 mm; from memory)',
    check: (input) => {
      const hotspots = input.usePositions.filter((p) => p.kind === 'hotspot');
      const edges = (input.hotspotEdges ?? []).filter((e) => e.distanceM <= HOTSPOT_EDGE_DISTANCE_M);
      if (!hotspots.length && !edges.length) return null;
      const out: ReadinessFinding[] = [];
      for (const e of edges) {
        if (!e.usePositionId) out.push({ text: `Edge “${e.edge}” is ${mm(e.distanceM)} mm from ${e.antennaId} and has no hotspot use position.` });
      }
      const rows = new Map((input.screening?.rows ?? []).map((r) => [key(r.transmitterId, r.usePositionId, r.regime), r.result]));
      const measured = measuredCombinations(input);
      for (const p of hotspots) {
        const near = new Set(p.separations.filter((s) => s.separationM <= HOTSPOT_EDGE_DISTANCE_M).map((s) => s.antennaId));
        for (const t of input.transmitters.filter((t) => near.has(t.antennaId))) {
          const results = input.regimes.map((r) => rows.get(key(t.id, p.id, r)));
          if (results.some((r) => r === undefined)) out.push({ text: `${t.id} at hotspot “${p.id}” is not screened.` });
          else if (results.includes('evaluate-sar') && !measured.has(key(t.id, p.id))) out.push({ text: `${t.id} at hotspot “${p.id}” needs SAR and has no measurement.`, step: 'measurements' });
        }
      }
      return out;
    },
  },
  {
    id: 'mpe-evaluation',
    severity: 'warning',
    title: 'Combinations that need an MPE evaluation have one on file',
    fix: 'Attach the MPE (field strength or power density) evaluation for each combination named.',
    step: 'evidence',
    source: '47 CFR §1.1310(e) Table 1; RSS-102 Issue 5 §4 Table 4; Council Recommendation 1999/519/EC Annex III',
    check: (input) => {
      const rows = (input.screening?.rows ?? []).filter((r) => r.result === 'evaluate-mpe');
      if (!rows.length) return null;
      return rows.map((r) => ({ text: `${r.transmitterId} at “${r.usePositionId}”, ${regimeWord(r.regime)}: needs an MPE evaluation.` }));
    },
  },
  {
    id: 'thin-exemption-margin',
    severity: 'warning',
    title: `Exemptions keep a margin of at least ${THIN_MARGIN_DB} dB`,
    fix: 'Check the tune-up power, gain and separation of each combination named: a small change would remove its exemption.',
    step: 'screening',
    source: 'common practice',
    check: (input) => {
      const rows = (input.screening?.rows ?? []).filter((r) => r.result === 'exempt' && r.marginDb !== undefined && r.marginDb !== null && r.marginDb < THIN_MARGIN_DB);
      if (!input.screening?.rows.some((r) => r.result === 'exempt')) return null;
      return rows.map((r) => ({ text: `${r.transmitterId} at “${r.usePositionId}”, ${regimeWord(r.regime)}: exempt with only ${r.marginDb!.toFixed(2)} dB to spare.` }));
    },
  },
];
