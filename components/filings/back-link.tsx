/** A small "‹ where to go back" link for phone screens. */
import { Link } from 'expo-router';
import { Pressable, StyleSheet } from 'react-native';
import { layout, palette, space } from '../../constants/theme';
import { Icon } from '../icons';
import { Text } from '../ui/text';

export function BackLink({ href, label, testID }: { href: string; label: string; testID?: string }) {
  return (
    <Link href={href} asChild>
      <Pressable style={styles.back} accessibilityRole="link" accessibilityLabel={label} testID={testID}>
        <Icon name="chevronLeft" size={18} color={palette.accent} />
        <Text variant="smallStrong" tone="accent">
          {label}
        </Text>
      </Pressable>
    </Link>
  );
}

const styles = StyleSheet.create({
  back: { flexDirection: 'row', alignItems: 'center', gap: space.xs, minHeight: layout.touchMinPx, alignSelf: 'flex-start', marginVertical: -space.sm },
});
