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
  // The set-password screen handles a signed-in visitor itself (it may be someone else's link).
  const onSetPassword = segments[segments.length - 1] === 'set-password';

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
