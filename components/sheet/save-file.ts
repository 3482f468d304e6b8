/**
 * Native: there is no file-saving package in the app yet, so the sheet opens in the system browser
 * through its URL (see SheetActions). This stub keeps the web-only code out of native bundles.
 */
export function saveFile(_file: { blob: Blob; filename: string }): void {
  // Not reached on native: SheetActions opens the sheet's URL instead.
}

export const canSaveFiles = false;
