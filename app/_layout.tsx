/** Root: fonts shipped in assets/fonts, the query client, safe areas, then the route. */
import { QueryClientProvider } from '@tanstack/react-query';
import { useFonts } from 'expo-font';
import { Slot } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { SafeAreaProvider } from 'react-native-safe-area-context';
import { installGlobalWebStyle } from '../components/layout/global-web-style';
import { Splash } from '../components/layout/splash';
import { fonts } from '../constants/theme';
import { createQueryClient } from '../hooks/queries/query-client';

export { ErrorScreen as ErrorBoundary } from '../components/layout/error-screen';

// WOFF2, Latin subset, only the weights the theme uses (licences beside them in assets/fonts).
const FONT_FILES = {
  [fonts.regular]: require('../assets/fonts/AtkinsonHyperlegibleNext-400.woff2'),
  [fonts.medium]: require('../assets/fonts/AtkinsonHyperlegibleNext-500.woff2'),
  [fonts.semibold]: require('../assets/fonts/AtkinsonHyperlegibleNext-600.woff2'),
  [fonts.mono]: require('../assets/fonts/AtkinsonHyperlegibleMono-400.woff2'),
};

installGlobalWebStyle();

export default function RootLayout() {
  const [queryClient] = useState(createQueryClient);
  const [fontsLoaded, fontError] = useFonts(FONT_FILES);
  return (
    <SafeAreaProvider>
      <QueryClientProvider client={queryClient}>
        {/* The router must mount on the first render, or it forgets the URL it was opened at. */}
        <Slot />
        {fontsLoaded || fontError ? null : (
          <View style={StyleSheet.absoluteFill}>
            <Splash label="Loading Fieldfile…" />
          </View>
        )}
      </QueryClientProvider>
    </SafeAreaProvider>
  );
}
