/** Web: a plain file input for a .json device file; its text goes to the import box. */
import { createElement, useRef } from 'react';
import { Button } from '../ui/button';

export function FilePicker({ onPick }: { onPick: (name: string, content: string) => void }) {
  const input = useRef<HTMLInputElement | null>(null);
  return (
    <>
      {createElement('input', {
        ref: input,
        type: 'file',
        accept: '.json,application/json',
        'data-testid': 'import-file-input',
        style: { display: 'none' },
        onChange: async (e: { target: HTMLInputElement }) => {
          const file = e.target.files?.[0];
          if (!file) return;
          onPick(file.name, await file.text());
          e.target.value = '';
        },
      })}
      <Button label="Choose a .json file…" variant="secondary" onPress={() => input.current?.click()} testID="import-choose-file" style={{ alignSelf: 'flex-start' }} />
    </>
  );
}
