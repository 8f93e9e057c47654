import { StyleSheet, View } from 'react-native';
import { CAUTION_TEXT } from '../../constants/copy';
import { palette, space } from '../../constants/theme';
import { Icon } from '../icons';
import { Text } from '../ui/text';

/** The standing caution under every screen (DESIGN.md §7). */
export function CautionNote({ tone = 'onPaper' }: { tone?: 'onPaper' | 'onInk' }) {
  const onInk = tone === 'onInk';
  return (
    <View style={styles.row} testID="caution-note">
      <Icon name="info" size={14} color={onInk ? palette.onInkMuted : palette.inkMuted} />
      <Text variant="small" tone={onInk ? 'onInkMuted' : 'muted'} style={styles.text}>
        {CAUTION_TEXT}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', gap: space.sm, alignItems: 'flex-start' },
  text: { flex: 1, fontSize: 12, lineHeight: 17 },
});
