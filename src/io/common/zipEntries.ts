import { Inflate } from 'fflate';
import { limitBytes, limitExceeded, limitNumber, MAX_ZIP_ENTRY_BYTES, MAX_ZIP_TOTAL_BYTES } from '../../core/common/inputLimits';
import { InputError } from '../../core/common/InputError';

/** One file of a zip archive as its central directory describes it. */
interface ZipEntry {
  path: string;
  method: number;
  flags: number;
  compressedSize: number;
  size: number;
  /** Offset of the entry's local header. */
  localOffset: number;
}

const EOCD = 0x06054b50;
const EOCD64_LOCATOR = 0x07064b50;
const EOCD64 = 0x06064b50;
const CENTRAL = 0x02014b50;
const LOCAL = 0x04034b50;
const U32_MAX = 0xffffffff;
/** Compressed bytes handed to the inflater at a time: deflate expands at most ~1 032 times, so a check between pushes overshoots a cap by at most ~16 MiB. */
const CHUNK = 16 * 1024;

function damaged(fileName: string, why: string): InputError {
  return new InputError(`${fileName}: not a readable zip archive (${why})`);
}

/** Sizes and offset from a zip64 extended-information extra field (APPNOTE 6.3.10 §4.5.3), where the 32-bit ones say 0xFFFFFFFF. */
function zip64Fields(view: DataView, from: number, to: number, e: ZipEntry): void {
  for (let at = from; at + 4 <= to; ) {
    const id = view.getUint16(at, true);
    const len = view.getUint16(at + 2, true);
    if (id === 1) {
      let p = at + 4;
      const next = () => {
        if (p + 8 > at + 4 + len) return null;
        const v = Number(view.getBigUint64(p, true));
        p += 8;
        return v;
      };
      if (e.size === U32_MAX) e.size = next() ?? e.size;
      if (e.compressedSize === U32_MAX) e.compressedSize = next() ?? e.compressedSize;
      if (e.localOffset === U32_MAX) e.localOffset = next() ?? e.localOffset;
      return;
    }
    at += 4 + len;
  }
}

/** The central directory of a zip archive (PKWARE APPNOTE 6.3.10 §4.3.12–4.3.16), zip64 included. */
function zipDirectory(fileName: string, bytes: Uint8Array): ZipEntry[] {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  let end = -1;
  for (let at = bytes.length - 22; at >= 0 && at >= bytes.length - 22 - 65535; at--) {
    if (view.getUint32(at, true) === EOCD) {
      end = at;
      break;
    }
  }
  if (end < 0) throw damaged(fileName, 'no end-of-archive record');
  let count = view.getUint16(end + 10, true);
  let offset = view.getUint32(end + 16, true);
  if (end >= 20 && view.getUint32(end - 20, true) === EOCD64_LOCATOR) {
    const at = Number(view.getBigUint64(end - 12, true));
    if (at + 56 > bytes.length || view.getUint32(at, true) !== EOCD64) throw damaged(fileName, 'the zip64 end record is missing');
    count = Number(view.getBigUint64(at + 32, true));
    offset = Number(view.getBigUint64(at + 48, true));
  }
  // Each central record takes at least 46 bytes, so a count the file cannot hold is a damaged header.
  if (count * 46 > bytes.length) throw damaged(fileName, `it claims ${limitNumber(count)} entries`);
  const entries: ZipEntry[] = [];
  let at = offset;
  for (let i = 0; i < count; i++) {
    if (at + 46 > bytes.length || view.getUint32(at, true) !== CENTRAL) throw damaged(fileName, `entry ${i + 1} of its directory is missing`);
    const nameLen = view.getUint16(at + 28, true);
    const extraLen = view.getUint16(at + 30, true);
    const commentLen = view.getUint16(at + 32, true);
    if (at + 46 + nameLen + extraLen + commentLen > bytes.length) throw damaged(fileName, `entry ${i + 1} of its directory runs past the end`);
    const flags = view.getUint16(at + 8, true);
    const nameBytes = bytes.subarray(at + 46, at + 46 + nameLen);
    // Bit 11: UTF-8 names; others are CP437, which agrees with Latin-1 for the ASCII names shapefiles use.
    const path = flags & 0x800 ? new TextDecoder().decode(nameBytes) : String.fromCharCode(...nameBytes);
    const e: ZipEntry = {
      path,
      method: view.getUint16(at + 10, true),
      flags,
      compressedSize: view.getUint32(at + 20, true),
      size: view.getUint32(at + 24, true),
      localOffset: view.getUint32(at + 42, true),
    };
    zip64Fields(view, at + 46 + nameLen, at + 46 + nameLen + extraLen, e);
    entries.push(e);
    at += 46 + nameLen + extraLen + commentLen;
  }
  return entries;
}

