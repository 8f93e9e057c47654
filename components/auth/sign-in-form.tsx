/**
 * E-mail and password, checked with the shared zLogin schema; server problems shown inline (a
 * 429 says when to try again). "Forgot your password?" carries the typed e-mail along.
 */
import { zodResolver } from '@hookform/resolvers/zod';
import { Link } from 'expo-router';
import { useForm, useWatch } from 'react-hook-form';
import { View } from 'react-native';
import type { z } from 'zod';
import { zLogin } from '../../constants/schemas/auth';
import { space } from '../../constants/theme';
import { useLoginMutation } from '../../hooks/queries/session';
import { applyServerErrors } from '../../hooks/use-server-errors';
import { Button } from '../ui/button';
import { Notice } from '../ui/notice';
import { FormTextField } from '../ui/text-field';
import { Text } from '../ui/text';

type LoginIn = z.input<typeof zLogin>;
type LoginOut = z.output<typeof zLogin>;

export function SignInForm({ initialEmail = '', onSignedIn, keepScreen }: { initialEmail?: string; onSignedIn?: () => void; keepScreen?: boolean }) {
  const login = useLoginMutation({ keepScreen });
  const { control, handleSubmit, setError, formState } = useForm<LoginIn, unknown, LoginOut>({
    resolver: zodResolver(zLogin),
    defaultValues: { email: initialEmail, password: '' },
  });

  const typedEmail = useWatch({ control, name: 'email' })?.trim() ?? '';

  const onSubmit = handleSubmit(async (values) => {
    try {
      await login.mutateAsync(values);
      onSignedIn?.();
    } catch (error) {
      applyServerErrors(error, setError, ['email', 'password']);
    }
  });

  const rootError = formState.errors.root?.server?.message;
  return (
    <View style={{ gap: space.lg }} testID="sign-in-form">
      <FormTextField
        control={control}
        name="email"
        label="E-mail"
        testID="sign-in-email"
        autoComplete="email"
        inputMode="email"
        keyboardType="email-address"
        autoCapitalize="none"
        autoCorrect={false}
        autoFocus={!initialEmail}
        onSubmitEditing={onSubmit}
      />
      <FormTextField
        control={control}
        name="password"
        label="Password"
        testID="sign-in-password"
        autoComplete="current-password"
        secureTextEntry
        autoFocus={!!initialEmail}
        onSubmitEditing={onSubmit}
      />
      {keepScreen ? null : (
        <Link href={{ pathname: '/forgot-password', params: typedEmail ? { email: typedEmail } : {} }} testID="forgot-password-link" style={{ alignSelf: 'flex-start', marginTop: -space.sm }}>
          <Text variant="smallStrong" tone="accent">
            Forgot your password?
          </Text>
        </Link>
      )}
      {rootError ? (
        <Notice tone="error" testID="sign-in-error">
          {rootError}
        </Notice>
      ) : null}
      <Button label="Sign in" busyLabel="Signing in…" busy={formState.isSubmitting} onPress={onSubmit} testID="sign-in-submit" />
    </View>
  );
}
