/**
 * /filings/[id]: the device, version and state, each step's completion, readiness, the review
 * and what to do next, the versions, the timeline, the device file export and the package.
 */
import { useRouter } from 'expo-router';
import { Linking, StyleSheet, View } from 'react-native';
import { PRODUCT_TYPE_LABELS, REGIME_LABELS, type MarketRegime } from '../../constants/schemas/device-file';
import { STEP_LABELS } from '../../constants/schemas/filings';
import { space } from '../../constants/theme';
import { deviceFileUrl, useFilingQuery } from '../../hooks/queries/filings';
import { useIsWide } from '../../hooks/use-is-wide';
import { BackLink } from '../filings/back-link';
import { STATE_LOOK } from '../filings/labels';
import { StepList } from '../filings/step-list';
import { useFilingId } from '../filings/use-filing-id';
import { formatDateTime } from '../format';
import { LoadFailed, Loading } from '../layout/query-states';
import { Screen } from '../layout/screen';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { Notice } from '../ui/notice';
import { StatusBadge } from '../ui/status-badge';
import { Text } from '../ui/text';
import { PackageCard } from '../packages/package-card';
import { Fact } from '../ui/fact';
import { ArchiveCard } from '../filings/archive-card';
import { ReadinessCard, ReviewCard, TimelineCard, VersionsCard } from '../review/overview-cards';

export function FilingOverviewScreen() {
  const id = useFilingId();
  const query = useFilingQuery(id);
  const wide = useIsWide();
  const router = useRouter();
  if (!query.data) {
    return <Screen title="Filing">{query.isError ? <LoadFailed what="this filing" error={query.error} /> : <Loading />}</Screen>;
  }
  const f = query.data;
  const d = f.data.device;
  const state = STATE_LOOK[f.version.state];
  const done = f.steps.filter((s) => s.complete).length;
  const next = f.steps.find((s) => !s.complete) ?? f.steps[f.steps.length - 1];
  return (
    <Screen eyebrow={`Filing · version ${f.version.number}`} title={d.name} subtitle={`${d.model} · ${d.applicant}`} testID="filing-overview">
      {!wide ? <BackLink href="/filings" label="All filings" /> : null}
      {f.archivedAt ? (
        <Notice tone="caution" title="Archived · read only" testID="filing-archived">
          {`Archived ${formatDateTime(f.archivedAt)}. Nothing in it can change until its owner or an admin restores it (see Archived filing below).`}
        </Notice>
      ) : !f.editable ? (
        <Notice tone="info" title="Read only" testID="filing-read-only">
          {f.version.state === 'draft' || f.version.state === 'returned'
            ? 'Only a compliance specialist changes the device data. You can read every step and the screening.'
            : `Version ${f.version.number} is ${state.label.toLowerCase()}; its data no longer changes.`}
        </Notice>
      ) : null}
      <Card title="Progress" aside={<StatusBadge tone={state.tone} icon={state.icon} label={state.label} />}>
        <Text tone="soft" testID="filing-progress">
          {done} of {f.steps.length} steps complete. {done < f.steps.length ? `Next: ${STEP_LABELS[next.step]}.` : 'Screening is ready to read.'}
        </Text>
        {!wide ? <StepList filing={f} activeStep="overview" /> : null}
        <Button
          label={`Go to ${STEP_LABELS[next.step]}`}
          icon="chevronRight"
          onPress={() => router.push(`/filings/${f.id}/${next.step}`)}
          style={{ alignSelf: 'flex-start' }}
          testID="overview-continue"
        />
      </Card>
      <ReadinessCard filingId={f.id} />
      <ReviewCard filing={f} />
      <Card title="Device">
        <View style={styles.facts}>
          <Fact label="Product type" value={PRODUCT_TYPE_LABELS[d.productType] ?? d.productType} />
          <Fact label="Hardware version" value={d.hardwareVersion || '—'} />
          <Fact label="Firmware version" value={d.firmwareVersion || '—'} />
          <Fact label="Transmitters" value={String(f.data.radios.transmitters.length)} />
          <Fact label="Use positions" value={String(f.data['use-positions'].usePositions.length)} />
          <Fact label="Owner" value={f.owner.name} />
          <Fact label="Last change" value={formatDateTime(f.updatedAt)} />
        </View>
        <View style={{ gap: space.xxs }}>
          <Text variant="smallStrong" tone="soft">
            Markets
          </Text>
          {f.data.markets.markets.length ? (
            f.data.markets.markets.map((m) => (
              <Text key={m.regime} variant="small">
                {REGIME_LABELS[m.regime as MarketRegime]} · {m.tier === 'occupational' ? 'occupational' : 'general population'}
              </Text>
            ))
          ) : (
            <Text variant="small" tone="muted">
              None chosen yet.
            </Text>
          )}
        </View>
      </Card>
      <Card title="Device file">
        <Text variant="small" tone="soft">
          The whole device — identity, markets, antennas, transmitters and use positions — as one JSON file (fieldfile.device/1), for your lab’s tools or to start another filing from it.
        </Text>
        <Button label="Export device.json" variant="secondary" icon="link" onPress={() => void Linking.openURL(deviceFileUrl(f.id))} style={{ alignSelf: 'flex-start' }} testID="export-device-file" />
      </Card>
      <PackageCard filingId={f.id} versionNumber={f.version.number} />
      <VersionsCard filingId={f.id} />
      <TimelineCard filingId={f.id} />
      <ArchiveCard filing={f} />
    </Screen>
  );
}

const styles = StyleSheet.create({
  facts: { flexDirection: 'row', flexWrap: 'wrap', gap: space.lg },
});