/** Inflates one entry, refusing it as soon as it passes its declared size (a tampered size field) or the cap. */
function entryBytes(fileName: string, bytes: Uint8Array, e: ZipEntry): Uint8Array {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const at = e.localOffset;
  if (at + 30 > bytes.length || view.getUint32(at, true) !== LOCAL) throw damaged(fileName, `the data of ${e.path} is missing`);
  const start = at + 30 + view.getUint16(at + 26, true) + view.getUint16(at + 28, true);
  const stop = start + e.compressedSize;
  if (stop > bytes.length) throw damaged(fileName, `${e.path} runs past the end of the file`);
  const data = bytes.subarray(start, stop);
  if (e.flags & 1) throw new InputError(`${fileName}: ${e.path} is encrypted; save the archive without a password`);
  if (e.method === 0) {
    if (e.compressedSize !== e.size) throw damaged(fileName, `${e.path} is stored with two different sizes`);
    return data.slice();
  }
  if (e.method !== 8) throw new InputError(`${fileName}: ${e.path} uses zip compression method ${e.method}; save the archive with ordinary (deflate) compression`);
  const out = new Uint8Array(e.size);
  let filled = 0;
  let ended = false;
  const inflater = new Inflate((chunk, final) => {
    if (filled + chunk.length > out.length) {
      throw damaged(fileName, `${e.path} inflates to more than the ${limitNumber(e.size)} bytes its header states`);
    }
    out.set(chunk, filled);
    filled += chunk.length;
    if (final) ended = true;
  });
  try {
    for (let p = 0; p < data.length && !ended; p += CHUNK) inflater.push(data.subarray(p, Math.min(p + CHUNK, data.length)), p + CHUNK >= data.length);
    if (data.length === 0) inflater.push(new Uint8Array(0), true);
  } catch (error) {
    if (error instanceof InputError) throw error;
    throw damaged(fileName, `${e.path} is corrupt: ${(error as Error).message}`);
  }
  if (filled !== e.size) throw damaged(fileName, `${e.path} inflates to ${limitNumber(filled)} bytes, not the ${limitNumber(e.size)} its header states`);
  return out;
}

function isSkipped(path: string): boolean {
  return path.includes('__MACOSX/') || path.endsWith('/');
}

/** Paths of the files in a zip archive (folders and macOS resource forks left out), without inflating any. */
export function zipEntryPaths(fileName: string, bytes: Uint8Array): string[] {
  return zipDirectory(fileName, bytes)
    .map((e) => e.path)
    .filter((p) => !isSkipped(p));
}

/**
 * Entries of a zip archive by path, skipping macOS resource forks and folders; with `wanted`, only
 * the paths it accepts are inflated. Sizes are checked before inflating: an entry declaring more
 * than {@link MAX_ZIP_ENTRY_BYTES}, or wanted entries declaring more than
 * {@link MAX_ZIP_TOTAL_BYTES} together, are refused at once, and an entry that inflates past the
 * size its header declares (a tampered size field) is refused as soon as it does.
 * Format: PKWARE APPNOTE 6.3.10 (central directory, zip64 extra field; stored and deflate entries).
 * Throws InputError naming `fileName` (and the entry) for bytes that are not a readable zip
 * archive, an encrypted entry, an unknown compression method or a limit reached.
 */
export function zipEntries(fileName: string, bytes: Uint8Array, wanted?: (path: string) => boolean): Record<string, Uint8Array> {
  const chosen = zipDirectory(fileName, bytes).filter((e) => !isSkipped(e.path) && (!wanted || wanted(e.path)));
  let total = 0;
  for (const e of chosen) {
    if (e.size > MAX_ZIP_ENTRY_BYTES) throw limitExceeded(`${fileName}: ${e.path}`, `inflates to ${limitBytes(e.size)}`, `${limitBytes(MAX_ZIP_ENTRY_BYTES)} per file in an archive`);
    total += e.size;
  }
  if (total > MAX_ZIP_TOTAL_BYTES) throw limitExceeded(fileName, `the files read from it inflate to ${limitBytes(total)}`, `${limitBytes(MAX_ZIP_TOTAL_BYTES)} per archive`);
  const out: Record<string, Uint8Array> = {};
  for (const e of chosen) out[e.path] = entryBytes(fileName, bytes, e);
  return out;
}

/** Entry whose path equals `path` ignoring letter case, or undefined. */
export function zipEntryNoCase(entries: Record<string, Uint8Array>, path: string): Uint8Array | undefined {
  const want = path.toLowerCase();
  for (const [p, data] of Object.entries(entries)) if (p.toLowerCase() === want) return data;
  return undefined;
}
