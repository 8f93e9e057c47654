/** Web: a file input for a package .zip; hands the File over as it is (no reading into memory here). */
import { createElement, useRef } from 'react';
import { Button } from '../ui/button';

export function ZipPicker({ onPick }: { onPick: (file: Blob & { name: string }) => void }) {
  const input = useRef<HTMLInputElement | null>(null);
  return (
    <>
      {createElement('input', {
        ref: input,
        type: 'file',
        accept: '.zip,application/zip',
        'data-testid': 'verify-file-input',
        style: { display: 'none' },
        onChange: (e: { target: HTMLInputElement }) => {
          const file = e.target.files?.[0];
          if (file) onPick(file);
          e.target.value = '';
        },
      })}
      <Button label="Choose the package .zip…" variant="secondary" onPress={() => input.current?.click()} testID="verify-choose-file" style={{ alignSelf: 'flex-start' }} />
    </>
  );
}
