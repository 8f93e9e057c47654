/**
 * The review's cards on a filing's overview: readiness (the count per severity, the items that
 * block signing, a link to the checklist), the review (the version's state, open comments, what
 * the person can do now), the versions (each with its state and signer, and a link to compare it
 * with the one before) and the filing's timeline.
 */
import { Link, useRouter } from 'expo-router';
import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import type { FilingDetail } from '../../constants/schemas/filings';
import type { ReviewDto } from '../../constants/schemas/review';
import { palette, radii, space } from '../../constants/theme';
import { useReadinessQuery, useReviewQuery, useTimelineQuery, type FilingReadiness } from '../../hooks/queries/review';
import { PAGE_LABELS, readinessWords, REVIEW_STATE_WORDS, type FilingPage } from '../filings/filing-pages';
import { STATE_LOOK } from '../filings/labels';
import { formatDateTime } from '../format';
import { Icon } from '../icons';
import { LoadFailed, Loading } from '../layout/query-states';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { StatusBadge } from '../ui/status-badge';
import { Text } from '../ui/text';
import { blockingItemsOf, RequestReviewAction, StartNextVersionAction } from './review-actions';
import { Timeline } from './version-history';

/** How many timeline entries the overview shows before "Show all". */
const TIMELINE_PREVIEW = 6;

function ArrowLink({ href, label, testID }: { href: string; label: string; testID?: string }) {
  return (
    <Link href={href} asChild>
      <Pressable accessibilityRole="link" style={styles.link} testID={testID}>
        <Text variant="smallStrong" tone="copper">
          {label}
        </Text>
        <Icon name="chevronRight" size={14} color={palette.copper} />
      </Pressable>
    </Link>
  );
}

function Count({ value, label, tone, testID }: { value: number; label: string; tone: 'fail' | 'caution' | 'pass'; testID: string }) {
  const color = value === 0 ? palette.pass : tone === 'fail' ? palette.fail : palette.caution;
  return (
    <View style={styles.count} testID={testID}>
      <View style={styles.countRow}>
        <Icon name={value === 0 ? 'check' : tone === 'fail' ? 'blocked' : 'warning'} size={18} color={color} strokeWidth={2} />
        <Text variant="title" style={{ color }}>
          {value}
        </Text>
      </View>
      <Text variant="small" tone="soft">
        {label}
      </Text>
    </View>
  );
}

export function ReadinessCard({ filingId }: { filingId: number }) {
  const query = useReadinessQuery(filingId);
  return (
    <Card title="Readiness" testID="overview-readiness">
      {!query.data ? (
        query.isError ? (
          <LoadFailed what="the checklist" error={query.error} onRetry={() => void query.refetch()} />
        ) : (
          <Loading label="Checking the filing…" />
        )
      ) : (
        <ReadinessSummary filingId={filingId} readiness={query.data} />
      )}
    </Card>
  );
}

function ReadinessSummary({ filingId, readiness }: { filingId: number; readiness: FilingReadiness }) {
  const blocking = blockingItemsOf(readiness);
  return (
    <>
      <View style={styles.counts}>
        <Count value={readiness.counts.blocking} label="block signing" tone="fail" testID="overview-blocking-count" />
        <Count value={readiness.counts.warnings} label={readiness.counts.warnings === 1 ? 'warning' : 'warnings'} tone="caution" testID="overview-warning-count" />
      </View>
      {blocking.length ? (
        <View style={{ gap: space.xxs }}>
          {blocking.slice(0, 3).map((i) => (
            <View key={i.id} style={styles.item}>
              <Icon name="blocked" size={14} color={palette.fail} />
              <Text variant="small" style={{ flex: 1 }}>
                {i.title}{' '}
                <Text variant="small" tone="muted">
                  ({PAGE_LABELS[i.step as FilingPage] ?? i.step})
                </Text>
              </Text>
            </View>
          ))}
          {blocking.length > 3 ? (
            <Text variant="small" tone="muted">
              and {blocking.length - 3} more.
            </Text>
          ) : null}
        </View>
      ) : (
        <Text variant="small" tone="soft">
          {readinessWords(readiness.counts)}: the version can go to review.
        </Text>
      )}
      <ArrowLink href={`/filings/${filingId}/readiness`} label="Open the checklist" testID="overview-open-readiness" />
    </>
  );
}

