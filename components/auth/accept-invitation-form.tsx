/** Joining another organisation with an existing account: the account's own password confirms it. */
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { View } from 'react-native';
import type { z } from 'zod';
import { zAcceptInvitation } from '../../constants/schemas/auth';
import { space } from '../../constants/theme';
import { useAcceptInvitationMutation } from '../../hooks/queries/password-token';
import { applyServerErrors } from '../../hooks/use-server-errors';
import { Button } from '../ui/button';
import { Notice } from '../ui/notice';
import { FormTextField } from '../ui/text-field';

type FormIn = z.input<typeof zAcceptInvitation>;

export function AcceptInvitationForm({ token, onDone }: { token: string; onDone: (email: string) => void }) {
  const accept = useAcceptInvitationMutation();
  const { control, handleSubmit, setError, formState } = useForm<FormIn>({
    resolver: zodResolver(zAcceptInvitation),
    defaultValues: { token, password: '' },
  });

  const onSubmit = handleSubmit(async (input) => {
    try {
      onDone((await accept.mutateAsync(input)).email);
    } catch (error) {
      applyServerErrors(error, setError, ['password', 'token']);
    }
  });

  const rootError = formState.errors.root?.server?.message ?? formState.errors.token?.message;
  return (
    <View style={{ gap: space.lg }} testID="accept-invitation-form">
      <FormTextField
        control={control}
        name="password"
        label="Your Fieldfile password"
        hint="The password you already sign in with; it stays as it is."
        testID="accept-invitation-password"
        autoComplete="current-password"
        secureTextEntry
        autoFocus
        onSubmitEditing={onSubmit}
      />
      {rootError ? (
        <Notice tone="error" testID="accept-invitation-error">
          {rootError}
        </Notice>
      ) : null}
      <Button label="Accept the invitation" busyLabel="Joining…" busy={formState.isSubmitting} onPress={onSubmit} testID="accept-invitation-submit" />
    </View>
  );
}
