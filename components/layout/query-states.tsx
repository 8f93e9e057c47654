/** What a screen shows while its data loads or when it could not be fetched. */
import { ActivityIndicator, StyleSheet, View } from 'react-native';
import { palette, space } from '../../constants/theme';
import { asProblem } from '../../hooks/api-client';
import { Button } from '../ui/button';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';

export function Loading({ label = 'Loading…' }: { label?: string }) {
  return (
    <View style={styles.loading} accessibilityRole="progressbar" accessibilityLabel={label}>
      <ActivityIndicator color={palette.accent} accessibilityLabel={label} />
      <Text tone="muted">{label}</Text>
    </View>
  );
}

export function LoadFailed({ error, onRetry, what }: { error: unknown; onRetry?: () => void; what: string }) {
  const problem = asProblem(error);
  return (
    <Notice tone="error" title={`Could not load ${what}`} testID="load-failed">
      <View style={{ gap: space.sm }}>
        <Text variant="small">{problem.message}</Text>
        {onRetry ? <Button label="Try again" variant="secondary" compact onPress={onRetry} style={{ alignSelf: 'flex-start' }} /> : null}
      </View>
    </Notice>
  );
}

const styles = StyleSheet.create({
  loading: { flexDirection: 'row', alignItems: 'center', gap: space.sm, paddingVertical: space.lg },
});
