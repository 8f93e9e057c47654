/** People (admin): invite, see each person's roles and state, change them. */
import { StyleSheet, View } from 'react-native';
import { space } from '../../constants/theme';
import { useCurrentUser } from '../../hooks/queries/session';
import { useUsersQuery } from '../../hooks/queries/users';
import { LoadFailed, Loading } from '../layout/query-states';
import { RequireRole } from '../layout/require-role';
import { Screen } from '../layout/screen';
import { Card } from '../ui/card';
import { Text } from '../ui/text';
import { InviteUserForm } from '../users/invite-user-form';
import { UserRow, userState } from '../users/user-row';

export function UsersScreen() {
  return (
    <RequireRole role="admin" title="People">
      <UsersList />
    </RequireRole>
  );
}

function UsersList() {
  const me = useCurrentUser();
  const users = useUsersQuery();
  const counts = (users.data ?? []).reduce<Record<string, number>>((acc, u) => {
    const label = userState(u).label;
    acc[label] = (acc[label] ?? 0) + 1;
    return acc;
  }, {});
  const summary = Object.entries(counts)
    .map(([label, n]) => `${n} ${label.toLowerCase()}`)
    .join(' · ');
  return (
    <Screen eyebrow={me.organisation.name} title="People" subtitle="Who works on your filings, and in which role." testID="users-screen">
      <Card title="Invite someone">
        <Text variant="small" tone="soft">
          They get an e-mail with a link to set their password. The link works once and expires after 7 days.
        </Text>
        <InviteUserForm />
      </Card>
      <Card
        title="Members"
        aside={
          users.data ? (
            <Text variant="small" tone="muted">
              {summary}
            </Text>
          ) : null
        }
        testID="users-list"
      >
        {users.isPending ? (
          <Loading label="Loading people…" />
        ) : users.isError ? (
          <LoadFailed what="people" error={users.error} onRetry={() => void users.refetch()} />
        ) : (
          <View style={styles.list}>
            {users.data.map((u) => (
              <UserRow key={u.id} user={u} isSelf={u.id === me.id} />
            ))}
          </View>
        )}
      </Card>
    </Screen>
  );
}

const styles = StyleSheet.create({ list: { gap: 0, marginBottom: -space.md } });
