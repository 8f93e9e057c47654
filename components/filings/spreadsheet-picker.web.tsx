/** Web: a file input for a lab's CSV or XLSX; the file itself goes to the import. */
import { createElement, useRef } from 'react';
import { Button } from '../ui/button';

export function SpreadsheetPicker({ onPick, label = 'Choose a CSV or XLSX file…' }: { onPick: (file: File) => void; label?: string }) {
  const input = useRef<HTMLInputElement | null>(null);
  return (
    <>
      {createElement('input', {
        ref: input,
        type: 'file',
        accept: '.csv,.txt,.xlsx,text/csv,application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
        'data-testid': 'lab-import-file-input',
        style: { display: 'none' },
        onChange: (e: { target: HTMLInputElement }) => {
          const file = e.target.files?.[0];
          if (file) onPick(file);
          e.target.value = '';
        },
      })}
      <Button label={label} variant="secondary" icon="plus" onPress={() => input.current?.click()} testID="lab-import-choose" style={{ alignSelf: 'flex-start' }} />
    </>
  );
}
