/** Everything behind sign-in. Without a session: to /login, remembering where the visitor was. */
import { Redirect, Slot, useGlobalSearchParams, usePathname } from 'expo-router';
import { AppShell } from '../../components/layout/app-shell';
import { AuthShell } from '../../components/layout/auth-shell';
import { LoadFailed } from '../../components/layout/query-states';
import { Splash } from '../../components/layout/splash';
import { useSessionQuery } from '../../hooks/queries/session';

export default function AppLayout() {
  const session = useSessionQuery();
  const pathname = usePathname();
  const params = useGlobalSearchParams();

  if (session.isPending) return <Splash />;
  if (session.isError) {
    return (
      <AuthShell title="Fieldfile is not answering">
        <LoadFailed what="your session" error={session.error} onRetry={() => void session.refetch()} />
      </AuthShell>
    );
  }
  if (!session.data.user) {
    if (session.data.signedOut || pathname === '/') return <Redirect href="/login" />;
    const query = new URLSearchParams(Object.entries(params).flatMap(([k, v]) => (Array.isArray(v) ? v.map((x) => [k, x]) : v === undefined ? [] : [[k, v]]))).toString();
    const next = query ? `${pathname}?${query}` : pathname;
    return <Redirect href={{ pathname: '/login', params: { next } }} />;
  }
  return (
    <AppShell>
      <Slot />
    </AppShell>
  );
}
