/** Root: fonts shipped in assets/fonts, the query client, safe areas, then the route. */
import { QueryClientProvider } from '@tanstack/react-query';
import { useFonts } from 'expo-font';
import { Slot } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { SafeAreaProvider } from 'react-native-safe-area-context';
import { Splash } from '../components/layout/splash';
import { fonts } from '../constants/theme';
import { createQueryClient } from '../hooks/queries/query-client';

export { ErrorScreen as ErrorBoundary } from '../components/layout/error-screen';

const FONT_FILES = {
  [fonts.regular]: require('../assets/fonts/IBMPlexSans_400Regular.ttf'),
  [fonts.medium]: require('../assets/fonts/IBMPlexSans_500Medium.ttf'),
  [fonts.semibold]: require('../assets/fonts/IBMPlexSans_600SemiBold.ttf'),
  [fonts.bold]: require('../assets/fonts/IBMPlexSans_700Bold.ttf'),
  [fonts.mono]: require('../assets/fonts/IBMPlexMono_400Regular.ttf'),
  [fonts.monoMedium]: require('../assets/fonts/IBMPlexMono_500Medium.ttf'),
};

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
