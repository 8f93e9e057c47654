/** Sent mail (admin): every mail Fieldfile sent, newest first, with its opening lines; open one to see it rendered. */
import { Link } from 'expo-router';
import { Pressable, StyleSheet, View } from 'react-native';
import { layout, palette, space } from '../../constants/theme';
import { useOutboxQuery } from '../../hooks/queries/outbox';
import { useCurrentUser } from '../../hooks/queries/session';
import { useIsWide } from '../../hooks/use-is-wide';
import { formatDateTime } from '../format';
import { Icon } from '../icons';
import { LoadFailed, Loading } from '../layout/query-states';
import { RequireRole } from '../layout/require-role';
import { Screen } from '../layout/screen';
import { Card } from '../ui/card';
import { Text } from '../ui/text';

export function OutboxScreen() {
  return (
    <RequireRole role="admin" title="Sent mail">
      <OutboxList />
    </RequireRole>
  );
}

function OutboxList() {
  const me = useCurrentUser();
  const wide = useIsWide();
  const messages = useOutboxQuery();
  return (
    <Screen eyebrow={me.organisation.name} title="Sent mail" subtitle="Every message Fieldfile has sent, as the recipient sees it." testID="outbox-screen">
      <Card>
        {messages.isPending ? (
          <Loading label="Loading mail…" />
        ) : messages.isError ? (
          <LoadFailed what="the sent mail" error={messages.error} onRetry={() => void messages.refetch()} />
        ) : messages.data.length === 0 ? (
          <View style={styles.empty}>
            <Icon name="outbox" size={28} color={palette.inkFaint} />
            <Text tone="soft">Nothing sent yet. Invitations you send from People appear here.</Text>
          </View>
        ) : (
          <View style={{ marginVertical: -space.sm }}>
            {messages.data.map((m, i) => (
              <Link key={m.id} href={`/outbox/${m.id}`} asChild>
                <Pressable testID={`outbox-item-${m.id}`} accessibilityLabel={`${m.subject}, to ${m.to}`} style={StyleSheet.flatten([styles.item, i > 0 && styles.itemDivider])}>
                  <View style={[styles.itemBody, wide && styles.itemBodyWide]}>
                    <View style={{ flex: 1, minWidth: 0 }}>
                      <Text variant="bodyStrong" numberOfLines={1}>
                        {m.subject}
                      </Text>
                      <Text variant="small" tone="soft" numberOfLines={1}>
                        To {m.to}
                      </Text>
                      <Text variant="small" tone="muted" numberOfLines={2} testID={`outbox-snippet-${m.id}`}>
                        {snippet(m.text)}
                      </Text>
                    </View>
                    <Text variant="small" tone="muted">
                      {formatDateTime(m.receivedAt)}
                    </Text>
                  </View>
                  <Icon name="chevronRight" size={18} color={palette.inkMuted} />
                </Pressable>
              </Link>
            ))}
          </View>
        )}
      </Card>
    </Screen>
  );
}

/** The message's first words, without the greeting line, for the list. */
function snippet(text: string): string {
  const lines = text
    .split(/\r?\n/)
    .map((l) => l.trim())
    .filter(Boolean);
  const body = /^(hello|hi|dear)\b/i.test(lines[0] ?? '') ? lines.slice(1) : lines;
  return body.join(' ').slice(0, 180);
}

const styles = StyleSheet.create({
  empty: { alignItems: 'center', gap: space.sm, paddingVertical: space.xl },
  item: { flexDirection: 'row', alignItems: 'center', gap: space.md, minHeight: layout.touchMinPx + 12, paddingVertical: space.sm, paddingHorizontal: space.xs },
  itemDivider: { borderTopWidth: 1, borderTopColor: palette.line },
  itemBody: { flex: 1, gap: 2, minWidth: 0 },
  itemBodyWide: { flexDirection: 'row', alignItems: 'center', gap: space.lg },
});
