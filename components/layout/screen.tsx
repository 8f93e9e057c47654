/** A scrolling screen body: title block, content at a readable width, the caution at the foot. */
import { ScrollView, StyleSheet, View } from 'react-native';
import { layout, palette, space } from '../../constants/theme';
import { useIsWide } from '../../hooks/use-is-wide';
import { usePageTitle } from '../../hooks/use-page-title';
import { Text } from '../ui/text';
import { CautionNote } from './caution-note';

export function Screen({
  title,
  eyebrow,
  subtitle,
  actions,
  children,
  testID,
  pageTitle,
}: {
  title: string;
  /** The browser tab's title (before "· Fieldfile"); the heading when not given. */
  pageTitle?: string;
  eyebrow?: string;
  subtitle?: string;
  actions?: React.ReactNode;
  children: React.ReactNode;
  testID?: string;
}) {
  const wide = useIsWide();
  usePageTitle(pageTitle ?? title);
  return (
    <ScrollView style={styles.scroll} contentContainerStyle={[styles.content, wide ? styles.contentWide : styles.contentNarrow]} testID={testID}>
      <View style={styles.column}>
        <View style={styles.header}>
          <View style={styles.headings}>
            {eyebrow ? (
              <Text variant="label" tone="accent">
                {eyebrow}
              </Text>
            ) : null}
            <Text variant={wide ? 'display' : 'title'} accessibilityRole="header" aria-level={1}>
              {title}
            </Text>
            {subtitle ? <Text tone="soft">{subtitle}</Text> : null}
          </View>
          {actions ? <View style={styles.actions}>{actions}</View> : null}
        </View>
        <View style={styles.body}>{children}</View>
        <View style={styles.footer}>
          <CautionNote />
        </View>
      </View>
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  scroll: { flex: 1, backgroundColor: palette.paper },
  content: { flexGrow: 1 },
  contentWide: { paddingHorizontal: space.xxl, paddingTop: space.xxl, paddingBottom: space.xl },
  contentNarrow: { paddingHorizontal: space.lg, paddingTop: space.xl, paddingBottom: space.lg },
  column: { flex: 1, width: '100%', maxWidth: layout.contentMaxWidthPx, alignSelf: 'center', gap: space.xl },
  header: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'flex-end', justifyContent: 'space-between', gap: space.md },
  headings: { gap: space.xs, flexShrink: 1, minWidth: 240 },
  actions: { flexDirection: 'row', gap: space.sm },
  body: { gap: space.lg },
  footer: { marginTop: 'auto', paddingTop: space.lg, borderTopWidth: 1, borderTopColor: palette.line },
});
