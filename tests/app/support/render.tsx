/** Renders a component with a fresh QueryClient (no retries, so failures show at once; no gc
 * timers, which would keep jest from exiting). */
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { render } from '@testing-library/react-native';
import { SafeAreaProvider } from 'react-native-safe-area-context';

export const SAFE_AREA_METRICS = { frame: { x: 0, y: 0, width: 390, height: 844 }, insets: { top: 0, left: 0, right: 0, bottom: 0 } };

export function testQueryClient(): QueryClient {
  return new QueryClient({ defaultOptions: { queries: { retry: false, gcTime: Infinity }, mutations: { retry: false, gcTime: Infinity } } });
}

export function Providers({ client, children }: { client: QueryClient; children: React.ReactNode }) {
  return (
    <SafeAreaProvider initialMetrics={SAFE_AREA_METRICS}>
      <QueryClientProvider client={client}>{children}</QueryClientProvider>
    </SafeAreaProvider>
  );
}

export function renderWithClient(ui: React.ReactElement, client = testQueryClient()) {
  return { client, ...render(<Providers client={client}>{ui}</Providers>) };
}
