import { StyleSheet, View, type ViewProps } from 'react-native';
import { palette, radii, shadow, space } from '../../constants/theme';
import { Text } from './text';

/** A white surface on the paper background, with an optional heading row. */
export function Card({ title, aside, children, style, ...rest }: ViewProps & { title?: string; aside?: React.ReactNode }) {
  return (
    <View style={[styles.card, style]} {...rest}>
      {title || aside ? (
        <View style={styles.head}>
          {title ? (
            <Text variant="heading" accessibilityRole="header" style={styles.title}>
              {title}
            </Text>
          ) : null}
          {aside}
        </View>
      ) : null}
      {children}
    </View>
  );
}

const styles = StyleSheet.create({
  card: { backgroundColor: palette.surface, borderRadius: radii.lg, borderWidth: 1, borderColor: palette.line, padding: space.lg, gap: space.md, ...shadow },
  head: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', gap: space.md, flexWrap: 'wrap' },
  title: { flexShrink: 1 },
});
