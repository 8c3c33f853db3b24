import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { ModelError } from '../errors.js';

function reason(error: unknown): string {
  const code = (error as NodeJS.ErrnoException).code;
  if (code === 'ENOENT') return 'no such file';
  if (code === 'EACCES' || code === 'EPERM') return 'permission denied';
  if (code === 'EISDIR') return 'it is a folder, not a file';
  return (error as Error).message.split('\n')[0]!;
}

/**
 * Reads a model file's bytes and their SHA-256. The bytes are read once and both hashed and
 * handed to onnxruntime, so the hash is of exactly what runs.
 * @param path the model file
 * @throws ModelError `MODEL_UNREADABLE` (missing or unreadable) or `MODEL_EMPTY` (0 bytes)
 */
export function readModelFile(path: string): { readonly bytes: Uint8Array; readonly sha256: string } {
  let bytes: Buffer;
  try {
    bytes = readFileSync(path);
  } catch (error) {
    throw new ModelError('MODEL_UNREADABLE', `${path}: cannot read the model file (${reason(error)})`);
  }
  if (bytes.length === 0) {
    throw new ModelError('MODEL_EMPTY', `${path}: the file is empty (0 bytes); expected an ONNX model`);
  }
  return { bytes: new Uint8Array(bytes.buffer, bytes.byteOffset, bytes.length), sha256: createHash('sha256').update(bytes).digest('hex') };
}
