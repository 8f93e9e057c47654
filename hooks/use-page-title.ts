/** The browser tab's title for the current route: "Radios · Trailhound TH-4 · Fieldfile". */
import { useEffect } from 'react';
import { Platform } from 'react-native';

export const pageTitle = (...parts: (string | null | undefined)[]) => [...parts.filter(Boolean), 'Fieldfile'].join(' · ');

export function usePageTitle(...parts: (string | null | undefined)[]): void {
  const title = pageTitle(...parts);
  useEffect(() => {
    if (Platform.OS === 'web' && typeof document !== 'undefined') document.title = title;
  }, [title]);
}
