/** Invite someone: name, e-mail and roles (shared zCreateUser); the server mails the link. */
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import type { z } from 'zod';
import { zCreateUser } from '../../constants/schemas/users';
import { space } from '../../constants/theme';
import { useInviteUserMutation, type InviteResult } from '../../hooks/queries/users';
import { useIsWide } from '../../hooks/use-is-wide';
import { applyServerErrors } from '../../hooks/use-server-errors';
import { Button } from '../ui/button';
import { Notice } from '../ui/notice';
import { RolePicker } from '../ui/role-picker';
import { Text } from '../ui/text';
import { FormTextField } from '../ui/text-field';

type FormIn = z.input<typeof zCreateUser>;
type FormOut = z.output<typeof zCreateUser>;

const EMPTY: FormIn = { name: '', email: '', roles: [] };

export function InviteUserForm({ onInvited }: { onInvited?: (result: InviteResult) => void }) {
  const wide = useIsWide();
  const invite = useInviteUserMutation();
  const [last, setLast] = useState<InviteResult | null>(null);
  const { control, handleSubmit, setError, reset, formState } = useForm<FormIn, unknown, FormOut>({
    resolver: zodResolver(zCreateUser),
    defaultValues: EMPTY,
  });

  const onSubmit = handleSubmit(async (values) => {
    setLast(null);
    try {
      const result = await invite.mutateAsync(values);
      setLast(result);
      reset(EMPTY);
      onInvited?.(result);
    } catch (error) {
      applyServerErrors(error, setError, ['name', 'email', 'roles']);
    }
  });

  const rootError = formState.errors.root?.server?.message;
  return (
    <View style={{ gap: space.lg }} testID="invite-form">
      <View style={[styles.fields, wide && styles.fieldsWide]}>
        <View style={styles.field}>
          <FormTextField control={control} name="name" label="Name" testID="invite-name" autoComplete="off" onSubmitEditing={() => void onSubmit()} />
        </View>
        <View style={styles.field}>
          <FormTextField
            control={control}
            name="email"
            label="E-mail"
            testID="invite-email"
            inputMode="email"
            keyboardType="email-address"
            autoCapitalize="none"
            autoCorrect={false}
            autoComplete="off"
            onSubmitEditing={() => void onSubmit()}
          />
        </View>
      </View>
      <View style={{ gap: space.xs }}>
        <Text variant="smallStrong" tone="soft">
          Roles
        </Text>
        <Controller
          control={control}
          name="roles"
          render={({ field, fieldState }) => <RolePicker value={field.value} onChange={field.onChange} error={fieldState.error?.message} testIDPrefix="invite-role" />}
        />
      </View>
      {rootError ? (
        <Notice tone="error" testID="invite-error">
          {rootError}
        </Notice>
      ) : null}
      {last ? (
        last.invitation.sent ? (
          <Notice tone="success" title="Invitation sent" testID="invite-sent">
            {`${last.user.name} (${last.user.email}) has a link to set a password. The mail is under Sent mail.`}
          </Notice>
        ) : (
          <Notice tone="caution" title={`${last.user.name} was added, but no invitation went out`} testID="invite-not-sent">
            {last.invitation.error ?? 'The invitation mail could not be sent.'}
          </Notice>
        )
      ) : null}
      <Button
        label="Send invitation"
        icon="outbox"
        busyLabel="Sending…"
        busy={formState.isSubmitting}
        onPress={onSubmit}
        testID="invite-submit"
        style={{ alignSelf: wide ? 'flex-start' : 'stretch' }}
      />
    </View>
  );
}

const styles = StyleSheet.create({
  fields: { gap: space.lg },
  fieldsWide: { flexDirection: 'row' },
  field: { flex: 1 },
});
