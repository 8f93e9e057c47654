/**
 * A compact input: optional visible label (tables label their columns instead), an optional unit
 * shown inside the box, right-aligned figures, and its error underneath. 44 px tall at least.
 */
import { useState, type Ref } from 'react';
import { StyleSheet, TextInput, View, type TextInputProps } from 'react-native';
import { fonts, layout, palette, radii, space } from '../../constants/theme';
import { FieldError } from './field-error';
import { Text } from './text';

export interface InputBoxProps extends Omit<TextInputProps, 'style'> {
  /** Always the accessible name; shown above the box unless `hideLabel`. */
  label: string;
  hideLabel?: boolean;
  unit?: string;
  numeric?: boolean;
  error?: string;
  hint?: string;
  /** The form library's ref, so it can move focus to the first field in error. */
  ref?: Ref<TextInput>;
}

export function InputBox({ label, hideLabel, unit, numeric, error, hint, testID, editable = true, onFocus, onBlur, ref, ...rest }: InputBoxProps) {
  const [focused, setFocused] = useState(false);
  return (
    <View style={styles.field}>
      {hideLabel ? null : (
        <Text variant="smallStrong" tone="soft">
          {unit ? `${label} (${unit})` : label}
        </Text>
      )}
      <View style={[styles.box, focused && styles.focused, !!error && styles.invalid, !editable && styles.readOnly]}>
        <TextInput
          ref={ref}
          accessibilityLabel={unit ? `${label} (${unit})` : label}
          aria-invalid={!!error}
          placeholderTextColor={palette.inkFaint}
          testID={testID}
          editable={editable}
          inputMode={numeric ? 'decimal' : undefined}
          onFocus={(e) => {
            setFocused(true);
            onFocus?.(e);
          }}
          onBlur={(e) => {
            setFocused(false);
            onBlur?.(e);
          }}
          style={[styles.input, numeric && styles.numeric]}
          {...rest}
        />
        {unit && !hideLabel ? (
          <Text variant="small" tone="muted" style={styles.unit}>
            {unit}
          </Text>
        ) : null}
      </View>
      {error ? (
        <FieldError message={error} testID={testID ? `${testID}-error` : undefined} />
      ) : hint ? (
        <Text variant="small" tone="muted">
          {hint}
        </Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  field: { gap: space.xs, minWidth: 0 },
  box: {
    flexDirection: 'row',
    alignItems: 'center',
    minHeight: layout.touchMinPx,
    borderWidth: 1,
    borderColor: palette.lineStrong,
    borderRadius: radii.md,
    backgroundColor: palette.surface,
    paddingHorizontal: space.md,
    gap: space.xs,
  },
  input: { flex: 1, minWidth: 0, paddingVertical: space.sm, fontFamily: fonts.regular, fontSize: 15, color: palette.ink, outlineStyle: 'none' } as object,
  numeric: { textAlign: 'right', fontVariant: ['tabular-nums'] },
  unit: { flexShrink: 0 },
  focused: { borderColor: palette.accent },
  invalid: { borderColor: palette.fail },
  readOnly: { backgroundColor: palette.paper },
});
