/**
 * Which evidence categories a filing needs: a pure function of facts about the filing (its
 * markets, use positions, screening counts and lab results) and the categories present. The
 * readiness rules call it as well as the evidence list. The rules are trade practice for what a
 * reviewer expects beside an RF-exposure exhibit (FCC 47 CFR §2.1033(b) lists the exhibits of an
 * application; RSP-100 asks for the user notices in English and French); they are not a
 * regulator's list.
 */
import type { EvidenceCategoryId, RequiredCategory } from '../../constants/schemas/evidence';
import type { MarketRegime, UsePositionKind } from '../../constants/schemas/device-file';

export interface EvidenceFacts {
  markets: readonly MarketRegime[];
  usePositionKinds: readonly UsePositionKind[];
  /** Screening counts over every transmitter × use position × market; null while it cannot run. */
  screening: { combinations: number; exempt: number; evaluateSar: number; evaluateMpe: number } | null;
  /** How many SAR and MPE results the lab entered (0 when none, or before lab results exist). */
  labResults: { sar: number; mpe: number };
}

export interface RequiredRule {
  category: EvidenceCategoryId;
  reason: string;
}

/** The categories the filing needs, each with the reason, in the order a reviewer reads them. */
export function requiredEvidenceRules(f: EvidenceFacts): RequiredRule[] {
  const rules: RequiredRule[] = [];
  const needsSar = (f.screening?.evaluateSar ?? 0) > 0 || f.labResults.sar > 0;
  const needsMpe = (f.screening?.evaluateMpe ?? 0) > 0 || f.labResults.mpe > 0;
  const allExempt = !needsSar && !needsMpe && f.screening !== null && f.screening.combinations > 0 && f.screening.exempt === f.screening.combinations;

  if (needsSar) {
    const why = f.labResults.sar > 0 ? 'The lab entered SAR results' : 'Screening says at least one transmitter needs a SAR evaluation';
    rules.push(
      { category: 'test-report', reason: `${why}: the SAR test report carries them.` },
      { category: 'report-appendix', reason: `${why}: the plots of the highest reported SAR go with the report.` },
      { category: 'calibration-certificate', reason: `${why}: probe, dipole and electronics calibrations must cover the test dates.` },
      { category: 'check-records', reason: `${why}: liquid and system checks show the setup was in tolerance.` },
      { category: 'setup-photos', reason: `${why}: photos show each tested position.` },
    );
  } else if (needsMpe) {
    rules.push({ category: 'test-report', reason: 'Screening says at least one transmitter needs an MPE evaluation: the report carries it.' });
  }
  if (f.usePositionKinds.includes('hotspot')) {
    rules.push({ category: 'antenna-drawing', reason: 'A hotspot use position: the antenna-to-edge distances decide which edges are tested.' });
  }
  rules.push({ category: 'tune-up-table', reason: 'Every filing: the declared tune-up powers must match those in the report and the screening.' });
  if (f.markets.includes('ised')) {
    rules.push({ category: 'user-manual-bilingual', reason: 'Canada (ISED): the separation and RF-exposure statements must be given in English and French.' });
  } else {
    rules.push({ category: 'user-manual', reason: 'Every filing: the manual tells users the separation distance.' });
  }
  const labelled = [f.markets.includes('fcc') && 'FCC', f.markets.includes('ised') && 'ISED'].filter(Boolean);
  if (labelled.length) {
    rules.push({ category: 'label-drawing', reason: `${labelled.join(' and ')} applications include the label and its location.` });
  }
  if (allExempt) {
    rules.push({ category: 'exemption-analysis', reason: 'Every transmitter is exempt in every use position: the exhibit is the exemption analysis.' });
  }
  return rules;
}

/** The rules with what is present: uploaded categories count; Fieldfile's own exhibits always do. */
export function requiredEvidence(f: EvidenceFacts, present: readonly { id: number; category: EvidenceCategoryId }[], writtenByFieldfile: (c: EvidenceCategoryId) => boolean): RequiredCategory[] {
  return requiredEvidenceRules(f).map((r) => {
    const evidenceIds = present.filter((p) => p.category === r.category).map((p) => p.id);
    const own = writtenByFieldfile(r.category);
    return { ...r, present: own || evidenceIds.length > 0, evidenceIds, writtenByFieldfile: own };
  });
}
