/** A field's error under it: a warning icon and the words. */
import { StyleSheet, View } from 'react-native';
import { palette, space } from '../../constants/theme';
import { Icon } from '../icons';
import { Text } from './text';

export function FieldError({ message, testID }: { message: string; testID?: string }) {
  return (
    <View style={styles.row} testID={testID}>
      <Icon name="warning" size={14} color={palette.fail} strokeWidth={2} />
      <Text variant="small" tone="fail" style={styles.text}>
        {message}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'flex-start', gap: space.xs, paddingTop: 1 },
  text: { flex: 1 },
});
