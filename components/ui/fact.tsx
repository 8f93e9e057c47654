import { StyleSheet, View } from 'react-native';
import { palette, space } from '../../constants/theme';
import { Text } from './text';

/** A labelled value in a row of facts (device details, a package's file and size). */
export function Fact({ label, value }: { label: string; value: string }) {
  return (
    <View style={styles.fact}>
      <Text variant="small" tone="muted">
        {label}
      </Text>
      <Text variant="bodyStrong">{value}</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  fact: { minWidth: 140, gap: 2, paddingBottom: space.xs, borderBottomWidth: 1, borderBottomColor: palette.paperDeep },
});
