/**
 * Pick one of a few options: chips with radio semantics, each a 44 px touch target. Keyboard as
 * a radio group: one tab stop (the chosen chip, else the first), Space picks, arrow keys move and pick.
 */
import { useRef } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { layout, palette, radii, space } from '../../constants/theme';
import { Icon } from '../icons';
import { FieldError } from './field-error';
import { keyProps } from './keyboard';
import { Text } from './text';

export interface Choice<V extends string> {
  value: V;
  label: string;
}

export function ChoiceChips<V extends string>({
  label,
  hideLabel,
  choices,
  value,
  onChange,
  disabled,
  error,
  testID,
}: {
  label: string;
  hideLabel?: boolean;
  choices: readonly Choice<V>[];
  value: V | null | undefined;
  onChange: (value: V) => void;
  disabled?: boolean;
  error?: string;
  testID?: string;
}) {
  const refs = useRef<(View | null)[]>([]);
  const tabStop = Math.max(
    0,
    choices.findIndex((c) => c.value === value),
  );
  const move = (from: number, step: number) => {
    const to = (from + step + choices.length) % choices.length;
    onChange(choices[to]!.value);
    (refs.current[to] as unknown as { focus?: () => void } | null)?.focus?.();
  };
  return (
    <View style={styles.field}>
      {hideLabel ? null : (
        <Text variant="smallStrong" tone="soft">
          {label}
        </Text>
      )}
      <View role="radiogroup" accessibilityLabel={label} style={styles.row}>
        {choices.map((c, i) => {
          const on = c.value === value;
          return (
            <Pressable
              key={c.value}
              ref={(el) => {
                refs.current[i] = el;
              }}
              tabIndex={disabled ? -1 : i === tabStop ? 0 : -1}
              {...keyProps((e) => {
                if (disabled) return;
                if (e.key === ' ') onChange(c.value);
                else if (e.key === 'ArrowRight' || e.key === 'ArrowDown') move(i, 1);
                else if (e.key === 'ArrowLeft' || e.key === 'ArrowUp') move(i, -1);
                else return;
                e.preventDefault();
              })}
              accessibilityRole="radio"
              accessibilityLabel={c.label}
              accessibilityState={{ checked: on, disabled: !!disabled }}
              aria-checked={on}
              disabled={disabled}
              onPress={() => onChange(c.value)}
              testID={testID ? `${testID}-${c.value}` : undefined}
              style={({ pressed }) => [styles.chip, on && styles.chipOn, pressed && !on && styles.pressed, disabled && !on && styles.disabled]}
            >
              {on ? <Icon name="check" size={14} color={palette.onInk} strokeWidth={2.2} /> : null}
              <Text variant="smallStrong" style={{ color: on ? palette.onInk : palette.ink }}>
                {c.label}
              </Text>
            </Pressable>
          );
        })}
      </View>
      {error ? <FieldError message={error} testID={testID ? `${testID}-error` : undefined} /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  field: { gap: space.xs },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  chip: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.xs,
    minHeight: layout.touchMinPx,
    paddingHorizontal: space.md,
    borderRadius: radii.md,
    borderWidth: 1,
    borderColor: palette.lineStrong,
    backgroundColor: palette.surface,
  },
  chipOn: { backgroundColor: palette.ink, borderColor: palette.ink },
  pressed: { backgroundColor: palette.paperDeep },
  disabled: { opacity: 0.6 },
});
