/** A message in a band: an icon and words, never colour alone. Errors are announced. */
import { StyleSheet, View, type StyleProp, type ViewStyle } from 'react-native';
import { palette, radii, space } from '../../constants/theme';
import { Icon, type IconName } from '../icons';
import { Text } from './text';

type Tone = 'info' | 'success' | 'error' | 'caution';

const look: Record<Tone, { icon: IconName; fg: string; bg: string; border: string }> = {
  info: { icon: 'info', fg: palette.ink, bg: palette.surface, border: palette.line },
  success: { icon: 'check', fg: palette.pass, bg: palette.passSoft, border: '#BFD8CA' },
  error: { icon: 'warning', fg: palette.fail, bg: palette.failSoft, border: '#E6C1BD' },
  caution: { icon: 'warning', fg: palette.caution, bg: palette.cautionSoft, border: '#E5D3A6' },
};

export function Notice({ tone = 'info', title, children, testID, style }: { tone?: Tone; title?: string; children?: React.ReactNode; testID?: string; style?: StyleProp<ViewStyle> }) {
  const l = look[tone];
  return (
    <View
      testID={testID}
      accessibilityRole={tone === 'error' ? 'alert' : undefined}
      accessibilityLiveRegion={tone === 'error' ? 'assertive' : 'polite'}
      style={[styles.box, { backgroundColor: l.bg, borderColor: l.border }, style]}
    >
      <View style={styles.icon}>
        <Icon name={l.icon} size={18} color={l.fg} />
      </View>
      <View style={styles.body}>
        {title ? (
          <Text variant="bodyStrong" style={{ color: l.fg }}>
            {title}
          </Text>
        ) : null}
        {typeof children === 'string' ? (
          <Text variant="small" tone="ink">
            {children}
          </Text>
        ) : (
          children
        )}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  box: { flexDirection: 'row', gap: space.sm, padding: space.md, borderRadius: radii.md, borderWidth: 1 },
  icon: { paddingTop: 2 },
  body: { flex: 1, gap: space.xxs },
});
