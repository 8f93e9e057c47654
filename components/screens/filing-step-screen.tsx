/** /filings/[id]/[step]: one wizard step, with previous / next and (on a phone) the way back to the step list. */
import { useLocalSearchParams, useRouter } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { STEP_LABELS, WIZARD_STEPS, type FilingDetail, type WizardStep } from '../../constants/schemas/filings';
import { palette, space } from '../../constants/theme';
import { useFilingQuery } from '../../hooks/queries/filings';
import { useIsWide } from '../../hooks/use-is-wide';
import { BackLink } from '../filings/back-link';
import { DeviceStep } from '../filings/device-step';
import { MarketsStep } from '../filings/markets-step';
import { RadiosStep } from '../filings/radios-step';
import { UsePositionsStep } from '../filings/use-positions-step';
import { useFilingId } from '../filings/use-filing-id';
import { LoadFailed, Loading } from '../layout/query-states';
import { Screen } from '../layout/screen';
import { Button } from '../ui/button';
import { Notice } from '../ui/notice';
import { ScreeningView } from '../filings/screening-view';
import { LabView } from '../filings/lab-view';
import { CoTransmissionView } from '../filings/co-transmission-view';

const isStep = (s: string | undefined): s is WizardStep => !!s && (WIZARD_STEPS as readonly string[]).includes(s);

export function FilingStepScreen() {
  const id = useFilingId();
  const { step } = useLocalSearchParams<{ step: string }>();
  const query = useFilingQuery(id);
  const wide = useIsWide();
  if (!query.data) {
    return <Screen title="Filing">{query.isError ? <LoadFailed what="this filing" error={query.error} /> : <Loading />}</Screen>;
  }
  const f = query.data;
  if (!isStep(step)) {
    return (
      <Screen title="No such step" eyebrow={f.device.name}>
        <Notice tone="caution">{`“${step}” is not a step of a filing. The steps are ${WIZARD_STEPS.map((s) => STEP_LABELS[s]).join(', ')}.`}</Notice>
        <BackLink href={`/filings/${f.id}`} label="All steps" />
      </Screen>
    );
  }
  const index = WIZARD_STEPS.indexOf(step);
  return (
    <Screen eyebrow={`Step ${index + 1} of ${WIZARD_STEPS.length} · ${f.device.name}`} title={STEP_LABELS[step]} pageTitle={`${STEP_LABELS[step]} · ${f.device.name}`} testID={`step-screen-${step}`}>
      {!wide ? <BackLink href={`/filings/${f.id}`} label="All steps" testID="back-to-steps" /> : null}
      <StepBody key={`${f.id}-${step}`} filing={f} step={step} />
      <StepNav filing={f} index={index} />
    </Screen>
  );
}

function StepBody({ filing, step }: { filing: FilingDetail; step: WizardStep }) {
  switch (step) {
    case 'device':
      return <DeviceStep filing={filing} />;
    case 'radios':
      return <RadiosStep filing={filing} />;
    case 'use-positions':
      return <UsePositionsStep filing={filing} />;
    case 'markets':
      return <MarketsStep filing={filing} />;
    case 'screening':
      return <ScreeningView filing={filing} />;
    case 'measurements':
      return <LabView filing={filing} />;
    case 'co-transmission':
      return <CoTransmissionView filing={filing} />;
  }
}

function StepNav({ filing, index }: { filing: FilingDetail; index: number }) {
  const router = useRouter();
  const prev = index > 0 ? WIZARD_STEPS[index - 1] : null;
  const next = index < WIZARD_STEPS.length - 1 ? WIZARD_STEPS[index + 1] : null;
  return (
    <View style={styles.nav} role="navigation" aria-label="Steps">
      {prev ? (
        <Button label={`Back: ${STEP_LABELS[prev]}`} variant="secondary" icon="chevronLeft" onPress={() => router.push(`/filings/${filing.id}/${prev}`)} testID="step-prev" />
      ) : (
        <View />
      )}
      {next ? (
        <Button label={`Next: ${STEP_LABELS[next]}`} icon="chevronRight" onPress={() => router.push(`/filings/${filing.id}/${next}`)} testID="step-next" />
      ) : (
        <Button label="Back to the overview" variant="secondary" onPress={() => router.push(`/filings/${filing.id}`)} testID="step-done" />
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  nav: { flexDirection: 'row', justifyContent: 'space-between', flexWrap: 'wrap', gap: space.sm, paddingTop: space.md, borderTopWidth: 1, borderTopColor: palette.line },
});
