/** A stored value shown as plain text where it cannot be changed: never a greyed-out, cut-off input. */
import { StyleSheet, View } from 'react-native';
import { space } from '../../constants/theme';
import { Text } from './text';

export function ReadValue({ label, hideLabel, value, unit, numeric, testID }: { label: string; hideLabel?: boolean; value: string; unit?: string; numeric?: boolean; testID?: string }) {
  const shown = value === '' ? '—' : unit ? `${value} ${unit}` : value;
  return (
    <View style={styles.field}>
      {hideLabel ? null : (
        <Text variant="smallStrong" tone="soft">
          {label}
        </Text>
      )}
      <Text variant={numeric ? 'figure' : 'body'} style={[styles.value, numeric && !hideLabel && styles.left]} testID={testID} accessibilityLabel={hideLabel ? `${label}: ${shown}` : undefined}>
        {shown}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  field: { gap: space.xxs, minWidth: 0, paddingVertical: space.xs },
  value: { minHeight: 22 },
  left: { textAlign: 'left' },
});
