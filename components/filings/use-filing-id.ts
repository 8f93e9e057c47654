import { useLocalSearchParams } from 'expo-router';

/** The `[id]` route parameter as a number (NaN when it is not one). */
export function useFilingId(): number {
  const { id } = useLocalSearchParams<{ id: string }>();
  return Number(id);
}
