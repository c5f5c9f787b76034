import type { DownloadedFile } from './api-client';

/** Hands downloaded bytes to the browser as a file to keep (the browser's own download). */
export function saveFile({ blob, filename }: DownloadedFile): void {
  const url = URL.createObjectURL(blob);
  const link = document.createElement('a');
  link.href = url;
  link.download = filename;
  link.rel = 'noopener';
  document.body.append(link);
  link.click();
  link.remove();
  // Give the browser a moment to start reading the bytes before they are let go.
  window.setTimeout(() => URL.revokeObjectURL(url), 60_000);
}
