/** A checkbox row with its label; the whole row is the 44 px touch target. */
import { Pressable, StyleSheet, View } from 'react-native';
import Svg, { Path } from 'react-native-svg';
import { layout, palette, radii, space } from '../../constants/theme';
import { keyProps } from './keyboard';
import { Text } from './text';

export function Checkbox({
  label,
  description,
  checked,
  onChange,
  disabled,
  testID,
}: {
  label: string;
  description?: string;
  checked: boolean;
  onChange: (checked: boolean) => void;
  disabled?: boolean;
  testID?: string;
}) {
  return (
    <Pressable
      accessibilityRole="checkbox"
      accessibilityLabel={label}
      accessibilityState={{ checked, disabled: !!disabled }}
      aria-checked={checked}
      disabled={disabled}
      onPress={() => onChange(!checked)}
      {...keyProps((e) => {
        if (e.key === ' ') {
          e.preventDefault();
          if (!disabled) onChange(!checked);
        }
      })}
      testID={testID}
      style={({ pressed }) => [styles.row, pressed && styles.pressed]}
    >
      <View style={[styles.box, checked && styles.boxOn]}>
        {checked ? (
          <Svg width={14} height={14} viewBox="0 0 24 24">
            <Path d="m5 12.5 4.5 4.5L19 7.5" stroke={palette.onInk} strokeWidth={3} fill="none" strokeLinecap="round" strokeLinejoin="round" />
          </Svg>
        ) : null}
      </View>
      <View style={styles.text}>
        <Text variant="bodyStrong">{label}</Text>
        {description ? (
          <Text variant="small" tone="muted">
            {description}
          </Text>
        ) : null}
      </View>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'flex-start', gap: space.md, minHeight: layout.touchMinPx, paddingVertical: space.sm, paddingHorizontal: space.xs, borderRadius: radii.md },
  pressed: { backgroundColor: palette.paper },
  box: {
    width: 20,
    height: 20,
    marginTop: 1,
    borderRadius: radii.sm,
    borderWidth: 1.5,
    borderColor: palette.inkMuted,
    backgroundColor: palette.surface,
    alignItems: 'center',
    justifyContent: 'center',
  },
  boxOn: { backgroundColor: palette.accent, borderColor: palette.accent },
  text: { flex: 1, gap: 1 },
});
