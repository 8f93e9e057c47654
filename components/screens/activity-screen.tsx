/** Activity (admin): the organisation's audit trail, newest first. */
import { StyleSheet, View } from 'react-native';
import { palette, space } from '../../constants/theme';
import { useAuditQuery, type AuditEntry } from '../../hooks/queries/audit';
import { useCurrentUser } from '../../hooks/queries/session';
import { useIsWide } from '../../hooks/use-is-wide';
import { formatDateTime } from '../format';
import { LoadFailed, Loading } from '../layout/query-states';
import { RequireRole } from '../layout/require-role';
import { Screen } from '../layout/screen';
import { Card } from '../ui/card';
import { Text } from '../ui/text';

const ACTION_LABELS: Record<string, string> = {
  'auth.sign-in': 'Signed in',
  'auth.sign-in-failed': 'Failed sign-in',
  'auth.sign-out': 'Signed out',
  'auth.password-set': 'Set a password',
  'auth.set-password': 'Set a password',
  'auth.sign-in-blocked': 'Sign-in paused after wrong passwords',
  'auth.password-reset-requested': 'Asked for a password-reset link',
  'auth.password-reset': 'Chose a new password from a reset link',
  'auth.password-change': 'Changed the password',
  'user.invite': 'Invited a user',
  'user.invite-resend': 'Sent an invitation again',
  'user.join': 'Joined the organisation',
  'user.update': 'Changed a user',
  'user.deactivate': 'Deactivated a user',
  'user.reactivate': 'Reactivated a user',
};

/** Actions without a label of their own ("filing.create") read as "Filing: create". */
function actionLabel(action: string): string {
  if (ACTION_LABELS[action]) return ACTION_LABELS[action];
  const [noun = action, ...rest] = action.split('.');
  const what = rest.join(' ').replace(/[-_]/g, ' ');
  return `${noun.charAt(0).toUpperCase()}${noun.slice(1)}${what ? `: ${what}` : ''}`;
}

function describe(entry: AuditEntry): string {
  const d = (entry.details ?? {}) as Record<string, unknown>;
  const parts: string[] = [];
  if (typeof d.name === 'string') parts.push(d.name);
  if (typeof d.email === 'string') parts.push(d.email);
  if (Array.isArray(d.roles)) parts.push(`roles: ${d.roles.join(', ')}`);
  if (typeof d.active === 'boolean') parts.push(d.active ? 'active' : 'inactive');
  if (!parts.length && entry.targetType) parts.push(`${entry.targetType} #${entry.targetId}`);
  return parts.join(' · ');
}

export function ActivityScreen() {
  return (
    <RequireRole role="admin" title="Activity">
      <ActivityList />
    </RequireRole>
  );
}

function ActivityList() {
  const me = useCurrentUser();
  const wide = useIsWide();
  const entries = useAuditQuery();
  return (
    <Screen eyebrow={me.organisation.name} title="Activity" subtitle="Sign-ins and changes to people, newest first. Entries cannot be edited or removed." testID="activity-screen">
      <Card>
        {entries.isPending ? (
          <Loading label="Loading activity…" />
        ) : entries.isError ? (
          <LoadFailed what="the activity" error={entries.error} onRetry={() => void entries.refetch()} />
        ) : entries.data.length === 0 ? (
          <Text tone="soft">Nothing recorded yet.</Text>
        ) : (
          <View style={{ marginVertical: -space.sm }}>
            {entries.data.map((e, i) => (
              <View key={e.id} style={[styles.entry, wide && styles.entryWide, i > 0 && styles.divider]} testID="activity-entry">
                <Text variant="small" tone="muted" style={wide ? styles.when : undefined}>
                  {formatDateTime(e.at)}
                </Text>
                <View style={{ flex: 1, gap: 1 }}>
                  <Text variant="bodyStrong" tone={e.action.endsWith('failed') ? 'fail' : 'ink'}>
                    {actionLabel(e.action)}
                    <Text tone="soft">{` — ${e.actorName ?? 'unknown user'}`}</Text>
                  </Text>
                  {describe(e) ? (
                    <Text variant="small" tone="soft">
                      {describe(e)}
                    </Text>
                  ) : null}
                </View>
              </View>
            ))}
          </View>
        )}
      </Card>
    </Screen>
  );
}

const styles = StyleSheet.create({
  entry: { paddingVertical: space.sm, gap: 2 },
  entryWide: { flexDirection: 'row', gap: space.lg, alignItems: 'baseline' },
  divider: { borderTopWidth: 1, borderTopColor: palette.line },
  when: { width: 160 },
});
