import { useLocalSearchParams, useRouter } from 'expo-router';
import { View } from 'react-native';
import { space } from '../../constants/theme';
import { safeNextPath } from '../../hooks/safe-next-path';
import { SignInForm } from '../auth/sign-in-form';
import { AuthShell } from '../layout/auth-shell';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';

const first = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v);

export function SignInScreen() {
  const params = useLocalSearchParams<{ email?: string; notice?: string; next?: string }>();
  const router = useRouter();
  const email = first(params.email) ?? '';
  const notice = first(params.notice);
  const passwordSet = notice === 'password-set' || notice === 'invitation-accepted';
  const cameFromLink = !!first(params.next) && first(params.next) !== '/';
  return (
    <AuthShell title="Sign in">
      {passwordSet ? (
        <Notice tone="success" title={notice === 'password-set' ? 'Password set' : 'Invitation accepted'} testID="password-set-notice">
          {notice === 'password-set' ? `Sign in as ${email || 'yourself'} with your new password.` : `Sign in as ${email || 'yourself'} with your password.`}
        </Notice>
      ) : cameFromLink ? (
        <Notice tone="info" testID="sign-in-needed-notice">
          Sign in to open that page; you will land there afterwards.
        </Notice>
      ) : null}
      <SignInForm initialEmail={email} onSignedIn={() => router.replace(safeNextPath(params.next) as never)} />
      <View style={{ gap: space.xs }}>
        <Text variant="small" tone="muted">
          New here? Your organisation’s admin sends you an invitation by e-mail with a link to set your password.
        </Text>
      </View>
    </AuthShell>
  );
}
