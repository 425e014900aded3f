import { unzipSync } from 'fflate';
import { InputError } from '../core/InputError';

/**
 * Entries of a zip archive by path, skipping macOS resource forks and folders.
 * Throws InputError naming `fileName` when the bytes are not a zip archive.
 */
export function zipEntries(fileName: string, bytes: Uint8Array): Record<string, Uint8Array> {
  let entries: Record<string, Uint8Array>;
  try {
    entries = unzipSync(bytes);
  } catch {
    throw new InputError(`${fileName}: not a readable zip archive`);
  }
  const out: Record<string, Uint8Array> = {};
  for (const [path, data] of Object.entries(entries)) {
    if (path.includes('__MACOSX/') || path.endsWith('/')) continue;
    out[path] = data;
  }
  return out;
}

/** Entry whose path equals `path` ignoring letter case, or undefined. */
export function zipEntryNoCase(entries: Record<string, Uint8Array>, path: string): Uint8Array | undefined {
  const want = path.toLowerCase();
  for (const [p, data] of Object.entries(entries)) if (p.toLowerCase() === want) return data;
  return undefined;
}
