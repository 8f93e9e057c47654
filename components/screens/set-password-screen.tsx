/**
 * Opened from an invitation or a password-reset mail (/set-password, /reset-password): says who
 * the link is for, then sets their password, or, for an existing account invited into another
 * organisation, accepts with the account's password.
 */
import { Link, useLocalSearchParams, useRouter } from 'expo-router';
import { View } from 'react-native';
import { space } from '../../constants/theme';
import { asProblem } from '../../hooks/api-client';
import { usePasswordTokenQuery } from '../../hooks/queries/password-token';
import { useLogoutMutation, useSessionQuery } from '../../hooks/queries/session';
import { AcceptInvitationForm } from '../auth/accept-invitation-form';
import { SetPasswordForm } from '../auth/set-password-form';
import { AuthShell } from '../layout/auth-shell';
import { LoadFailed, Loading } from '../layout/query-states';
import { Button } from '../ui/button';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';

export function SetPasswordScreen() {
  const params = useLocalSearchParams<{ token?: string }>();
  const token = (Array.isArray(params.token) ? params.token[0] : params.token) ?? '';
  const router = useRouter();
  const owner = usePasswordTokenQuery(token);
  const session = useSessionQuery();
  const logout = useLogoutMutation();
  const signedInAs = session.data?.user;

  const resetting = owner.data?.purpose === 'reset';
  const done = (email: string) => router.replace({ pathname: '/login', params: { email, notice: resetting ? 'password-reset' : 'password-set' } });
  const joined = (email: string) => router.replace({ pathname: '/login', params: { email, notice: 'invitation-accepted' } });
  const joining = owner.data?.existingAccount === true;

  let body: React.ReactNode;
  if (!token) {
    body = (
      <Notice tone="error" title="This link is incomplete">
        Open the link from your e-mail again, or ask for a new one.
      </Notice>
    );
  } else if (owner.isPending) {
    body = <Loading label="Checking your link…" />;
  } else if (owner.isError) {
    const problem = asProblem(owner.error);
    body =
      problem.status === 404 ? (
        <Notice tone="error" title="This link no longer works" testID="set-password-link-dead">
          {problem.message}
        </Notice>
      ) : (
        <LoadFailed what="your link" error={owner.error} onRetry={() => void owner.refetch()} />
      );
  } else if (signedInAs && signedInAs.email !== owner.data.email) {
    body = (
      <Notice tone="caution" title={`You are signed in as ${signedInAs.email}`}>
        <View style={{ gap: space.sm }}>
          <Text variant="small">Sign out first to set the password for {owner.data.email}.</Text>
          <Button label="Sign out" variant="secondary" compact busy={logout.isPending} onPress={() => logout.mutate()} style={{ alignSelf: 'flex-start' }} />
        </View>
      </Notice>
    );
  } else {
    body = (
      <>
        <View style={{ gap: space.xxs }} testID="set-password-owner">
          <Text tone="soft">{joining ? `Join ${owner.data.organisationName ?? 'the organisation'} as` : resetting ? 'A new password for' : 'This password is for'}</Text>
          <Text variant="heading">{owner.data.name}</Text>
          <Text variant="mono" tone="soft">
            {owner.data.email}
          </Text>
        </View>
        {resetting ? (
          <Text variant="small" tone="soft">
            Choosing it signs you out on every other device.
          </Text>
        ) : null}
        {joining ? (
          <AcceptInvitationForm token={token} onDone={joined} />
        ) : (
          <SetPasswordForm token={token} person={owner.data} submitLabel={resetting ? 'Save the new password' : 'Set password'} onDone={done} />
        )}
      </>
    );
  }

  return (
    <AuthShell title={joining ? 'Accept the invitation' : resetting ? 'Choose a new password' : 'Set your password'}>
      {body}
      <Link href="/login" style={{ alignSelf: 'flex-start' }}>
        <Text variant="smallStrong" tone="accent">
          Back to sign in
        </Text>
      </Link>
    </AuthShell>
  );
}
