/**
 * Native: no file or camera package is installed yet, so attaching is done from the web app (which
 * phones open in their browser). This stub keeps the DOM input out of native bundles.
 */
import { AppText } from '@/components/ui/text';
import type { FilePickerProps } from './file-picker-types';

export function FilePicker(_props: FilePickerProps) {
  return <AppText tone="muted">Attach files from Sightfan in the phone’s browser.</AppText>;
}

export const canPickFiles = false;
