/** Web: a native <select> styled like the other inputs — compact enough for a table cell. */
import { createElement, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { fonts, layout, palette, radii, space } from '../../constants/theme';
import { FieldError } from './field-error';
import { Text } from './text';
import type { SelectFieldProps } from './select-field';

export function SelectField({ label, hideLabel, options, value, onChange, placeholder = 'Choose…', disabled, error, testID }: SelectFieldProps) {
  const [focused, setFocused] = useState(false);
  const known = options.some((o) => o.value === value);
  return (
    <View style={styles.field}>
      {hideLabel ? null : (
        <Text variant="smallStrong" tone="soft">
          {label}
        </Text>
      )}
      {createElement(
        'select',
        {
          'aria-label': label,
          'aria-invalid': !!error,
          'data-testid': testID,
          disabled,
          value: value ?? '',
          onChange: (e: { target: { value: string } }) => onChange(e.target.value),
          onFocus: () => setFocused(true),
          onBlur: () => setFocused(false),
          style: StyleSheet.flatten([styles.select, focused && styles.focused, !!error && styles.invalid, disabled && styles.readOnly]),
        },
        !known ? createElement('option', { value: value ?? '', disabled: true }, value ? `${value} (not in the list)` : placeholder) : null,
        ...options.map((o) => createElement('option', { key: o.value, value: o.value }, o.label)),
      )}
      {error ? <FieldError message={error} testID={testID ? `${testID}-error` : undefined} /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  field: { gap: space.xs, minWidth: 0 },
  select: {
    minHeight: layout.touchMinPx,
    width: '100%',
    borderWidth: 1,
    borderStyle: 'solid',
    borderColor: palette.lineStrong,
    borderRadius: radii.md,
    backgroundColor: palette.surface,
    paddingLeft: space.sm,
    paddingRight: space.sm,
    fontFamily: fonts.regular,
    fontSize: 15,
    color: palette.ink,
  } as object,
  focused: { borderColor: palette.accent, outlineColor: palette.accent } as object,
  invalid: { borderColor: palette.fail },
  readOnly: { backgroundColor: palette.paper },
});
