import { readFile, stat } from 'node:fs/promises';
import { resolve } from 'node:path';
import { limitBytes, limitExceeded, MAX_FILE_BYTES } from '../core/common/inputLimits';
import { InputError } from '../core/common/InputError';
import type { CliIo } from './command';

/**
 * Reads a file named on the command line, relative to the CLI's working directory.
 * Returns the path as given (for messages and extension dispatch) and the file's bytes.
 * Throws InputError `file not found: <path>` when it is missing, saying why it cannot be read, or
 * when it is larger than MAX_FILE_BYTES.
 */
export async function readInputFile(io: CliIo, path: string): Promise<{ name: string; bytes: Uint8Array }> {
  const full = resolve(io.cwd, path);
  try {
    const size = (await stat(full)).size;
    if (size > MAX_FILE_BYTES) throw limitExceeded(path, `the file is ${limitBytes(size)}`, `${limitBytes(MAX_FILE_BYTES)} per file`);
    const buffer = await readFile(full);
    return { name: path, bytes: new Uint8Array(buffer.buffer, buffer.byteOffset, buffer.byteLength) };
  } catch (error) {
    if (error instanceof InputError) throw error;
    const code = (error as NodeJS.ErrnoException).code;
    if (code === 'ENOENT') throw new InputError(`file not found: ${path}`);
    if (code === 'EISDIR') throw new InputError(`${path} is a folder, not a file`);
    if (code === 'EACCES' || code === 'EPERM') throw new InputError(`cannot read ${path}: permission denied`);
    throw new InputError(`cannot read ${path}: ${(error as Error).message}`);
  }
}
