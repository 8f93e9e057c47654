/** Outbox (admin): every mail Fieldfile sent, newest first; open one to read it. */
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
    <RequireRole role="admin" title="Outbox">
      <OutboxList />
    </RequireRole>
  );
}

function OutboxList() {
  const me = useCurrentUser();
  const wide = useIsWide();
  const messages = useOutboxQuery();
  return (
    <Screen
      eyebrow={me.organisation.name}
      title="Outbox"
      subtitle="Mail Fieldfile has sent: invitations now, review requests and signed packages later."
      testID="outbox-screen"
    >
      <Card>
        {messages.isPending ? (
          <Loading label="Loading mail…" />
        ) : messages.isError ? (
          <LoadFailed what="the outbox" error={messages.error} onRetry={() => void messages.refetch()} />
        ) : messages.data.length === 0 ? (
          <View style={styles.empty}>
            <Icon name="outbox" size={28} color={palette.inkFaint} />
            <Text tone="soft">Nothing sent yet. Invitations you send from People appear here.</Text>
          </View>
        ) : (
          <View style={{ marginVertical: -space.sm }}>
            {messages.data.map((m, i) => (
              <Link key={m.id} href={`/outbox/${m.id}`} asChild>
                <Pressable
                  testID={`outbox-item-${m.id}`}
                  accessibilityLabel={`${m.subject}, to ${m.to}`}
                  style={StyleSheet.flatten([styles.item, i > 0 && styles.itemDivider])}
                >
                  <View style={[styles.itemBody, wide && styles.itemBodyWide]}>
                    <View style={{ flex: 1, minWidth: 0 }}>
                      <Text variant="bodyStrong" numberOfLines={1}>
                        {m.subject}
                      </Text>
                      <Text variant="mono" tone="soft" numberOfLines={1}>
                        to {m.to}
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

const styles = StyleSheet.create({
  empty: { alignItems: 'center', gap: space.sm, paddingVertical: space.xl },
  item: { flexDirection: 'row', alignItems: 'center', gap: space.md, minHeight: layout.touchMinPx + 12, paddingVertical: space.sm, paddingHorizontal: space.xs },
  itemDivider: { borderTopWidth: 1, borderTopColor: palette.line },
  itemBody: { flex: 1, gap: 2, minWidth: 0 },
  itemBodyWide: { flexDirection: 'row', alignItems: 'center', gap: space.lg },
});
