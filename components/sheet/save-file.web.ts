/** Web: hands a fetched file to the browser as a download with its own name (object URL + <a download>). */
export function saveFile(file: { blob: Blob; filename: string }): void {
  const url = URL.createObjectURL(file.blob);
  const a = document.createElement('a');
  a.href = url;
  a.download = file.filename;
  a.rel = 'noopener';
  document.body.appendChild(a);
  a.click();
  a.remove();
  // Give the browser a moment to start the download before the URL is released.
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

export const canSaveFiles = true;
