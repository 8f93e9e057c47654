/**
 * A panel over the page: a bottom sheet on a phone, a centred dialog on a wide screen. Closes
 * with its button, the backdrop or Escape (web, via Modal's onRequestClose).
 */
import { Modal, Pressable, ScrollView, StyleSheet, View } from 'react-native';
import { palette, radii, space } from '../../constants/theme';
import { useIsWide } from '../../hooks/use-is-wide';
import { Icon } from '../icons';
import { Text } from './text';

/** Without `onClose` the sheet cannot be dismissed (it waits for what it asks). */
export function Sheet({
  title,
  subtitle,
  visible,
  onClose,
  children,
  testID,
}: {
  title: string;
  subtitle?: string;
  visible: boolean;
  onClose?: () => void;
  children: React.ReactNode;
  testID?: string;
}) {
  const wide = useIsWide();
  return (
    <Modal visible={visible} transparent animationType={wide ? 'fade' : 'slide'} onRequestClose={onClose ?? (() => undefined)}>
      <View style={[styles.backdrop, wide ? styles.backdropWide : styles.backdropNarrow]}>
        {onClose ? <Pressable style={StyleSheet.absoluteFill} accessibilityLabel="Close" onPress={onClose} /> : null}
        <View style={[styles.panel, wide ? styles.panelWide : styles.panelNarrow]} role="dialog" aria-modal accessibilityLabel={title} testID={testID}>
          <View style={styles.head}>
            <View style={{ flex: 1, gap: 2 }}>
              <Text variant="heading" accessibilityRole="header">
                {title}
              </Text>
              {subtitle ? (
                <Text variant="small" tone="muted">
                  {subtitle}
                </Text>
              ) : null}
            </View>
            {onClose ? (
              <Pressable
                onPress={onClose}
                accessibilityRole="button"
                accessibilityLabel="Close"
                testID={testID ? `${testID}-close` : undefined}
                style={({ pressed }) => [styles.close, pressed && { backgroundColor: palette.paperDeep }]}
              >
                <Icon name="cross" size={20} />
              </Pressable>
            ) : null}
          </View>
          <ScrollView contentContainerStyle={styles.body}>{children}</ScrollView>
        </View>
      </View>
    </Modal>
  );
}

const styles = StyleSheet.create({
  backdrop: { flex: 1, backgroundColor: 'rgba(31, 58, 77, 0.45)' },
  backdropWide: { alignItems: 'center', justifyContent: 'center', padding: space.xxl },
  backdropNarrow: { justifyContent: 'flex-end', paddingTop: space.xxl },
  panel: { backgroundColor: palette.surface, overflow: 'hidden' },
  panelWide: { width: '100%', maxWidth: 760, maxHeight: '90%', borderRadius: radii.lg },
  panelNarrow: { maxHeight: '92%', borderTopLeftRadius: radii.lg, borderTopRightRadius: radii.lg },
  head: { flexDirection: 'row', alignItems: 'flex-start', gap: space.md, padding: space.lg, borderBottomWidth: 1, borderBottomColor: palette.line },
  close: { width: 44, height: 44, alignItems: 'center', justifyContent: 'center', borderRadius: radii.md, marginTop: -space.sm, marginRight: -space.sm },
  body: { padding: space.lg, gap: space.lg },
});
