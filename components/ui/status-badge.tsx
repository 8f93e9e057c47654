/** A state shown as an icon plus a word (never colour alone). */
import { StyleSheet, View } from 'react-native';
import { palette, radii, space } from '../../constants/theme';
import { Icon, type IconName } from '../icons';
import { Text } from './text';

export type BadgeTone = 'pass' | 'fail' | 'caution' | 'neutral';

const look: Record<BadgeTone, { fg: string; bg: string }> = {
  pass: { fg: palette.pass, bg: palette.passSoft },
  fail: { fg: palette.fail, bg: palette.failSoft },
  caution: { fg: palette.caution, bg: palette.cautionSoft },
  neutral: { fg: palette.inkSoft, bg: palette.paperDeep },
};

export function StatusBadge({ tone, icon, label, testID }: { tone: BadgeTone; icon: IconName; label: string; testID?: string }) {
  const l = look[tone];
  return (
    <View style={[styles.badge, { backgroundColor: l.bg }]} testID={testID}>
      <Icon name={icon} size={14} color={l.fg} strokeWidth={2} />
      <Text variant="smallStrong" style={{ color: l.fg }}>
        {label}
      </Text>
    </View>
  );
}

export function Chip({ label }: { label: string }) {
  return (
    <View style={styles.chip}>
      <Text variant="small" tone="soft">
        {label}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  badge: { flexDirection: 'row', alignItems: 'center', gap: space.xs, paddingHorizontal: space.sm, paddingVertical: space.xxs, borderRadius: radii.pill, alignSelf: 'flex-start' },
  chip: { paddingHorizontal: space.sm, paddingVertical: space.xxs, borderRadius: radii.sm, borderWidth: 1, borderColor: palette.line, backgroundColor: palette.paper },
});
