/** The Fieldfile wordmark: the mark beside the name, set in Atkinson Hyperlegible Next. */
import { StyleSheet, Text, View } from 'react-native';
import { fonts, palette } from '../../constants/theme';
import { Mark, type BrandTone } from './mark';

export function Wordmark({ size = 28, tone = 'onPaper' }: { size?: number; tone?: BrandTone }) {
  const ink = tone === 'onInk' ? palette.onInk : palette.ink;
  const fontSize = Math.round(size * 0.78);
  return (
    <View style={styles.row} accessibilityRole="header" accessibilityLabel="Fieldfile" testID="wordmark">
      <Mark size={size} tone={tone} />
      <Text style={[styles.word, { color: ink, fontSize, lineHeight: size }]} accessibilityElementsHidden>
        Field<Text style={{ fontFamily: fonts.regular, color: tone === 'onInk' ? palette.onInkMuted : palette.inkSoft }}>file</Text>
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center', gap: 8 },
  word: { fontFamily: fonts.semibold, letterSpacing: -0.4 },
});
