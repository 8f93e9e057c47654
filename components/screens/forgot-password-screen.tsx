/**
 * "Forgot your password?": asks for the address, then says what happens next in the same words
 * whether or not an account uses it (the server never tells).
 */
import { Link, useLocalSearchParams } from 'expo-router';
import { useState } from 'react';
import { View } from 'react-native';
import { space } from '../../constants/theme';
import { ForgotPasswordForm } from '../auth/forgot-password-form';
import { AuthShell } from '../layout/auth-shell';
import { Button } from '../ui/button';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';

const first = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v);

export function ForgotPasswordScreen() {
  const params = useLocalSearchParams<{ email?: string }>();
  const [sent, setSent] = useState<{ email: string; message: string } | null>(null);
  const email = sent?.email ?? first(params.email) ?? '';
  return (
    <AuthShell title="Forgot your password?" intro={sent ? undefined : 'We will mail you a link to choose a new one. Choosing it signs you out on every other device.'}>
      {sent ? (
        <View style={{ gap: space.md }}>
          <Notice tone="success" title={`Check the mail of ${sent.email}`} testID="forgot-password-sent">
            {sent.message}
          </Notice>
          <Button label="Use another address" variant="secondary" compact onPress={() => setSent(null)} testID="forgot-password-again" style={{ alignSelf: 'flex-start' }} />
        </View>
      ) : (
        <ForgotPasswordForm initialEmail={email} onSent={(e, message) => setSent({ email: e, message })} />
      )}
      <Link href={{ pathname: '/login', params: email ? { email } : {} }} style={{ alignSelf: 'flex-start' }} testID="forgot-password-back">
        <Text variant="smallStrong" tone="accent">
          Back to sign in
        </Text>
      </Link>
    </AuthShell>
  );
}
