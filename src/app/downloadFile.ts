/** Starts a download of bytes or text under `name` (a temporary link; nothing leaves the computer). */
export function downloadFile(name: string, content: Uint8Array | string, type = 'application/octet-stream'): void {
  const url = URL.createObjectURL(new Blob([content as BlobPart], { type }));
  const a = document.createElement('a');
  a.href = url;
  a.download = name;
  document.body.append(a);
  a.click();
  a.remove();
  // Some browsers read the blob after click() returns: revoke a little later.
  setTimeout(() => URL.revokeObjectURL(url), 2000);
}

/** A file-name-safe, lower-case form of a site or variable name; `fallback` when nothing is left. */
export function fileSafeName(name: string, fallback: string): string {
  return name.replace(/[^\p{L}\p{N}]+/gu, '-').replace(/^-|-$/g, '').toLowerCase() || fallback;
}