export function ReviewCard({ filing }: { filing: FilingDetail }) {
  const review = useReviewQuery(filing.id);
  const readiness = useReadinessQuery(filing.id);
  const look = STATE_LOOK[filing.version.state];
  return (
    <Card title="Review" aside={<StatusBadge tone={look.tone} icon={look.icon} label={look.label} testID="overview-review-state" />} testID="overview-review">
      <Text tone="soft">{REVIEW_STATE_WORDS[filing.version.state]}</Text>
      {!review.data || !readiness.data ? (
        review.isError || readiness.isError ? (
          <LoadFailed what="the review" error={review.error ?? readiness.error} />
        ) : (
          <Loading />
        )
      ) : (
        <ReviewSummary filing={filing} review={review.data} readiness={readiness.data} />
      )}
    </Card>
  );
}

function ReviewSummary({ filing, review, readiness }: { filing: FilingDetail; review: ReviewDto; readiness: FilingReadiness }) {
  const open = review.threads.filter((t) => t.state === 'open').length;
  const signature = review.version.signature;
  const approverTurn = review.can.sign.allowed || review.can.return.allowed;
  const router = useRouter();
  return (
    <>
      {review.threads.length ? (
        <Text variant="small" tone={open ? 'caution' : 'soft'} testID="overview-threads">
          {review.threads.length} comment thread{review.threads.length === 1 ? '' : 's'}, {open} open.
        </Text>
      ) : null}
      {signature ? (
        <Text variant="small" tone="soft">
          Signed by {signature.signer.name} on {formatDateTime(signature.signedAt)}.
        </Text>
      ) : null}
      <RequestReviewAction filingId={filing.id} review={review} readiness={readiness} />
      <StartNextVersionAction filingId={filing.id} review={review} />
      <Button
        label={approverTurn ? 'Review and sign' : 'Open the review'}
        variant={approverTurn ? 'primary' : 'secondary'}
        icon="chevronRight"
        onPress={() => router.push(`/filings/${filing.id}/review`)}
        style={styles.button}
        testID="overview-open-review"
      />
    </>
  );
}

export function VersionsCard({ filingId }: { filingId: number }) {
  const review = useReviewQuery(filingId);
  if (!review.data) return null;
  const versions = [...review.data.versions].reverse();
  return (
    <Card title="Versions" testID="overview-versions">
      <View role="list" style={{ gap: space.xs }}>
        {versions.map((v) => {
          const look = STATE_LOOK[v.state];
          return (
            <View key={v.id} role="listitem" style={styles.version} testID={`overview-version-${v.number}`}>
              <View style={styles.versionHead}>
                <Text variant="bodyStrong" style={{ flex: 1 }}>
                  Version {v.number}
                </Text>
                <StatusBadge tone={look.tone} icon={look.icon} label={look.label} />
              </View>
              <Text variant="small" tone="soft">
                {v.signature ? `Signed by ${v.signature.signer.name}, ${formatDateTime(v.signature.signedAt)}` : `Started ${formatDateTime(v.createdAt)}`}
              </Text>
              {v.number > 1 ? (
                <ArrowLink href={`/filings/${filingId}/compare?from=${v.number - 1}&to=${v.number}`} label={`Compare with version ${v.number - 1}`} testID={`overview-compare-v${v.number}`} />
              ) : null}
            </View>
          );
        })}
      </View>
    </Card>
  );
}

export function TimelineCard({ filingId }: { filingId: number }) {
  const timeline = useTimelineQuery(filingId);
  const [all, setAll] = useState(false);
  const entries = timeline.data ?? [];
  return (
    <Card title="Timeline" testID="overview-timeline">
      {!timeline.data ? timeline.isError ? <LoadFailed what="the timeline" error={timeline.error} /> : <Loading /> : <Timeline entries={entries} limit={all ? undefined : TIMELINE_PREVIEW} />}
      {entries.length > TIMELINE_PREVIEW ? (
        <Button
          label={all ? 'Show the latest only' : `Show all ${entries.length} events`}
          variant="secondary"
          compact
          onPress={() => setAll(!all)}
          style={styles.button}
          testID="overview-timeline-toggle"
        />
      ) : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  counts: { flexDirection: 'row', gap: space.xl, flexWrap: 'wrap' },
  count: { gap: 2, minWidth: 120 },
  countRow: { flexDirection: 'row', alignItems: 'center', gap: space.xs },
  item: { flexDirection: 'row', gap: space.xs, alignItems: 'center' },
  link: { flexDirection: 'row', alignItems: 'center', gap: 4, alignSelf: 'flex-start', minHeight: 32 },
  button: { alignSelf: 'flex-start' },
  version: { gap: 2, padding: space.sm, borderRadius: radii.md, borderWidth: 1, borderColor: palette.paperDeep },
  versionHead: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
});
