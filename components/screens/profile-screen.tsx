/** Profile: who you are signed in as, where, with which roles; change your password; sign out. */
import { StyleSheet, View } from 'react-native';
import { ROLE_ABILITIES } from '../../constants/copy';
import { ROLE_LABELS } from '../../constants/schemas/roles';
import { palette, space } from '../../constants/theme';
import { asProblem } from '../../hooks/api-client';
import { useCurrentUser, useLogoutMutation } from '../../hooks/queries/session';
import { ChangePasswordForm } from '../auth/change-password-form';
import { Initials } from '../layout/app-shell';
import { Screen } from '../layout/screen';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';

export function ProfileScreen() {
  const user = useCurrentUser();
  const logout = useLogoutMutation();
  return (
    <Screen title="Profile" testID="profile-screen">
      <Card>
        <View style={styles.who}>
          <Initials name={user.name} size={48} />
          <View style={{ flex: 1 }}>
            <Text variant="heading" testID="profile-name">
              {user.name}
            </Text>
            <Text variant="mono" tone="soft" testID="profile-email">
              {user.email}
            </Text>
          </View>
        </View>
        <View style={styles.facts}>
          <Fact label="Organisation" value={user.organisation.name} />
        </View>
      </Card>
      <Card title="Roles" testID="profile-roles">
        {user.roles.map((r) => (
          <View key={r} style={styles.role}>
            <Text variant="bodyStrong">{ROLE_LABELS[r]}</Text>
            <Text variant="small" tone="soft">
              {ROLE_ABILITIES[r]}
            </Text>
          </View>
        ))}
        <Text variant="small" tone="muted">
          Roles are given by your organisation’s admin.
        </Text>
      </Card>
      <Card title="Password" testID="profile-password">
        <ChangePasswordForm email={user.email} name={user.name} />
      </Card>
      {logout.isError ? <Notice tone="error">{asProblem(logout.error).message}</Notice> : null}
      <Button
        label="Sign out"
        icon="signOut"
        variant="secondary"
        busy={logout.isPending}
        busyLabel="Signing out…"
        onPress={() => logout.mutate()}
        testID="sign-out"
        style={{ alignSelf: 'flex-start' }}
      />
    </Screen>
  );
}

function Fact({ label, value }: { label: string; value: string }) {
  return (
    <View style={styles.fact}>
      <Text variant="label" tone="muted">
        {label}
      </Text>
      <Text testID={`profile-${label.toLowerCase()}`}>{value}</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  who: { flexDirection: 'row', alignItems: 'center', gap: space.md },
  facts: { borderTopWidth: 1, borderTopColor: palette.line, paddingTop: space.md, gap: space.md },
  fact: { gap: 2 },
  role: { gap: 2, paddingVertical: space.xs },
});
