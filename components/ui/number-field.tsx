/**
 * A number typed in a display unit and kept in the stored (SI) unit: the form holds
 * `value = shown × scale` (e.g. MHz shown, Hz stored: scale 1e6). What the person typed is kept
 * as text until it parses, so "1427." or "-" do not jump; an unreadable entry is stored as null
 * and the shared schema says what to enter.
 */
import { useEffect, useRef, useState } from 'react';
import { InputBox, type InputBoxProps } from './input-box';

/** Decimal noise from scaling (1427.9e6 / 1e6) is trimmed to 12 significant digits. */
export const clean = (x: number) => Number(x.toPrecision(12));

export function toDisplay(value: number | null | undefined, scale: number): string {
  return typeof value === 'number' && Number.isFinite(value) ? String(clean(value / scale)) : '';
}

export function fromDisplay(text: string, scale: number): number | null {
  const trimmed = text.trim().replace(',', '.');
  if (!trimmed || !/^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(trimmed)) return null;
  return clean(Number(trimmed) * scale);
}

export function NumberField({
  value,
  onChange,
  scale = 1,
  initialText,
  ...box
}: Omit<InputBoxProps, 'value' | 'onChangeText' | 'numeric'> & {
  value: number | null | undefined;
  onChange: (value: number | null) => void;
  scale?: number;
  /** Text to show at first instead of the value (e.g. a pasted cell that is no number, so the person sees what to fix). */
  initialText?: string;
}) {
  const [text, setText] = useState(() => initialText ?? toDisplay(value, scale));
  const lastEmitted = useRef<number | null | undefined>(value);
  // A value set from outside (a draft, a reset) replaces the text; our own echo does not.
  useEffect(() => {
    if (value !== lastEmitted.current) {
      lastEmitted.current = value;
      setText(toDisplay(value, scale));
    }
  }, [value, scale]);
  return (
    <InputBox
      {...box}
      numeric
      value={text}
      onChangeText={(t) => {
        setText(t);
        const next = fromDisplay(t, scale);
        lastEmitted.current = next;
        onChange(next);
      }}
    />
  );
}
