/**
 * Key handling for custom controls on the web (react-native-web passes `onKeyDown` to the
 * element; React Native's own types do not list it). Native platforms ignore it.
 */
export interface KeyEventLike {
  key: string;
  preventDefault: () => void;
}

export function keyProps(onKeyDown: (e: KeyEventLike) => void): object {
  return { onKeyDown };
}
