/**
 * "Skip to …": the first keyboard stop of a page, hidden until focused (web). It moves focus to
 * the element with `targetId` (the screen's main area, or what follows a long table).
 */
import { Platform, Pressable } from 'react-native';
import { keyProps } from '../ui/keyboard';
import { Text } from '../ui/text';

export function focusById(id: string): void {
  if (Platform.OS !== 'web' || typeof document === 'undefined') return;
  const el = document.getElementById(id);
  if (!el) return;
  if (!el.hasAttribute('tabindex')) el.setAttribute('tabindex', '-1');
  el.focus();
}

export function SkipLink({ targetId = 'main-content', label = 'Skip to content', testID = 'skip-link' }: { targetId?: string; label?: string; testID?: string }) {
  if (Platform.OS !== 'web') return null;
  return (
    <Pressable
      accessibilityRole="link"
      onPress={() => focusById(targetId)}
      // react-native-web fires onPress from the keyboard only for buttons: a link takes Enter here.
      {...keyProps((e) => {
        if (e.key !== 'Enter') return;
        e.preventDefault();
        focusById(targetId);
      })}
      testID={testID}
      {...({ dataSet: { skiplink: 'true' } } as object)}
    >
      <Text variant="bodyStrong" tone="onInk">
        {label}
      </Text>
    </Pressable>
  );
}
