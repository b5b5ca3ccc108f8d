import { randomBytes } from 'node:crypto';
import type { Request, Response } from 'express';
import multer from 'multer';
import type { Config } from '../config';
import type { ReceivedFile } from '../services/receive-upload';
import type { BlobStore } from '../storage/blob-store';
import { AppError, badRequest } from './errors';

const mb = (bytes: number) => `${Math.round(bytes / 1024 / 1024)} MB`;

/**
 * Streams the multipart field `files` to disk in the store's temporary folder (never into
 * memory), within the configured limits. A request over the total limit is refused from its
 * Content-Length before a byte is read.
 */
export async function receiveFiles(req: Request, res: Response, store: BlobStore, limits: Config['uploads']): Promise<ReceivedFile[]> {
  const declared = Number(req.get('content-length'));
  if (!req.get('content-length') || !Number.isFinite(declared)) {
    throw new AppError(411, 'length_required', 'Send the upload with a Content-Length header.');
  }
  if (declared > limits.maxTotalBytes) {
    throw new AppError(413, 'upload_too_large', `The upload is ${mb(declared)}; one upload may be at most ${mb(limits.maxTotalBytes)}. Send the files in several uploads.`);
  }
  const upload = multer({
    storage: multer.diskStorage({
      destination: store.tmpDir,
      filename: (_req, _file, cb) => cb(null, `${Date.now()}-${randomBytes(8).toString('hex')}.part`),
    }),
    limits: { fileSize: limits.maxFileBytes, files: limits.maxFiles, fields: 20, parts: limits.maxFiles + 20 },
  }).array('files', limits.maxFiles);

  await new Promise<void>((resolve, reject) => {
    upload(req, res, (err: unknown) => (err ? reject(translate(err, limits)) : resolve()));
  });
  const files = (req.files as Express.Multer.File[] | undefined) ?? [];
  return files.map((f) => ({ originalName: decodeName(f.originalname), tempFile: f.path }));
}

function translate(err: unknown, limits: Config['uploads']): unknown {
  if (!(err instanceof multer.MulterError)) return err;
  const which = err.field ? ` (${err.field})` : '';
  switch (err.code) {
    case 'LIMIT_FILE_SIZE':
      return new AppError(413, 'file_too_large', `A file is larger than the ${mb(limits.maxFileBytes)} limit for one file${which}. Nothing from this upload was stored.`);
    case 'LIMIT_FILE_COUNT':
    case 'LIMIT_PART_COUNT':
      return new AppError(413, 'too_many_files', `One upload may hold at most ${limits.maxFiles} files; zip them or send several uploads.`);
    case 'LIMIT_UNEXPECTED_FILE':
      return badRequest(`Send files in the multipart field "files", not "${err.field ?? '?'}".`, 'unexpected_field');
    default:
      return badRequest(`The upload could not be read: ${err.message}.`, 'bad_upload');
  }
}

/** Browsers send UTF-8 file names that busboy reads as Latin-1; undo that when it is the case. */
function decodeName(name: string): string {
  const asUtf8 = Buffer.from(name, 'latin1').toString('utf8');
  return asUtf8.includes('\uFFFD') ? name : asUtf8;
}
