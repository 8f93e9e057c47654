/** Buttons: at least 44 px tall, a visible pressed and busy state, one primary per view. */
import { ActivityIndicator, Pressable, StyleSheet, View, type PressableProps, type StyleProp, type ViewStyle } from 'react-native';
import { layout, palette, radii, space, type as typeScale } from '../../constants/theme';
import { Icon, type IconName } from '../icons';
import { Text } from './text';

type Variant = 'primary' | 'secondary' | 'danger' | 'quiet';

const look: Record<Variant, { bg: string; bgPressed: string; fg: string; border: string }> = {
  primary: { bg: palette.accent, bgPressed: palette.accentStrong, fg: palette.onInk, border: palette.accent },
  secondary: { bg: palette.surface, bgPressed: palette.paperDeep, fg: palette.ink, border: palette.lineStrong },
  danger: { bg: palette.fail, bgPressed: '#8A2F28', fg: '#FFFFFF', border: palette.fail },
  quiet: { bg: 'transparent', bgPressed: palette.paperDeep, fg: palette.ink, border: 'transparent' },
};

export interface ButtonProps extends Omit<PressableProps, 'style' | 'children'> {
  label: string;
  variant?: Variant;
  icon?: IconName;
  busy?: boolean;
  busyLabel?: string;
  compact?: boolean;
  style?: StyleProp<ViewStyle>;
}

export function Button({ label, variant = 'primary', icon, busy, busyLabel, compact, disabled, style, ...rest }: ButtonProps) {
  const l = look[variant];
  const inactive = disabled || busy;
  return (
    <Pressable
      accessibilityRole="button"
      accessibilityLabel={label}
      accessibilityState={{ disabled: !!inactive, busy: !!busy }}
      disabled={inactive}
      style={({ pressed }) => [styles.base, compact && styles.compact, { backgroundColor: pressed ? l.bgPressed : l.bg, borderColor: l.border, opacity: disabled && !busy ? 0.5 : 1 }, style]}
      {...rest}
    >
      <View style={styles.inner}>
        {busy ? <ActivityIndicator size="small" color={l.fg} accessibilityLabel={busyLabel ?? label} /> : icon ? <Icon name={icon} size={18} color={l.fg} /> : null}
        <Text variant="bodyStrong" style={{ color: l.fg }}>
          {busy && busyLabel ? busyLabel : label}
        </Text>
      </View>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  base: {
    minHeight: layout.touchMinPx,
    paddingHorizontal: space.lg,
    borderRadius: radii.md,
    borderWidth: 1,
    justifyContent: 'center',
    alignItems: 'center',
  },
  compact: { paddingHorizontal: space.md },
  inner: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  label: typeScale.bodyStrong,
});
