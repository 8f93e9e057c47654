/** One sent mail, as text, with its links clickable. */
import { Link, useLocalSearchParams } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { palette, radii, space } from '../../constants/theme';
import { asProblem } from '../../hooks/api-client';
import { useOutboxMessageQuery } from '../../hooks/queries/outbox';
import { formatDateTime, splitLinks } from '../format';
import { Icon } from '../icons';
import { LoadFailed, Loading } from '../layout/query-states';
import { RequireRole } from '../layout/require-role';
import { Screen } from '../layout/screen';
import { Card } from '../ui/card';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';

export function OutboxMessageScreen() {
  return (
    <RequireRole role="admin" title="Outbox">
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
      <Icon name="chevronLeft" size={16} color={palette.copper} />
      <Text variant="smallStrong" tone="copper">
        Outbox
      </Text>
    </Link>
  );
  if (!Number.isInteger(messageId) || messageId <= 0 || (message.isError && asProblem(message.error).status === 404)) {
    return (
      <Screen title="Message not found" eyebrow="Outbox">
        <Notice tone="error">There is no message with this number. It may have been cleared.</Notice>
        {back}
      </Screen>
    );
  }
  return (
    <Screen eyebrow="Outbox" title={message.data?.subject ?? 'Message'} testID="outbox-message">
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
          <View style={styles.bodyBox} testID="outbox-message-body">
            <Text variant="mono" style={styles.bodyText}>
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
  metaRow: { flexDirection: 'row', gap: space.md, alignItems: 'baseline' },
  metaLabel: { width: 48 },
  bodyBox: { backgroundColor: palette.paper, borderRadius: radii.md, padding: space.lg, borderWidth: 1, borderColor: palette.line },
  bodyText: { whiteSpace: 'pre-wrap', wordBreak: 'break-word' } as object,
  link: { color: palette.copper, textDecorationLine: 'underline', fontFamily: 'PlexMono-Medium' },
});
