/** The frame of the signed-out screens: the wordmark, one card, the caution. */
import { ScrollView, StyleSheet, View } from 'react-native';
import { layout, palette, radii, shadow, space } from '../../constants/theme';
import { useIsWide } from '../../hooks/use-is-wide';
import { usePageTitle } from '../../hooks/use-page-title';
import { Wordmark } from '../brand/wordmark';
import { Text } from '../ui/text';
import { CautionNote } from './caution-note';

export function AuthShell({ title, intro, children }: { title: string; intro?: React.ReactNode; children: React.ReactNode }) {
  const wide = useIsWide();
  usePageTitle(title);
  return (
    <ScrollView style={styles.page} contentContainerStyle={[styles.content, wide && styles.contentWide]}>
      <View style={styles.column} role="main">
        <View style={styles.brand}>
          <Wordmark size={wide ? 40 : 34} />
          <Text tone="soft" style={styles.tagline}>
            The RF-exposure part of your certification filing, in one place.
          </Text>
        </View>
        <View style={[styles.card, !wide && styles.cardNarrow]}>
          <Text variant="title" accessibilityRole="header" aria-level={1}>
            {title}
          </Text>
          {typeof intro === 'string' ? <Text tone="soft">{intro}</Text> : intro}
          {children}
        </View>
        <CautionNote />
      </View>
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  page: { flex: 1, backgroundColor: palette.paper },
  content: { flexGrow: 1, justifyContent: 'center', padding: space.lg, paddingVertical: space.xxl },
  contentWide: { paddingVertical: space.xxxl },
  column: { width: '100%', maxWidth: layout.formMaxWidthPx, alignSelf: 'center', gap: space.xl },
  brand: { gap: space.sm },
  tagline: { maxWidth: 360 },
  card: { backgroundColor: palette.surface, borderRadius: radii.lg, borderWidth: 1, borderColor: palette.line, padding: space.xl, gap: space.lg, ...shadow },
  cardNarrow: { padding: space.lg },
});
