import type { ButtonVariant } from '@/components/ui/button';

export interface FilePickerProps {
  label: string;
  testID: string;
  /** The chooser's filter, e.g. "image/*" or "image/png,image/jpeg,application/pdf". */
  accept: string;
  /** Open the rear camera at once on a phone (photos). */
  camera?: boolean;
  onFile: (file: File) => void;
  disabled?: boolean;
  variant?: ButtonVariant;
  block?: boolean;
}
