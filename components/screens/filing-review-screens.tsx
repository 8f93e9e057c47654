/**
 * /filings/[id]/readiness: the checklist as its own step.
 * /filings/[id]/review: what an approver reads before signing — the summary, the checklist,
 * every step (read-only while in review), the comment threads, the actions, the versions with
 * their signatures, and the timeline.
 */
import { StyleSheet, View } from 'react-native';
import { REGIME_LABELS, type MarketRegime } from '../../constants/schemas/device-file';
import { space } from '../../constants/theme';
import { useFilingQuery } from '../../hooks/queries/filings';
import { useReadinessQuery, useReviewQuery, useTimelineQuery } from '../../hooks/queries/review';
import { useIsWide } from '../../hooks/use-is-wide';
import { BackLink } from '../filings/back-link';
import { STATE_LOOK } from '../filings/labels';
import { StepList } from '../filings/step-list';
import { useFilingId } from '../filings/use-filing-id';
import { LoadFailed, Loading } from '../layout/query-states';
import { Screen } from '../layout/screen';
import { CommentThreads } from '../review/comment-threads';
import { ReadinessChecklistView, ReadinessCounts } from '../review/readiness-checklist';
import { RequestReviewAction, ReturnAction, SignAction, StartNextVersionAction } from '../review/review-actions';
import { Timeline, VersionList } from '../review/version-history';
import { Card } from '../ui/card';
import { Notice } from '../ui/notice';
import { StatusBadge } from '../ui/status-badge';
import { Text } from '../ui/text';

export function FilingReadinessScreen() {
  const id = useFilingId();
  const filing = useFilingQuery(id);
  const readiness = useReadinessQuery(id);
  const wide = useIsWide();
  if (!filing.data || !readiness.data) {
    const error = filing.error ?? readiness.error;
    return <Screen title="Readiness">{error ? <LoadFailed what="the checklist" error={error} /> : <Loading />}</Screen>;
  }
  const r = readiness.data;
  return (
    <Screen eyebrow={`${filing.data.device.name} · version ${r.version}`} title="Readiness" testID="readiness-screen">
      {!wide ? <BackLink href={`/filings/${id}`} label="All steps" /> : null}
      <Card title="Checklist" aside={<ReadinessCounts readiness={r} />}>
        <Text variant="small" tone="soft">
          Computed from the filing’s data every time you open it; nothing here is ticked by hand. Items that block signing must hold before review.
        </Text>
        <ReadinessChecklistView readiness={r} filingId={id} />
      </Card>
      {r.cautions.map((c) => (
        <Text key={c} variant="small" tone="muted">
          {c}
        </Text>
      ))}
    </Screen>
  );
}

export function FilingReviewScreen() {
  const id = useFilingId();
  const filing = useFilingQuery(id);
  const review = useReviewQuery(id);
  const readiness = useReadinessQuery(id);
  const timeline = useTimelineQuery(id);
  const wide = useIsWide();
  if (!filing.data || !review.data || !readiness.data) {
    const error = filing.error ?? review.error ?? readiness.error;
    return <Screen title="Review">{error ? <LoadFailed what="the review" error={error} /> : <Loading />}</Screen>;
  }
  const f = filing.data;
  const rv = review.data;
  const r = readiness.data;
  const state = STATE_LOOK[rv.version.state];
  const actions = (
    <Card title="What you can do">
      <RequestReviewAction filingId={id} review={rv} ready={r.ready} />
      <SignAction filingId={id} review={rv} ready={r.ready} />
      <ReturnAction filingId={id} review={rv} />
      <StartNextVersionAction filingId={id} review={rv} />
      {!Object.values(rv.can).some((c) => c.allowed) ? (
        <Text tone="muted" testID="review-read-only">
          You can read this review; your role takes no part in it.
        </Text>
      ) : null}
    </Card>
  );
  return (
    <Screen eyebrow={`Review · version ${rv.version.number}`} title={f.device.name} subtitle={`${f.device.model} · ${f.device.applicant}`} testID="review-screen">
      {!wide ? <BackLink href={`/filings/${id}`} label="Overview" /> : null}
      <Card title="Summary" aside={<StatusBadge tone={state.tone} icon={state.icon} label={state.label} testID="review-state" />}>
        <ReadinessCounts readiness={r} />
        <Text variant="small" tone="soft">
          Markets: {f.data.markets.markets.map((m) => REGIME_LABELS[m.regime as MarketRegime]).join(', ') || 'none'} · {f.data.radios.transmitters.length} transmitters ·{' '}
          {f.data['use-positions'].usePositions.length} use positions · owner {f.owner.name}
        </Text>
        {rv.version.state === 'in-review' ? (
          <Notice tone="info">The version is read-only while in review; every step below opens as it will be signed.</Notice>
        ) : null}
      </Card>
      {actions}
      <View style={wide ? styles.columns : undefined}>
        <View style={wide ? styles.column : undefined}>
          <Card title="Comments">
            <CommentThreads filingId={id} review={rv} />
          </Card>
        </View>
        <View style={wide ? styles.column : undefined}>
          <Card title="Steps">
            <StepList filing={f} compact />
          </Card>
        </View>
      </View>
      <Card title="Checklist">
        <ReadinessChecklistView readiness={r} filingId={id} />
      </Card>
      <Card title="Versions and signatures">
        <VersionList filingId={id} review={rv} />
      </Card>
      <Card title="Timeline">{timeline.data ? <Timeline entries={timeline.data} /> : <Loading />}</Card>
    </Screen>
  );
}

const styles = StyleSheet.create({
  columns: { flexDirection: 'row', gap: space.lg, alignItems: 'flex-start' },
  column: { flex: 1, minWidth: 0 },
});
