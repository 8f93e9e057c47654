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

/** The antenna-to-edge distance within which a hotspot edge must be tested: 25 mm (FCC KDB 941225 D06; clause from memory). */
export const HOTSPOT_EDGE_DISTANCE_M = 0.025;
/** Use-position kinds whose separation the user is told in the manual (body-worn accessories, hotspot). */
export const MANUAL_SEPARATION_KINDS = ['body-worn', 'hotspot'] as const;
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

/** The lab checks of some kinds: those out of tolerance (gap false) or the gaps in the records (gap true). */
function labChecks(input: ReadinessInput, kinds: readonly string[], gaps: boolean): ReadinessFinding[] | null {
  const relevant = (input.lab?.checks ?? []).filter((c) => kinds.includes(c.kind) && !!c.gap === gaps);
  if (!relevant.length) return null;
  return relevant.filter((c) => !c.ok).map((c) => ({ text: c.source && !gaps ? `${c.label} (${c.source})` : c.label }));
}

/** The separation a use position was tested at: its measurements' largest, else the position's own. */
function testedSeparations(input: ReadinessInput): Map<string, number> {
  const tested = new Map<string, number>();
  for (const m of input.lab?.measurements ?? []) {
    if (m.testSeparationM === null) continue;
    tested.set(m.usePositionId, Math.max(tested.get(m.usePositionId) ?? 0, m.testSeparationM));
  }
  for (const p of input.usePositions) {
    if (tested.has(p.id) || !p.separations.length) continue;
    tested.set(p.id, Math.max(...p.separations.map((s) => s.separationM)));
  }
  return tested;
}

const manualPositions = (input: ReadinessInput) => input.usePositions.filter((p) => (MANUAL_SEPARATION_KINDS as readonly string[]).includes(p.kind));

/** A hotspot use position tests an edge when its id names the edge as a word (“hotspot-top”, “HS_Top_edge”). */
export const testsEdge = (usePositionId: string, edge: string) =>
  usePositionId
    .toLowerCase()
    .split(/[^a-z0-9]+/)
    .includes(edge.toLowerCase());

