/** One sent mail: as the recipient sees it (the HTML part, rendered), then its plain-text part with links clickable. */
import { Link, useLocalSearchParams } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { palette, radii, space } from '../../constants/theme';
import { asProblem } from '../../hooks/api-client';
import { useOutboxMessageQuery } from '../../hooks/queries/outbox';
import { formatDateTime, splitLinks } from '../format';
import { Icon } from '../icons';
import { HtmlPreview } from '../mail/html-preview';
import { LoadFailed, Loading } from '../layout/query-states';
import { RequireRole } from '../layout/require-role';
import { Screen } from '../layout/screen';
import { Card } from '../ui/card';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';

export function OutboxMessageScreen() {
  return (
    <RequireRole role="admin" title="Sent mail">
      <Message />
    </RequireRole>
  );
}

function Message() {
  const { id } = useLocalSearchParams<{ id: string }>();
  const messageId = Number(id);
  const message = useOutboxMessageQuery(messageId);
  const back = (
    <Link href="/outbox" style={styles.back} testID="outbox-back">
      <Icon name="chevronLeft" size={16} color={palette.accent} />
      <Text variant="smallStrong" tone="accent">
        Sent mail
      </Text>
    </Link>
  );
  if (!Number.isInteger(messageId) || messageId <= 0 || (message.isError && asProblem(message.error).status === 404)) {
    return (
      <Screen title="Message not found" eyebrow="Sent mail">
        <Notice tone="error">There is no message with this number. It may have been cleared.</Notice>
        {back}
      </Screen>
    );
  }
  return (
    <Screen eyebrow="Sent mail" title={message.data?.subject ?? 'Message'} testID="outbox-message">
      {back}
      {message.isPending ? (
        <Loading />
      ) : message.isError ? (
        <LoadFailed what="the message" error={message.error} onRetry={() => void message.refetch()} />
      ) : (
        <Card>
          <View style={styles.meta}>
            <MetaRow label="To" value={message.data.to} />
            <MetaRow label="From" value={message.data.from} />
            <MetaRow label="Sent" value={formatDateTime(message.data.receivedAt)} />
          </View>
          {message.data.html ? (
            <View style={styles.part}>
              <Text variant="label" tone="muted">
                As it looks
              </Text>
              <HtmlPreview html={message.data.html} title={`Preview: ${message.data.subject}`} />
            </View>
          ) : null}
          <Text variant="label" tone="muted">
            Plain-text version
          </Text>
          <View style={styles.bodyBox} testID="outbox-message-body">
            <Text variant="body" style={styles.bodyText}>
              {splitLinks(message.data.text).map((part, i) =>
                part.url ? (
                  <Link key={i} href={part.url as never} style={styles.link} testID="outbox-message-link">
                    {part.text}
                  </Link>
                ) : (
                  <Text key={i}>{part.text}</Text>
                ),
              )}
            </Text>
          </View>
        </Card>
      )}
    </Screen>
  );
}

function MetaRow({ label, value }: { label: string; value: string }) {
  return (
    <View style={styles.metaRow}>
      <Text variant="label" tone="muted" style={styles.metaLabel}>
        {label}
      </Text>
      <Text variant="small" style={{ flex: 1 }}>
        {value}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  back: { flexDirection: 'row', alignItems: 'center', gap: space.xs, alignSelf: 'flex-start', minHeight: 32 },
  meta: { gap: space.xs },
  part: { gap: space.xs },
  metaRow: { flexDirection: 'row', gap: space.md, alignItems: 'baseline' },
  metaLabel: { width: 48 },
  bodyBox: { backgroundColor: palette.paper, borderRadius: radii.md, padding: space.lg, borderWidth: 1, borderColor: palette.line },
  bodyText: { whiteSpace: 'pre-wrap', wordBreak: 'break-word' } as object,
  link: { color: palette.accent, textDecorationLine: 'underline' },
});
