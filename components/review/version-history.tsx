/** The filing's versions with their signatures (and a verify button), and its timeline of events. */
import { Link } from 'expo-router';
import { Pressable, StyleSheet, View } from 'react-native';
import { palette, space } from '../../constants/theme';
import type { ReviewDto, TimelineEntryDto, VersionDto } from '../../constants/schemas/review';
import { useVerifyMutation } from '../../hooks/queries/review';
import { STATE_LOOK } from '../filings/labels';
import { formatDateTime } from '../format';
import { Icon } from '../icons';
import { Button } from '../ui/button';
import { Notice } from '../ui/notice';
import { StatusBadge } from '../ui/status-badge';
import { Text } from '../ui/text';

export function SignatureBlock({ filingId, version }: { filingId: number; version: VersionDto }) {
  const verify = useVerifyMutation(filingId);
  const s = version.signature;
  if (!s) return null;
  const v = verify.data?.version === version.number ? verify.data : undefined;
  return (
    <View style={styles.signature} testID={`signature-v${version.number}`}>
      <View style={styles.row}>
        <Icon name="lock" size={16} color={palette.pass} />
        <Text variant="bodyStrong" style={{ flex: 1 }}>
          Signed by {s.signer.name} ({s.signer.role}) · {formatDateTime(s.signedAt)}
        </Text>
      </View>
      <Text variant="small" tone="soft">
        “{s.statement}”
      </Text>
      <Text variant="mono" style={styles.hash} selectable testID={`signature-hash-v${version.number}`}>
        SHA-256 {s.contentSha256}
      </Text>
      <Button
        label="Verify the signature"
        variant="secondary"
        compact
        busy={verify.isPending}
        onPress={() => verify.mutate(version.number)}
        style={{ alignSelf: 'flex-start' }}
        testID={`verify-v${version.number}`}
      />
      {v ? (
        <Notice tone={v.matches ? 'success' : 'error'} title={v.matches ? 'Matches' : 'Does not match'} testID={`verify-result-v${version.number}`}>
          {v.matches
            ? `The stored content still hashes to the signed SHA-256 (checked ${formatDateTime(v.verifiedAt)}).`
            : `The stored content now hashes to ${v.currentSha256}; it was signed as ${v.signedSha256}. Something changed after signing.`}
        </Notice>
      ) : null}
      {verify.error ? <Notice tone="error">{(verify.error as Error).message}</Notice> : null}
    </View>
  );
}

export function VersionList({ filingId, review }: { filingId: number; review: ReviewDto }) {
  const versions = [...review.versions].reverse();
  return (
    <View style={{ gap: space.sm }} testID="version-list">
      {versions.map((v) => {
        const look = STATE_LOOK[v.state];
        return (
          <View key={v.id} style={styles.version}>
            <View style={styles.row}>
              <Text variant="bodyStrong" style={{ flex: 1 }}>
                Version {v.number}
              </Text>
              <StatusBadge tone={look.tone} icon={look.icon} label={look.label} />
            </View>
            {v.number > 1 ? (
              <Link href={`/filings/${filingId}/compare?from=${v.number - 1}&to=${v.number}`} asChild>
                <Pressable accessibilityRole="link" style={styles.link} testID={`compare-v${v.number - 1}-v${v.number}`}>
                  <Text variant="smallStrong" tone="copper">
                    Compare with version {v.number - 1}
                  </Text>
                  <Icon name="chevronRight" size={14} color={palette.copper} />
                </Pressable>
              </Link>
            ) : null}
            <SignatureBlock filingId={filingId} version={v} />
          </View>
        );
      })}
    </View>
  );
}

const ACTION_WORDS: Record<string, string> = {
  'filing.create': 'Created the filing',
  'filing.import': 'Created the filing from a device file',
  'filing.archive': 'Archived the filing',
  'filing.restore': 'Restored the filing',
  'filing.step-save': 'Saved a step',
  'version.review-requested': 'Asked for review',
  'version.returned': 'Returned for changes',
  'version.signed': 'Signed',
  'version.sign-refused': 'Signing refused',
  'version.verified': 'Verified the signature',
  'version.started': 'Started a new version',
  'review.comment': 'Commented',
  'review.reply': 'Answered a comment',
  'review.resolve': 'Resolved a comment',
  'review.reopen': 'Reopened a comment',
  'mail.failed': 'A mail could not be sent',
};

function detailWords(e: TimelineEntryDto): string {
  const d = (e.details ?? {}) as Record<string, unknown>;
  const parts: string[] = [];
  if (typeof d.version === 'number') parts.push(`version ${d.version}`);
  if (typeof d.step === 'string') parts.push(`step ${d.step}${d.rowRef ? `, row ${d.rowRef}` : ''}`);
  if (e.action === 'version.sign-refused') parts.push(`${d.reason ?? 'refused'}, attempt ${d.attempt ?? 1}`);
  if (e.action === 'version.verified') parts.push(d.matches ? 'matches' : 'does not match');
  if (typeof d.contentSha256 === 'string') parts.push(`SHA-256 ${d.contentSha256.slice(0, 12)}…`);
  return parts.join(' · ');
}

export function Timeline({ entries, limit }: { entries: TimelineEntryDto[]; limit?: number }) {
  const shown = limit ? entries.slice(0, limit) : entries;
  if (!shown.length) return <Text tone="muted">Nothing has happened yet.</Text>;
  return (
    <View role="list" style={{ gap: space.xs }} testID="filing-timeline">
      {shown.map((e) => (
        <View key={e.id} role="listitem" style={styles.event}>
          <Text variant="small" tone="muted" style={styles.when}>
            {formatDateTime(e.at)}
          </Text>
          <View style={{ flex: 1, minWidth: 180 }}>
            <Text variant="smallStrong">
              {ACTION_WORDS[e.action] ?? e.action}
              {e.actorName ? ` — ${e.actorName}` : ''}
            </Text>
            {detailWords(e) ? (
              <Text variant="small" tone="soft">
                {detailWords(e)}
              </Text>
            ) : null}
          </View>
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  signature: { gap: space.xs, paddingTop: space.xs },
  hash: { fontSize: 12, color: palette.inkSoft },
  version: { gap: space.xs, paddingBottom: space.sm, borderBottomWidth: 1, borderBottomColor: palette.paperDeep },
  link: { flexDirection: 'row', alignItems: 'center', gap: 4, alignSelf: 'flex-start', minHeight: 32 },
  event: { flexDirection: 'row', gap: space.sm, flexWrap: 'wrap', paddingVertical: 4, borderBottomWidth: 1, borderBottomColor: palette.paperDeep },
  when: { width: 130 },
});
