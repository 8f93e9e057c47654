import { useLocalSearchParams, useRouter } from 'expo-router';
import { View } from 'react-native';
import { space } from '../../constants/theme';
import { safeNextPath } from '../../hooks/safe-next-path';
import { SignInForm } from '../auth/sign-in-form';
import { AuthShell } from '../layout/auth-shell';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';

const first = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v);

const NOTICE_TITLES: Record<string, string> = {
  'password-set': 'Password set',
  'password-reset': 'New password saved',
  'invitation-accepted': 'Invitation accepted',
};

export function SignInScreen() {
  const params = useLocalSearchParams<{ email?: string; notice?: string; next?: string }>();
  const router = useRouter();
  const email = first(params.email) ?? '';
  const notice = first(params.notice);
  const passwordSet = notice === 'password-set' || notice === 'invitation-accepted' || notice === 'password-reset';
  const cameFromLink = !!first(params.next) && first(params.next) !== '/';
  return (
    <AuthShell title="Sign in">
      {passwordSet ? (
        <Notice tone="success" title={NOTICE_TITLES[notice ?? '']} testID="password-set-notice">
          {notice === 'invitation-accepted'
            ? `Sign in as ${email || 'yourself'} with your password.`
            : `Sign in as ${email || 'yourself'} with your new password.${notice === 'password-reset' ? ' Every other session of the account was signed out.' : ''}`}
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
