/**
 * Web: a button that opens the browser's file chooser through a hidden `<input type="file">`. With
 * `camera`, a phone opens its rear camera straight away (`capture="environment"`); desktops ignore it
 * and show the chooser. The input is out of the tab order and hidden from assistive technology: the
 * button is the control people reach and hear.
 */
import { useRef } from 'react';
import { Button } from '@/components/ui/button';
import type { FilePickerProps } from './file-picker-types';

export function FilePicker({ label, testID, accept, camera, onFile, disabled, variant, block }: FilePickerProps) {
  const input = useRef<HTMLInputElement>(null);
  return (
    <>
      <Button label={label} testID={testID} variant={variant} block={block} disabled={disabled} onPress={() => input.current?.click()} />
      <input
        ref={input}
        type="file"
        accept={accept}
        capture={camera ? 'environment' : undefined}
        data-testid={`${testID}-input`}
        aria-hidden
        tabIndex={-1}
        style={{ display: 'none' }}
        onChange={(e) => {
          const file = e.currentTarget.files?.[0];
          // Emptied so that choosing the same file again (after a failure) fires a change again.
          e.currentTarget.value = '';
          if (file) onFile(file);
        }}
      />
    </>
  );
}

export const canPickFiles = true;
