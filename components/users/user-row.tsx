/** One person in the organisation: who, roles, state; change roles or (de)activate in place. */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import type { Role } from '../../constants/schemas/roles';
import { ROLE_LABELS } from '../../constants/schemas/roles';
import { zUpdateUser, type UserDto } from '../../constants/schemas/users';
import { palette, space } from '../../constants/theme';
import { asProblem } from '../../hooks/api-client';
import { useResendInvitationMutation, useUpdateUserMutation } from '../../hooks/queries/users';
import { useIsWide } from '../../hooks/use-is-wide';
import { Button } from '../ui/button';
import { Notice } from '../ui/notice';
import { RolePicker } from '../ui/role-picker';
import { Chip, StatusBadge } from '../ui/status-badge';
import { Text } from '../ui/text';

type Mode = 'view' | 'roles' | 'confirm-deactivate';

export function userState(user: UserDto) {
  if (!user.active) return { tone: 'fail', icon: 'blocked', label: 'Deactivated' } as const;
  if (user.invitationPending) return { tone: 'caution', icon: 'pending', label: 'Invitation pending' } as const;
  return { tone: 'pass', icon: 'check', label: 'Active' } as const;
}

export function UserRow({ user, isSelf }: { user: UserDto; isSelf: boolean }) {
  const wide = useIsWide();
  const update = useUpdateUserMutation();
  const resend = useResendInvitationMutation();
  const [mode, setMode] = useState<Mode>('view');
  const [roles, setRoles] = useState<Role[]>(user.roles);
  const [rolesError, setRolesError] = useState<string | undefined>();
  const state = userState(user);
  const slug = user.email.replace(/[^a-z0-9]+/gi, '-');

  const saveRoles = () => {
    const parsed = zUpdateUser.safeParse({ roles });
    if (!parsed.success) {
      setRolesError(parsed.error.issues[0]?.message);
      return;
    }
    setRolesError(undefined);
    update.mutate({ id: user.id, changes: parsed.data }, { onSuccess: () => setMode('view') });
  };
  const setActive = (active: boolean) => update.mutate({ id: user.id, changes: { active } }, { onSuccess: () => setMode('view') });

  return (
    <View style={styles.row} testID={`user-row-${slug}`}>
      <View style={[styles.summary, wide && styles.summaryWide]}>
        <View style={styles.who}>
          <Text variant="bodyStrong">
            {user.name}
            {isSelf ? <Text tone="muted"> (you)</Text> : null}
          </Text>
          <Text variant="mono" tone="soft" numberOfLines={1}>
            {user.email}
          </Text>
        </View>
        <View style={[styles.roles, wide && styles.rolesWide]}>
          {user.roles.map((r) => (
            <Chip key={r} label={ROLE_LABELS[r]} />
          ))}
        </View>
        <View style={wide ? styles.stateWide : undefined}>
          <StatusBadge tone={state.tone} icon={state.icon} label={state.label} testID={`user-state-${slug}`} />
        </View>
      </View>

      {mode === 'view' ? (
        <View style={styles.actions}>
          <Button
            label="Change roles"
            variant="secondary"
            compact
            onPress={() => {
              setRoles(user.roles);
              setMode('roles');
            }}
            testID={`user-edit-roles-${slug}`}
          />
          {user.invitationPending && user.active ? (
            <Button label="Send invitation again" variant="quiet" compact busy={resend.isPending} onPress={() => resend.mutate(user.id)} testID={`user-resend-${slug}`} />
          ) : null}
          {isSelf ? null : user.active ? (
            <Button label="Deactivate" variant="quiet" compact onPress={() => setMode('confirm-deactivate')} testID={`user-deactivate-${slug}`} />
          ) : (
            <Button label="Reactivate" variant="quiet" compact busy={update.isPending} onPress={() => setActive(true)} testID={`user-reactivate-${slug}`} />
          )}
        </View>
      ) : null}

      {mode === 'roles' ? (
        <View style={styles.panel}>
          <RolePicker value={roles} onChange={setRoles} error={rolesError} testIDPrefix={`user-role-${slug}`} disabledRoles={isSelf ? ['admin'] : []} />
          {isSelf ? (
            <Text variant="small" tone="muted">
              You cannot remove your own admin role; another admin can.
            </Text>
          ) : null}
          <View style={styles.actions}>
            <Button label="Save roles" compact busy={update.isPending} onPress={saveRoles} testID={`user-save-roles-${slug}`} />
            <Button label="Cancel" variant="quiet" compact onPress={() => setMode('view')} />
          </View>
        </View>
      ) : null}

      {mode === 'confirm-deactivate' ? (
        <Notice tone="caution" title={`Deactivate ${user.name}?`} testID={`user-confirm-deactivate-${slug}`}>
          <View style={{ gap: space.sm }}>
            <Text variant="small">They can no longer sign in. Their past work and the audit trail stay. You can reactivate them later.</Text>
            <View style={styles.actions}>
              <Button label="Deactivate" variant="danger" compact busy={update.isPending} onPress={() => setActive(false)} testID={`user-confirm-deactivate-yes-${slug}`} />
              <Button label="Keep active" variant="secondary" compact onPress={() => setMode('view')} />
            </View>
          </View>
        </Notice>
      ) : null}

      {update.isError ? <Notice tone="error">{asProblem(update.error).message}</Notice> : null}
      {resend.isError ? <Notice tone="error">{asProblem(resend.error).message}</Notice> : null}
      {resend.data ? (
        <Notice tone={resend.data.invitation.sent ? 'info' : 'error'} testID={`user-resent-${slug}`}>
          {resend.data.invitation.sent ? `A new invitation went to ${user.email}; the earlier link no longer works.` : resend.data.invitation.error}
        </Notice>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { paddingVertical: space.md, gap: space.md, borderTopWidth: 1, borderTopColor: palette.line },
  summary: { gap: space.sm },
  summaryWide: { flexDirection: 'row', alignItems: 'center', gap: space.lg },
  who: { gap: 1, flex: 1, minWidth: 0 },
  roles: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  rolesWide: { flex: 1 },
  stateWide: { width: 170 },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  panel: { gap: space.sm, padding: space.md, borderRadius: 8, backgroundColor: palette.paper },
});
