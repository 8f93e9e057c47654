/** Previous / next between a filing's pages, from the first wizard step to Review and signing. */
import { useRouter } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { palette, space } from '../../constants/theme';
import { Button } from '../ui/button';
import { neighbours, PAGE_LABELS, type FilingPage } from './filing-pages';

export function StepNav({ filingId, page }: { filingId: number; page: FilingPage }) {
  const router = useRouter();
  const { prev, next } = neighbours(page);
  return (
    <View style={styles.nav} role="navigation" aria-label="Steps">
      {prev ? <Button label={`Back: ${PAGE_LABELS[prev]}`} variant="secondary" icon="chevronLeft" onPress={() => router.push(`/filings/${filingId}/${prev}`)} testID="step-prev" /> : <View />}
      {next ? (
        <Button label={`Next: ${PAGE_LABELS[next]}`} icon="chevronRight" onPress={() => router.push(`/filings/${filingId}/${next}`)} testID="step-next" />
      ) : (
        <Button label="Back to the overview" variant="secondary" onPress={() => router.push(`/filings/${filingId}`)} testID="step-done" />
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  nav: { flexDirection: 'row', justifyContent: 'space-between', flexWrap: 'wrap', gap: space.sm, paddingTop: space.md, borderTopWidth: 1, borderTopColor: palette.line },
});
