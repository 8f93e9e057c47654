/**
 * Changing one's password from the profile: the current one, then the new one twice, checked with
 * the shared schema for this person before sending. Other sessions of the account end; this one
 * stays.
 */
import { zodResolver } from '@hookform/resolvers/zod';
import { useMemo, useState } from 'react';
import { useForm } from 'react-hook-form';
import { View } from 'react-native';
import type { z } from 'zod';
import { zChangePasswordFormFor } from '../../constants/schemas/auth';
import { NEW_PASSWORD_HINT } from '../../constants/schemas/password-policy';
import { space } from '../../constants/theme';
import { useChangePasswordMutation } from '../../hooks/queries/password-token';
import { applyServerErrors } from '../../hooks/use-server-errors';
import { Button } from '../ui/button';
import { Notice } from '../ui/notice';
import { FormTextField } from '../ui/text-field';

type Schema = ReturnType<typeof zChangePasswordFormFor>;
type FormIn = z.input<Schema>;
type FormOut = z.output<Schema>;

const EMPTY: FormIn = { currentPassword: '', newPassword: '', confirmPassword: '' };

export function ChangePasswordForm({ email, name }: { email: string; name: string }) {
  const change = useChangePasswordMutation();
  const [changed, setChanged] = useState<{ sessionsEnded: number } | null>(null);
  const schema = useMemo(() => zChangePasswordFormFor({ email, name }), [email, name]);
  const { control, handleSubmit, setError, formState, reset } = useForm<FormIn, unknown, FormOut>({
    resolver: zodResolver(schema),
    defaultValues: EMPTY,
  });

  const onSubmit = handleSubmit(async ({ currentPassword, newPassword }) => {
    setChanged(null);
    try {
      setChanged(await change.mutateAsync({ currentPassword, newPassword }));
      reset(EMPTY);
    } catch (error) {
      applyServerErrors(error, setError, ['currentPassword', 'newPassword', 'confirmPassword']);
    }
  });

  const rootError = formState.errors.root?.server?.message;
  return (
    <View style={{ gap: space.lg, maxWidth: 560 }} testID="change-password-form">
      {changed ? (
        <Notice tone="success" title="Password changed" testID="change-password-done">
          {changed.sessionsEnded === 0
            ? 'Use the new one next time you sign in.'
            : `Use the new one next time you sign in. ${changed.sessionsEnded === 1 ? 'One other session was' : `${changed.sessionsEnded} other sessions were`} signed out.`}
        </Notice>
      ) : null}
      <FormTextField control={control} name="currentPassword" label="Current password" testID="change-password-current" autoComplete="current-password" secureTextEntry />
      <FormTextField control={control} name="newPassword" label="New password" hint={NEW_PASSWORD_HINT} testID="change-password-new" autoComplete="new-password" secureTextEntry />
      <FormTextField control={control} name="confirmPassword" label="New password again" testID="change-password-confirm" autoComplete="new-password" secureTextEntry onSubmitEditing={onSubmit} />
      {rootError ? (
        <Notice tone="error" testID="change-password-error">
          {rootError}
        </Notice>
      ) : null}
      <Button label="Change password" variant="secondary" busyLabel="Saving…" busy={formState.isSubmitting} onPress={onSubmit} testID="change-password-submit" style={{ alignSelf: 'flex-start' }} />
    </View>
  );
}
