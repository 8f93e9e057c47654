/** Signed-out screens. Someone already signed in who opens /login goes on to `next` (or home). */
import { Redirect, Slot, useGlobalSearchParams, useSegments } from 'expo-router';
import { Splash } from '../../components/layout/splash';
import { LoadFailed } from '../../components/layout/query-states';
import { AuthShell } from '../../components/layout/auth-shell';
import { useSessionQuery } from '../../hooks/queries/session';
import { safeNextPath } from '../../hooks/safe-next-path';

export default function AuthLayout() {
  const session = useSessionQuery();
  const segments = useSegments();
  const { next } = useGlobalSearchParams<{ next?: string }>();
  // The set-password and reset screens handle a signed-in visitor themselves (it may be someone else's link).
  const onSetPassword = ['set-password', 'reset-password'].includes(segments[segments.length - 1]);

  if (session.isPending) return <Splash />;
  if (session.isError && !onSetPassword) {
    return (
      <AuthShell title="Sign in">
        <LoadFailed what="your session" error={session.error} onRetry={() => void session.refetch()} />
      </AuthShell>
    );
  }
  if (session.data?.user && !session.data.justSignedIn && !onSetPassword) return <Redirect href={safeNextPath(next) as never} />;
  return <Slot />;
}
