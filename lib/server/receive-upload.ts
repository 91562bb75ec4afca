import 'server-only';
import formidable, { errors as formidableErrors } from 'formidable';
import fs from 'node:fs';
import { Readable } from 'node:stream';
import type { ReadableStream as WebReadableStream } from 'node:stream/web';
import { AppError } from '@/lib/http/errors';
import { uploadLimits } from './upload-limits';
import { adopt, incomingDir } from './upload-store';

export type ReceivedFile = { name: string; size: number; sha256: string; mimeType: string | null };

const MB = 1024 * 1024;

/**
 * Streams a multipart body to disk with formidable (never into memory), hashing each part as it
 * arrives, then adopts each file into the store under its SHA-256. Limits answer 413 with what
 * the limit is; nothing of a refused upload is kept.
 */
export async function receiveUpload(request: Request): Promise<ReceivedFile[]> {
  if (!request.body || !request.headers.get('content-type')?.startsWith('multipart/form-data')) {
    throw new AppError('invalid', 'Send the files as multipart/form-data, one part per file (field name "files").');
  }
  const limits = uploadLimits();
  const form = formidable({
    uploadDir: incomingDir(),
    maxFileSize: limits.maxFileBytes,
    maxTotalFileSize: limits.maxTotalBytes,
    maxFiles: limits.maxFiles,
    maxFields: 20,
    allowEmptyFiles: true, // an empty file is kept and reported by the import, not refused here
    minFileSize: 0,
    hashAlgorithm: 'sha256',
  });
  const stream = Object.assign(Readable.fromWeb(request.body as WebReadableStream), {
    headers: Object.fromEntries(request.headers),
  });
  let files: formidable.Files;
  try {
    [, files] = await form.parse(stream as never);
  } catch (err) {
    throw describeRefusal(err, limits);
  }
  const parts = Object.values(files).flat().filter((f): f is formidable.File => !!f);
  if (parts.length === 0) throw new AppError('invalid', 'The upload holds no file.');
  const received: ReceivedFile[] = [];
  for (const part of parts) {
    const sha256 = String(part.hash);
    await adopt(part.filepath, sha256);
    received.push({ name: part.originalFilename || 'unnamed', size: part.size, sha256, mimeType: part.mimetype ?? null });
  }
  return received;
}

function describeRefusal(err: unknown, limits: ReturnType<typeof uploadLimits>): AppError {
  const code = (err as { code?: number }).code;
  // formidable deletes the partial files it wrote for the refused request.
  if (code === formidableErrors.biggerThanTotalMaxFileSize) {
    return new AppError('too_large', `The upload is larger than ${limits.maxTotalBytes / MB} MB in total. Send the files in smaller batches.`);
  }
  if (code === formidableErrors.biggerThanMaxFileSize) {
    return new AppError('too_large', `A file is larger than ${limits.maxFileBytes / MB} MB, the limit for one file.`);
  }
  if (code === formidableErrors.maxFilesExceeded) {
    return new AppError('too_large', `An upload holds at most ${limits.maxFiles} files. Send the rest in another upload, or zip them.`);
  }
  if (code === formidableErrors.aborted) return new AppError('invalid', 'The upload was interrupted before it finished. Try again.');
  if (code === formidableErrors.malformedMultipart || code === formidableErrors.missingMultipartBoundary) {
    return new AppError('invalid', 'The upload is not well-formed multipart/form-data.');
  }
  return err instanceof Error ? new AppError('invalid', `The upload could not be read: ${err.message}`) : new AppError('internal', 'Upload failed.');
}

/** Removes incoming files left behind by a crash; called when the import worker starts. */
export async function clearIncoming(olderThanMs = 60 * 60 * 1000) {
  const dir = incomingDir();
  for (const name of await fs.promises.readdir(dir)) {
    const file = `${dir}/${name}`;
    const stat = await fs.promises.stat(file).catch(() => null);
    if (stat && Date.now() - stat.mtimeMs > olderThanMs) await fs.promises.rm(file, { force: true });
  }
}
