/** Hands a file made in the page (or fetched with the session's token) to the browser's downloads. */
export function saveFile(blob: Blob, fileName: string): void {
  const url = URL.createObjectURL(blob);
  const link = document.createElement('a');
  link.href = url;
  link.download = fileName;
  link.click();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}

/** The file name a `Content-Disposition: attachment; filename="..."` header gives, or the fallback. */
export function attachmentFileName(contentDisposition: string | null, fallback: string): string {
  return /filename="([^"]+)"/.exec(contentDisposition ?? '')?.[1] ?? fallback;
}
