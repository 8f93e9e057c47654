/**
 * Web: pick several files at once — the phone's own file picker, and on a wide screen also a
 * drop area for files dragged from the desktop.
 */
import { createElement, useRef, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { palette, radii, space } from '../../constants/theme';
import { Icon } from '../icons';
import { Button } from '../ui/button';
import { Text } from '../ui/text';
import type { EvidencePickerProps, PickedFile } from './evidence-picker-types';

const picked = (list: FileList | null | undefined): PickedFile[] => Array.from(list ?? []).map((f) => ({ file: f, fileName: f.name, sizeBytes: f.size }));

export function EvidencePicker({ onFiles, wide, accept, disabled }: EvidencePickerProps) {
  const input = useRef<HTMLInputElement | null>(null);
  const [over, setOver] = useState(false);
  const field = createElement('input', {
    ref: input,
    type: 'file',
    multiple: true,
    accept,
    'data-testid': 'evidence-file-input',
    style: { display: 'none' },
    onChange: (e: { target: HTMLInputElement }) => {
      onFiles(picked(e.target.files));
      e.target.value = '';
    },
  });
  const choose = (
    <Button
      label="Choose files…"
      variant="secondary"
      icon="plus"
      disabled={disabled}
      onPress={() => input.current?.click()}
      testID="evidence-choose"
      style={{ alignSelf: wide ? 'center' : 'flex-start' }}
    />
  );
  if (!wide) {
    return (
      <>
        {field}
        {choose}
      </>
    );
  }
  return createElement(
    'div',
    {
      'data-testid': 'evidence-drop',
      onDragOver: (e: DragEvent) => {
        e.preventDefault();
        if (!disabled) setOver(true);
      },
      onDragLeave: () => setOver(false),
      onDrop: (e: DragEvent) => {
        e.preventDefault();
        setOver(false);
        if (!disabled) onFiles(picked(e.dataTransfer?.files));
      },
    },
    <View style={[styles.drop, over && styles.over]}>
      {field}
      <Icon name="plus" size={20} color={over ? palette.copper : palette.inkMuted} />
      <Text variant="bodyStrong">{over ? 'Drop to upload' : 'Drag files here'}</Text>
      <Text variant="small" tone="muted">
        or
      </Text>
      {choose}
    </View>,
  );
}

const styles = StyleSheet.create({
  drop: { alignItems: 'center', gap: space.xs, padding: space.lg, borderWidth: 2, borderStyle: 'dashed', borderColor: palette.lineStrong, borderRadius: radii.md, backgroundColor: palette.paper },
  over: { borderColor: palette.copper, backgroundColor: palette.copperSoft },
});
