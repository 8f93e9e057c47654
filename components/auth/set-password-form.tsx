/**
 * Choosing a password from an invitation or reset link, checked with the shared schema for this
 * person (length, and not easy to guess given their e-mail and name) before anything is sent.
 */
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { View } from 'react-native';
import type { z } from 'zod';
import { useMemo } from 'react';
import { zSetPasswordFormFor } from '../../constants/schemas/auth';
import { NEW_PASSWORD_HINT } from '../../constants/schemas/password-policy';
import { space } from '../../constants/theme';
import { useSetPasswordMutation } from '../../hooks/queries/password-token';
import { applyServerErrors } from '../../hooks/use-server-errors';
import { Button } from '../ui/button';
import { Notice } from '../ui/notice';
import { FormTextField } from '../ui/text-field';

type Schema = ReturnType<typeof zSetPasswordFormFor>;
type FormIn = z.input<Schema>;
type FormOut = z.output<Schema>;

export function SetPasswordForm({
  token,
  person,
  submitLabel = 'Set password',
  onDone,
}: {
  token: string;
  /** Whose password it is: their e-mail and name count as easy guesses. */
  person: { email: string; name: string };
  submitLabel?: string;
  onDone: (email: string) => void;
}) {
  const setPassword = useSetPasswordMutation();
  const { email, name } = person;
  const schema = useMemo(() => zSetPasswordFormFor({ email, name }), [email, name]);
  const { control, handleSubmit, setError, formState } = useForm<FormIn, unknown, FormOut>({
    resolver: zodResolver(schema),
    defaultValues: { token, password: '', confirmPassword: '' },
  });

  const onSubmit = handleSubmit(async ({ token: t, password }) => {
    try {
      const result = await setPassword.mutateAsync({ token: t, password });
      onDone(result.email);
    } catch (error) {
      applyServerErrors(error, setError, ['password', 'confirmPassword', 'token']);
    }
  });

  const rootError = formState.errors.root?.server?.message ?? formState.errors.token?.message;
  return (
    <View style={{ gap: space.lg }} testID="set-password-form">
      <FormTextField control={control} name="password" label="New password" hint={NEW_PASSWORD_HINT} testID="set-password-password" autoComplete="new-password" secureTextEntry autoFocus />
      <FormTextField control={control} name="confirmPassword" label="New password again" testID="set-password-confirm" autoComplete="new-password" secureTextEntry onSubmitEditing={onSubmit} />
      {rootError ? (
        <Notice tone="error" testID="set-password-error">
          {rootError}
        </Notice>
      ) : null}
      <Button label={submitLabel} busyLabel="Saving…" busy={formState.isSubmitting} onPress={onSubmit} testID="set-password-submit" />
    </View>
  );
}
