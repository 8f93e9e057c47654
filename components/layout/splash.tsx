import { ActivityIndicator, StyleSheet, View } from 'react-native';
import { palette, space } from '../../constants/theme';
import { Mark } from '../brand/mark';
import { Text } from '../ui/text';

/** Shown while the session is checked: the mark, a spinner and what is happening. */
export function Splash({ label = 'Checking your session…' }: { label?: string }) {
  return (
    <View style={styles.page} accessibilityRole="progressbar" accessibilityLabel={label} testID="splash">
      <Mark size={44} />
      <View style={styles.row}>
        <ActivityIndicator color={palette.accent} size="small" accessibilityLabel="Loading" />
        <Text tone="muted">{label}</Text>
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  page: { flex: 1, alignItems: 'center', justifyContent: 'center', gap: space.lg, backgroundColor: palette.paper },
  row: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
});
