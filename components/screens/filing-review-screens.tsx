/**
 * /filings/[id]/readiness: the checklist as its own step.
 * /filings/[id]/review: what an approver reads before signing — the summary, what they can do
 * (ask for review, return with comments, sign with their password, start the next version), the
 * comment threads, every step to read (read-only), the checklist, the versions with their
 * signatures, and the timeline.
 */
import { Link } from 'expo-router';
import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { REGIME_LABELS, type MarketRegime } from '../../constants/schemas/device-file';
import { DATA_STEPS, type FilingDetail, type WizardStep } from '../../constants/schemas/filings';
import type { ReviewDto } from '../../constants/schemas/review';
import { palette, radii, space } from '../../constants/theme';
import { useFilingQuery } from '../../hooks/queries/filings';
import { useReadinessQuery, useReviewQuery, useTimelineQuery } from '../../hooks/queries/review';
import { useIsWide } from '../../hooks/use-is-wide';
import { BackLink } from '../filings/back-link';
import { FILING_PAGES, PAGE_LABELS, readinessWords, REVIEW_STATE_WORDS, threadsOn } from '../filings/filing-pages';
import { STATE_LOOK } from '../filings/labels';
import { StepBody } from '../filings/step-body';
import { StepNav } from '../filings/step-nav';
import { useFilingId } from '../filings/use-filing-id';
import { Icon } from '../icons';
import { LoadFailed, Loading } from '../layout/query-states';
import { Screen } from '../layout/screen';
import { PackageCard } from '../packages/package-card';
import { CommentThreads } from '../review/comment-threads';
import { ReadinessChecklistView, ReadinessCounts } from '../review/readiness-checklist';
import { RequestReviewAction, ReturnAction, SignAction, StartNextVersionAction } from '../review/review-actions';
import { Timeline, VersionList } from '../review/version-history';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { Notice } from '../ui/notice';
import { StatusBadge } from '../ui/status-badge';
import { Text } from '../ui/text';

const eyebrowOf = (page: 'readiness' | 'review', name: string) => `Step ${FILING_PAGES.indexOf(page) + 1} of ${FILING_PAGES.length} · ${name}`;

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
    <Screen eyebrow={eyebrowOf('readiness', filing.data.device.name)} title="Readiness" pageTitle={`Readiness · ${filing.data.device.name}`} testID="readiness-screen">
      {!wide ? <BackLink href={`/filings/${id}`} label="All steps" /> : null}
      <Card title={`Checklist · version ${r.version}`} aside={<ReadinessCounts readiness={r} />}>
        <Text variant="small" tone="soft">
          Computed from the filing’s data every time you open it; nothing here is ticked by hand. Items that block signing must hold before the version goes to review.
        </Text>
        <ReadinessChecklistView readiness={r} filingId={id} />
      </Card>
      {r.cautions.map((c) => (
        <Text key={c} variant="small" tone="muted">
          {c}
        </Text>
      ))}
      <StepNav filingId={id} page="readiness" />
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
    return <Screen title="Review and signing">{error ? <LoadFailed what="the review" error={error} /> : <Loading />}</Screen>;
  }
  const f = filing.data;
  const rv = review.data;
  const r = readiness.data;
  const state = STATE_LOOK[rv.version.state];
  const anyAction = Object.values(rv.can).some((c) => c.allowed);
  return (
    <Screen
      eyebrow={eyebrowOf('review', f.device.name)}
      title="Review and signing"
      pageTitle={`Review · ${f.device.name}`}
      subtitle={`${f.device.name} · ${f.device.model} · version ${rv.version.number}`}
      testID="review-screen"
    >
      {!wide ? <BackLink href={`/filings/${id}`} label="All steps" /> : null}
      <Card title="Summary" aside={<StatusBadge tone={state.tone} icon={state.icon} label={state.label} testID="review-state" />}>
        <Text tone="soft" testID="review-state-words">
          {REVIEW_STATE_WORDS[rv.version.state]}
        </Text>
        <ReadinessCounts readiness={r} />
        <Text variant="small" tone="soft">
          {f.device.applicant} · markets: {f.data.markets.markets.map((m) => REGIME_LABELS[m.regime as MarketRegime]).join(', ') || 'none'} · {f.data.radios.transmitters.length} transmitter
          {f.data.radios.transmitters.length === 1 ? '' : 's'} · {f.data['use-positions'].usePositions.length} use position{f.data['use-positions'].usePositions.length === 1 ? '' : 's'} · owner{' '}
          {f.owner.name}
        </Text>
      </Card>
      <Card title="What you can do" testID="review-actions">
        <RequestReviewAction filingId={id} review={rv} readiness={r} />
        <SignAction filingId={id} review={rv} ready={r.ready} />
        <ReturnAction filingId={id} review={rv} />
        <StartNextVersionAction filingId={id} review={rv} />
        {!anyAction ? (
          <Text tone="muted" testID="review-read-only">
            {nothingToDoWords(rv)}
          </Text>
        ) : null}
      </Card>
      <Card title="Comments" testID="review-comments">
        <Text variant="small" tone="soft">
          {rv.can.comment.allowed
            ? 'Comment on a step, or on one of its rows. You can also comment while reading a step below or on its own page.'
            : 'Comments live with the step they are about; each step’s page shows them too.'}
        </Text>
        <CommentThreads filing={f} review={rv} />
      </Card>
      <Card title="Every step, to read" testID="review-steps">
        <Text variant="small" tone="soft">
          {rv.version.state === 'in-review' || rv.version.state === 'signed'
            ? 'Each step as it will be signed; nothing here can be changed.'
            : 'Each step as it stands now, read-only here; the specialist edits it on the step’s own page.'}
        </Text>
        <StepsToRead filing={f} review={rv} />
      </Card>
      {/* The exhibit as it would go out: a DRAFT preview until the version is signed. */}
      <PackageCard filingId={id} versionNumber={rv.version.number} />
      <Card
        title="Checklist"
        aside={
          <Text variant="small" tone="soft">
            {readinessWords(r.counts)}
          </Text>
        }
      >
        <ReadinessChecklistView readiness={r} filingId={id} onlyFailing={r.counts.blocking + r.counts.warnings > 0} />
        <Link href={`/filings/${id}/readiness`} asChild>
          <Pressable accessibilityRole="link" style={styles.link}>
            <Text variant="smallStrong" tone="copper">
              The whole checklist, with what holds
            </Text>
            <Icon name="chevronRight" size={14} color={palette.copper} />
          </Pressable>
        </Link>
      </Card>
      <Card title="Versions and signatures">
        <VersionList filingId={id} review={rv} />
      </Card>
      <Card title="Timeline">{timeline.data ? <Timeline entries={timeline.data} /> : <Loading />}</Card>
      <StepNav filingId={id} page="review" />
    </Screen>
  );
}

