import { Link, usePathname } from 'expo-router';
import { AuthShell } from '../layout/auth-shell';
import { Text } from '../ui/text';

export function NotFoundScreen() {
  const pathname = usePathname();
  return (
    <AuthShell title="No such page" intro={`Fieldfile has no page at ${pathname}. It may have moved, or the link was cut short.`}>
      <Link href="/filings" testID="not-found-home">
        <Text variant="bodyStrong" tone="accent">
          Go to your filings
        </Text>
      </Link>
    </AuthShell>
  );
}
