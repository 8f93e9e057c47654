/**
 * testID lookups that work whichever jest-expo preset renders the tree: on the native preset a
 * host element carries `testID`, on the web preset react-native-web turns it into `data-testid`.
 */
import { act, screen, waitFor } from '@testing-library/react-native';
import type { ReactTestInstance } from 'react-test-renderer';

const isHostWith = (id: string) => (n: ReactTestInstance) => typeof n.type === 'string' && (n.props.testID === id || n.props['data-testid'] === id);

export function queryByTestId(id: string): ReactTestInstance | null {
  return screen.UNSAFE_root.findAll(isHostWith(id))[0] ?? null;
}

export function byTestId(id: string): ReactTestInstance {
  const found = queryByTestId(id);
  if (!found) throw new Error(`No element with testID "${id}".`);
  return found;
}

export function findByTestId(id: string, timeout = 1000): Promise<ReactTestInstance> {
  return waitFor(() => byTestId(id), { timeout });
}

/** A TextInput that cannot be typed in: `editable={false}` natively, `readOnly` on the web. */
export const isReadOnly = (input: ReactTestInstance) => input.props.editable === false || input.props.readOnly === true;

/** Presses the nearest element with an onPress handler (RNTL's press needs the native StyleSheet). */
export function press(node: ReactTestInstance): void {
  let n: ReactTestInstance | null = node;
  while (n && typeof n.props.onPress !== 'function') n = n.parent;
  if (!n) throw new Error('Nothing to press here.');
  const target = n;
  act(() => target.props.onPress({ nativeEvent: {} }));
}
