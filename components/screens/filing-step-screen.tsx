/**
 * /filings/[id]/[step]: one wizard step, its review comments, previous / next and (on a phone)
 * the way back to the step list.
 */
import { useLocalSearchParams } from 'expo-router';
import { useFilingQuery } from '../../hooks/queries/filings';
import { useIsWide } from '../../hooks/use-is-wide';
import { BackLink } from '../filings/back-link';
import { useFilingId } from '../filings/use-filing-id';
import { LoadFailed, Loading } from '../layout/query-states';
import { Screen } from '../layout/screen';
import { Notice } from '../ui/notice';
import { FILING_PAGES, isWizardStep, PAGE_LABELS } from '../filings/filing-pages';
import { StepBody } from '../filings/step-body';
import { StepNav } from '../filings/step-nav';
import { StepComments } from '../review/step-comments';

export function FilingStepScreen() {
  const id = useFilingId();
  const { step } = useLocalSearchParams<{ step: string }>();
  const query = useFilingQuery(id);
  const wide = useIsWide();
  if (!query.data) {
    return <Screen title="Filing">{query.isError ? <LoadFailed what="this filing" error={query.error} /> : <Loading />}</Screen>;
  }
  const f = query.data;
  if (!isWizardStep(step)) {
    return (
      <Screen title="No such step" eyebrow={f.device.name}>
        <Notice tone="caution">{`“${step}” is not a step of a filing. The steps are ${FILING_PAGES.map((s) => PAGE_LABELS[s]).join(', ')}.`}</Notice>
        <BackLink href={`/filings/${f.id}`} label="All steps" />
      </Screen>
    );
  }
  const index = FILING_PAGES.indexOf(step);
  return (
    <Screen eyebrow={`Step ${index + 1} of ${FILING_PAGES.length} · ${f.device.name}`} title={PAGE_LABELS[step]} pageTitle={`${PAGE_LABELS[step]} · ${f.device.name}`} testID={`step-screen-${step}`}>
      {!wide ? <BackLink href={`/filings/${f.id}`} label="All steps" testID="back-to-steps" /> : null}
      <StepComments filing={f} step={step} />
      <StepBody key={`${f.id}-${step}`} filing={f} step={step} />
      <StepNav filingId={f.id} page={step} />
    </Screen>
  );
}