export const READINESS_RULES: readonly ReadinessRule[] = [
  {
    id: 'device-identity',
    severity: 'blocks-signing',
    title: 'The device is identified',
    fix: 'Fill in the device name, model, applicant and product type.',
    step: 'device',
    source: '47 CFR §2.1033(b)(1); Directive 2014/53/EU Annex V(a)',
    check: (input) => DEVICE_FIELDS.filter(([field]) => !String(input.device[field] ?? '').trim()).map(([, label]) => ({ text: `The ${label} is missing.` })),
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
    id: 'measurements-match-device',
    severity: 'blocks-signing',
    title: 'Every measurement belongs to the device data',
    fix: 'Correct the transmitter, use position or frequency of each measurement named, or add what it names under Radios or Use positions.',
    step: 'measurements',
    source: 'common practice (the lab results are evaluated against the device as described: 47 CFR §2.1093(d))',
    check: (input) => (input.lab?.measurements.length || input.lab?.checks.some((c) => c.kind === 'reference') ? (labChecks(input, ['reference'], false) ?? []) : null),
  },
  {
    id: 'lab-records-complete',
    severity: 'warning',
    title: 'Every measurement’s record is complete',
    fix: 'Enter what each record named lacks (power drift, the liquid and system check it relied on, the SAR at each averaging mass, the probe and its calibration).',
    step: 'measurements',
    source: 'IEC/IEEE 62209-1528:2020 and FCC KDB 865664 D01 v01r04 (what a SAR test record carries; from memory); common practice',
    check: (input) =>
      input.lab?.measurements.length ? (labChecks(input, ['liquid', 'system-check', 'drift', 'calibration', 'repeat', 'separation', 'reference', 'record', 'other'], true) ?? []) : null,
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
      // A group of every position, or of one position only (checked there alone).
      const groups = [
        ...input.simultaneous.map((g) => ({ ids: g, positionId: null as string | null })),
        ...(input.simultaneousAt ?? []).map((g) => ({ ids: g.transmitterIds, positionId: g.usePositionId as string | null })),
      ].filter((g) => g.ids.length > 1);
      if (!groups.length || !input.usePositions.length || !input.regimes.length) return null;
      const byKey = new Map((input.lab?.coTransmission ?? []).map((c) => [key([...c.transmitterIds].sort().join('+'), c.usePositionId, c.regime), c]));
      const out: ReadinessFinding[] = [];
      for (const { ids, positionId } of groups) {
        const gk = [...ids].sort().join('+');
        for (const p of input.usePositions.filter((x) => positionId === null || x.id === positionId))
          for (const r of input.regimes) {
            const c = byKey.get(key(gk, p.id, r));
            const name = `${ids.join(' + ')} at “${p.id}”, ${regimeWord(r)}`;
            if (!c) out.push({ text: `${name} is not evaluated.` });
            else if (c.status === 'over-limit') out.push({ text: `${name}: the sum is over the limit.` });
            else if (c.status === 'needs-simultaneous-measurement') out.push({ text: `${name} needs a simultaneous measurement.` });
            else if (c.status === 'incomplete')
              out.push({ text: `${name} cannot be summed: a transmitter in it has no measurement here and no exemption to estimate its SAR from (or is not screened here).`, step: 'measurements' });
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
    title: 'Liquid, system check, drift, calibrations and repeats are in tolerance',
    fix: 'Repeat the check named, or replace the measurements that relied on it.',
    step: 'measurements',
    source:
      'IEEE Std 1528-2013: liquid εr and σ within ±5 % of target, system check within ±10 % of the dipole target, power drift within ±5 % (clause numbers from memory); FCC KDB 865664 D01 v01r04: calibration intervals, repeated measurements (§2.8.1, from memory)',
    check: (input) => labChecks(input, ['liquid', 'system-check', 'drift', 'calibration', 'repeat'], false),
  },
  {
    id: 'tested-at-use-separation',
    severity: 'blocks-signing',
    title: 'No measurement is made farther away than the device is used',
    fix: 'Re-test at the use position’s separation, or correct the separation under Use positions.',
    step: 'measurements',
    source: 'FCC KDB 447498 D01 v06 §4.1 and KDB 865664 D01 v01r04 (test at the separation of use, never farther; from memory)',
    check: (input) => labChecks(input, ['separation'], false),
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
      if (!u.given) return [{ text: 'The highest measured SAR requires an uncertainty budget, and none is given.' }];
      if (u.expandedPct != null && u.limitPct != null && u.expandedPct > u.limitPct)
        return [{ text: `The expanded uncertainty is ${u.expandedPct.toFixed(1)} % (k = 2), above ${u.limitPct} %: check the budget against the lab’s.` }];
      return [];
    },
  },
  {
    id: 'manual-separation',
    severity: 'blocks-signing',
    title: 'The user manual states no separation smaller than the one tested',
    fix: 'Correct the separation stated in the user manual, or test at the stated distance.',
    step: 'evidence',
    source: 'FCC KDB 447498 D01 v06 (body-worn accessories: users are told the tested separation; from memory); RSP-100 (user-manual notices; from memory)',
    check: (input) => {
      if (!input.manualSeparations?.length) return null;
      const tested = testedSeparations(input);
      return input.manualSeparations
        .filter((s) => tested.has(s.usePositionId) && s.statedSeparationM < tested.get(s.usePositionId)! - 1e-9)
        .map((s) => ({ text: `“${s.usePositionId}”: the manual${s.where ? ` (${s.where})` : ''} states ${mm(s.statedSeparationM)} mm; it was tested at ${mm(tested.get(s.usePositionId)!)} mm.` }));
    },
  },
  {
    id: 'manual-separation-stated',
    severity: 'warning',
    title: 'The user manual states the separation of each body-worn and hotspot position',
    fix: 'Upload the user-manual excerpt as a PDF whose text can be selected, with a sentence that gives the distance, such as “keep at least 10 mm between the device and your body”.',
    step: 'evidence',
    source: 'FCC KDB 447498 D01 v06 (body-worn operating instructions; from memory); RSP-100 (user-manual notices in English and French; from memory)',
    check: (input) => {
      const positions = manualPositions(input);
      if (!positions.length) return null;
      if (input.manualSeparations === null)
        return [{ text: 'No user-manual text is on file, so the separation it tells users cannot be checked: upload the user-manual excerpt as a PDF with selectable text.' }];
      const stated = new Set(input.manualSeparations.map((s) => s.usePositionId));
      return positions
        .filter((p) => !stated.has(p.id))
        .map((p) => ({
          text: `The user manual states no separation for “${p.id}” (${p.kind}): add a sentence with the distance in mm, for example “at least ${mm(testedSeparations(input).get(p.id) ?? 0.01)} mm from the body”.`,
        }));
    },
  },
  {
    id: 'report-agrees',
    severity: 'blocks-signing',
    title: 'The test report agrees with the filing',
    fix: 'Correct the filing or have the lab correct the report; where the difference is right, explain it on the Evidence step.',
    step: 'evidence',
    source: 'common practice (the exhibits of one application describe one device: 47 CFR §2.1033(b); from memory)',
    check: (input) => {
      if (!input.reportFindings) return null;
      return input.reportFindings.filter((f) => !f.explained).map((f) => ({ text: f.text }));
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
    fix: 'Add a hotspot use position for each edge named (its id names the edge, such as “hotspot-top”), and measure every transmitter on an antenna within 25 mm of it that needs SAR.',
    step: 'use-positions',
    source: 'FCC KDB 941225 D06 (hotspot mode: each surface and edge with a transmitting antenna within 25 mm is tested, at 10 mm; from memory)',
    check: (input) => {
      const hotspots = input.usePositions.filter((p) => p.kind === 'hotspot');
      if (!hotspots.length || input.hotspotEdges === null) return null;
      const out: ReadinessFinding[] = [];
      const rows = new Map((input.screening?.rows ?? []).map((r) => [key(r.transmitterId, r.usePositionId, r.regime), r.result]));
      const measured = measuredCombinations(input);
      const seen = new Set<string>();
      for (const e of input.hotspotEdges) {
        if (e.distanceM > HOTSPOT_EDGE_DISTANCE_M + 1e-9) continue;
        const positions = hotspots.filter((p) => testsEdge(p.id, e.edge));
        if (!positions.length) {
          if (!seen.has(key('edge', e.edge)))
            out.push({ text: `The ${e.edge} edge is ${mm(e.distanceM)} mm from ${e.antennaId} and no hotspot use position tests it (give one an id naming the edge, such as “hotspot-${e.edge}”).` });
          seen.add(key('edge', e.edge));
          continue;
        }
        for (const t of input.transmitters.filter((t) => t.antennaId === e.antennaId))
          for (const p of positions) {
            if (seen.has(key(t.id, p.id))) continue;
            seen.add(key(t.id, p.id));
            const results = input.regimes.map((r) => rows.get(key(t.id, p.id, r)));
            if (results.some((r) => r === undefined)) out.push({ text: `${t.id} at hotspot “${p.id}” is not screened (give its separation for ${t.antennaId}).` });
            else if (results.includes('evaluate-sar') && !measured.has(key(t.id, p.id)))
              out.push({ text: `${t.id} at hotspot “${p.id}” (${e.edge} edge, ${mm(e.distanceM)} mm from ${t.antennaId}) needs SAR and has no measurement.`, step: 'measurements' });
          }
      }
      return out;
    },
  },
  {
    id: 'hotspot-edge-distances',
    severity: 'warning',
    title: 'The antenna-to-edge distances of a hotspot device are on file',
    fix: 'Upload the antenna location drawing as a PDF whose text gives each antenna’s distance to each edge, such as “ANT-1: top edge 6 mm, left edge 31 mm”.',
    step: 'evidence',
    source: 'FCC KDB 941225 D06 (which hotspot edges are tested follows from the antenna-to-edge distances; from memory)',
    check: (input) => {
      if (!input.usePositions.some((p) => p.kind === 'hotspot')) return null;
      if (input.hotspotEdges === null) return [{ text: 'No antenna location drawing with readable text is on file, so which hotspot edges must be tested cannot be worked out.' }];
      const known = new Set(input.hotspotEdges.map((e) => e.antennaId));
      const used = [...new Set(input.transmitters.map((t) => t.antennaId))];
      return used.filter((a) => !known.has(a)).map((a) => ({ text: `The antenna drawing gives no edge distance for ${a}.` }));
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
