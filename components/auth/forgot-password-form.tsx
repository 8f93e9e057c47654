/** "Forgot your password?": the address to mail a reset link to, checked with the shared zForgotPassword. */
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { View } from 'react-native';
import type { z } from 'zod';
import { zForgotPassword } from '../../constants/schemas/auth';
import { space } from '../../constants/theme';
import { useForgotPasswordMutation } from '../../hooks/queries/password-token';
import { applyServerErrors } from '../../hooks/use-server-errors';
import { Button } from '../ui/button';
import { Notice } from '../ui/notice';
import { FormTextField } from '../ui/text-field';

type FormIn = z.input<typeof zForgotPassword>;
type FormOut = z.output<typeof zForgotPassword>;

export function ForgotPasswordForm({ initialEmail = '', onSent }: { initialEmail?: string; onSent: (email: string, message: string) => void }) {
  const forgot = useForgotPasswordMutation();
  const { control, handleSubmit, setError, formState } = useForm<FormIn, unknown, FormOut>({
    resolver: zodResolver(zForgotPassword),
    defaultValues: { email: initialEmail },
  });

  const onSubmit = handleSubmit(async (values) => {
    try {
      const { message } = await forgot.mutateAsync(values);
      onSent(values.email, message);
    } catch (error) {
      applyServerErrors(error, setError, ['email']);
    }
  });

  const rootError = formState.errors.root?.server?.message;
  return (
    <View style={{ gap: space.lg }} testID="forgot-password-form">
      <FormTextField
        control={control}
        name="email"
        label="E-mail"
        hint="The address you sign in with."
        testID="forgot-password-email"
        autoComplete="email"
        inputMode="email"
        keyboardType="email-address"
        autoCapitalize="none"
        autoCorrect={false}
        autoFocus
        onSubmitEditing={onSubmit}
      />
      {rootError ? (
        <Notice tone="error" testID="forgot-password-error">
          {rootError}
        </Notice>
      ) : null}
      <Button label="Send me a link" busyLabel="Sending…" busy={formState.isSubmitting} onPress={onSubmit} testID="forgot-password-submit" />
    </View>
  );
}
