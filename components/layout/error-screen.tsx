/** The root error boundary's page: what happened, and a way back. */
import type { ErrorBoundaryProps } from 'expo-router';
import { ScrollView, StyleSheet, View } from 'react-native';
import { layout, palette, space } from '../../constants/theme';
import { Wordmark } from '../brand/wordmark';
import { Button } from '../ui/button';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';

export function ErrorScreen({ error, retry }: ErrorBoundaryProps) {
  return (
    <ScrollView style={styles.page} contentContainerStyle={styles.content}>
      <View style={styles.column}>
        <Wordmark size={32} />
        <Text variant="title" accessibilityRole="header">
          Something went wrong on this page
        </Text>
        <Notice tone="error">{error.message || 'An unexpected error.'}</Notice>
        <Text tone="soft">Nothing you saved is lost. Try again; if it keeps happening, reload the page.</Text>
        <Button label="Try again" onPress={() => void retry()} style={{ alignSelf: 'flex-start' }} />
      </View>
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  page: { flex: 1, backgroundColor: palette.paper },
  content: { flexGrow: 1, justifyContent: 'center', padding: space.xl },
  column: { width: '100%', maxWidth: layout.formMaxWidthPx, alignSelf: 'center', gap: space.lg },
});