function nothingToDoWords(rv: ReviewDto): string {
  const s = rv.version.state;
  if (s === 'in-review') return rv.can.sign.reason && /another approver/.test(rv.can.sign.reason) ? rv.can.sign.reason : 'An approver reads this version now; you can read along.';
  if (s === 'signed') return 'This version is signed. A compliance specialist starts the next version to change anything.';
  return 'A compliance specialist asks for review once nothing blocks signing; you can read every step meanwhile.';
}

/** Each wizard step, opened in place to read (data steps shown read-only), with its comment count. */
function StepsToRead({ filing, review }: { filing: FilingDetail; review: ReviewDto }) {
  const [open, setOpen] = useState<WizardStep | null>(null);
  // Data steps are read-only here whatever the version's state: the review page is for reading.
  const readOnly = { ...filing, editable: false };
  return (
    <View style={styles.steps}>
      {filing.steps.map((s, i) => {
        const threads = threadsOn(review.threads, s.step);
        const openThreads = threads.filter((t) => t.state === 'open').length;
        const expanded = open === s.step;
        return (
          <View key={s.step} style={[styles.step, expanded && styles.stepOpen]} testID={`read-step-${s.step}`}>
            <View style={styles.stepHead}>
              <Text variant="bodyStrong" style={{ flex: 1, minWidth: 140 }}>
                {i + 1}. {PAGE_LABELS[s.step]}
              </Text>
              <StatusBadge tone={s.complete ? 'pass' : 'caution'} icon={s.complete ? 'check' : 'pending'} label={s.complete ? 'Complete' : 'Incomplete'} />
              {threads.length ? (
                <Text variant="small" tone={openThreads ? 'caution' : 'soft'}>
                  {threads.length} comment{threads.length === 1 ? '' : 's'}
                  {openThreads ? `, ${openThreads} open` : ''}
                </Text>
              ) : null}
              <Button
                label={expanded ? 'Hide' : 'Read'}
                variant="secondary"
                compact
                aria-expanded={expanded}
                accessibilityLabel={`${expanded ? 'Hide' : 'Read'} ${PAGE_LABELS[s.step]}`}
                onPress={() => setOpen(expanded ? null : s.step)}
                testID={`read-step-${s.step}-toggle`}
              />
            </View>
            {expanded ? (
              <View style={styles.stepBody}>
                <StepBody filing={(DATA_STEPS as readonly string[]).includes(s.step) ? readOnly : filing} step={s.step} />
                {threads.length || review.can.comment.allowed ? <CommentThreads filing={filing} review={review} step={s.step} /> : null}
                <Link href={`/filings/${filing.id}/${s.step}`} asChild>
                  <Pressable accessibilityRole="link" style={styles.link}>
                    <Text variant="smallStrong" tone="copper">
                      Open {PAGE_LABELS[s.step]} on its own page
                    </Text>
                    <Icon name="chevronRight" size={14} color={palette.copper} />
                  </Pressable>
                </Link>
              </View>
            ) : null}
          </View>
        );
      })}
      {!filing.steps.length ? <Notice tone="info">This filing has no steps yet.</Notice> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  steps: { gap: space.xs },
  step: { gap: space.sm, padding: space.sm, borderRadius: radii.md, borderWidth: 1, borderColor: palette.line },
  stepOpen: { borderColor: palette.accent },
  stepHead: { flexDirection: 'row', alignItems: 'center', gap: space.sm, flexWrap: 'wrap' },
  stepBody: { gap: space.md, paddingTop: space.sm, borderTopWidth: 1, borderTopColor: palette.line },
  link: { flexDirection: 'row', alignItems: 'center', gap: 4, alignSelf: 'flex-start', minHeight: 32 },
});
