import 'server-only';
import formidable, { errors as formidableErrors } from 'formidable';
import fs from 'node:fs';
import { Readable } from 'node:stream';
import { finished } from 'node:stream/promises';
import type { ReadableStream as WebReadableStream } from 'node:stream/web';
import { AppError, fileStorageFault, type StorageFault } from '@/lib/http/errors';
import { uploadLimits } from './upload-limits';
import { adopt, incomingDir, storeRoot } from './upload-store';

export type ReceivedFile = { name: string; size: number; sha256: string; mimeType: string | null };

const MB = 1024 * 1024;

/** What formidable may take of one request; everything else about parsing is the same for every caller. */
type PartLimits = Pick<formidable.Options, 'maxFileSize' | 'maxTotalFileSize' | 'maxFiles' | 'maxFields' | 'maxFieldsSize' | 'allowEmptyFiles' | 'minFileSize'>;

/**
 * Streams a multipart body's file parts to the store's incoming folder with formidable (never
 * into memory), hashing each as it arrives. Every caller that takes files goes through here, so
 * none can keep a truncated part: formidable 3 reports a part as received even when writing it
 * failed (a disk that filled, or a folder that turned read-only, after its last chunk arrived),
 * so each part is written by a stream of ours and waited for. On any error every part written
 * so far is removed before the error (`describe` turns formidable's into the caller's words; a
 * full or unwritable store is told as such) is thrown. The caller adopts or removes the parts.
 */
export async function receiveParts(
  request: Request, limits: PartLimits, describe: (err: unknown) => AppError,
): Promise<{ fields: formidable.Fields; files: formidable.Files; parts: formidable.File[]; discard: () => Promise<unknown> }> {
  let uploadDir: string;
  try {
    uploadDir = incomingDir();
  } catch (err) {
    throw storageRefusal(err) ?? err;
  }
  const writes = new Map<string, fs.WriteStream>();
  const form = formidable({
    ...limits,
    uploadDir,
    hashAlgorithm: 'sha256',
    fileWriteStreamHandler: (file) => {
      const filepath = (file as unknown as { filepath: string }).filepath;
      const stream = fs.createWriteStream(filepath);
      writes.set(filepath, stream);
      return stream;
    },
  });
  const stream = Object.assign(Readable.fromWeb(request.body as WebReadableStream), {
    headers: Object.fromEntries(request.headers),
  });
  const discard = () => removeAll([...writes.keys()]);
  try {
    const [fields, files] = await form.parse(stream as never);
    await Promise.all([...writes.values()].map((w) => finished(w)));
    // formidable lists a part when its end has been read, and its write may finish later still:
    // the parts in the order they were sent, which is the order their streams were opened in.
    const sent = [...writes.keys()];
    const parts = Object.values(files).flat().filter((f): f is formidable.File => !!f)
      .sort((a, b) => sent.indexOf(a.filepath) - sent.indexOf(b.filepath));
    return { fields, files, parts, discard };
  } catch (err) {
    // Every part written so far, whole or not, goes before we answer.
    await Promise.all([...writes.values()].map((w) => finished(w.destroy()).catch(() => undefined)));
    await discard();
    // formidable stops reading at its error, leaving the request paused when a disk write failed;
    // reading the rest (and dropping it) lets the client finish sending and see our answer.
    stream.resume();
    throw storageRefusal(err) ?? describe(err);
  }
}

/**
 * Streams a multipart body to disk (receiveParts), then adopts each file into the store under
 * its SHA-256. Limits answer 413 with what the limit is; a store that is full answers 507 and
 * one that cannot be written 503. Nothing of a refused upload is kept.
 */
export async function receiveUpload(request: Request): Promise<ReceivedFile[]> {
  if (!request.body || !request.headers.get('content-type')?.startsWith('multipart/form-data')) {
    throw new AppError('invalid', 'Send the files as multipart/form-data, one part per file (field name "files").');
  }
  const limits = uploadLimits();
  const { parts, discard } = await receiveParts(request, {
    maxFileSize: limits.maxFileBytes,
    maxTotalFileSize: limits.maxTotalBytes,
    maxFiles: limits.maxFiles,
    maxFields: 20,
    allowEmptyFiles: true, // an empty file is kept and reported by the import, not refused here
    minFileSize: 0,
  }, (err) => describeRefusal(err, limits));
  if (parts.length === 0) throw new AppError('invalid', 'The upload holds no file.');
  const received: ReceivedFile[] = [];
  try {
    for (const part of parts) {
      const sha256 = String(part.hash);
      await adopt(part.filepath, sha256);
      received.push({ name: part.originalFilename || 'unnamed', size: part.size, sha256, mimeType: part.mimetype ?? null });
    }
  } catch (err) {
    // Parts already adopted stay: they are whole and named by their hash (the same bytes sent
    // again are found there), and another upload of the same bytes may be relying on them.
    await discard();
    throw storageRefusal(err) ?? err;
  }
  return received;
}

function removeAll(paths: string[]) {
  return Promise.all(paths.map((p) => fs.promises.rm(p, { force: true }).catch(() => undefined)));
}

const STORAGE_REFUSALS: Record<StorageFault, () => AppError> = {
  full: () => new AppError('storage_full',
    "The server's upload store is full: its disk has no space left, so nothing of this upload was stored. Free space on the store's disk (or ask your administrator to), then send the files again."),
  unwritable: () => new AppError('storage_unwritable',
    "The server cannot write to its upload store (its data directory is read-only or not writable), so nothing of this upload was stored. Your administrator must make the store writable; then send the files again."),
};

/** A full or unwritable store as the user is told it (the cause, with the store's path, is logged). */
export function storageRefusal(err: unknown): AppError | null {
  const fault = fileStorageFault(err);
  if (!fault) return null;
  console.error(`Upload refused: the upload store at ${storeRoot()} is ${fault === 'full' ? 'full' : 'not writable'}`, err);
  return STORAGE_REFUSALS[fault]();
}

function describeRefusal(err: unknown, limits: ReturnType<typeof uploadLimits>): AppError {
  const code = (err as { code?: number }).code;
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
