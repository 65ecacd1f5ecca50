/**
 * Receiving a report's files: multer keeps them in memory (they go into
 * MariaDB, never to disk), with size limits from the environment
 * (UPLOAD_MAX_DATA_MB, default 5; UPLOAD_MAX_PDF_MB, default 25). The type of
 * each file is decided by its content, never by its name.
 */
import { createHash } from 'node:crypto';
import type { RequestHandler } from 'express';
import multer from 'multer';
import { z } from 'zod';
import { detectFileType } from '@shared/marking/read/detect-file-type';
import { HttpError } from '../../platform/errors';

const limitsSchema = z.object({
  UPLOAD_MAX_DATA_MB: z.coerce.number().positive().max(1024).default(5),
  UPLOAD_MAX_PDF_MB: z.coerce.number().positive().max(1024).default(25),
});

export interface UploadLimits {
  dataMaxBytes: number;
  pdfMaxBytes: number;
}

export function uploadLimitsFromEnv(env: NodeJS.ProcessEnv = process.env): UploadLimits {
  const parsed = limitsSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`);
    throw new Error(`Bad upload limits in environment variables: ${lines.join('; ')}`);
  }
  return { dataMaxBytes: Math.round(parsed.data.UPLOAD_MAX_DATA_MB * 1024 * 1024), pdfMaxBytes: Math.round(parsed.data.UPLOAD_MAX_PDF_MB * 1024 * 1024) };
}

const megabytes = (bytes: number) => `${Math.round((bytes / (1024 * 1024)) * 10) / 10} MB`;

/** Parses multipart fields `data` (the data file), `writeup` (a PDF) and text field `choice`. */
export function reportFiles(limits: UploadLimits): RequestHandler {
  const parse = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: Math.max(limits.dataMaxBytes, limits.pdfMaxBytes), files: 2, fields: 5, fieldSize: 64 * 1024, parts: 8 },
  }).fields([
    { name: 'data', maxCount: 1 },
    { name: 'writeup', maxCount: 1 },
  ]);
  return (req, res, next) => {
    if (!req.is('multipart/form-data')) {
      return next(new HttpError(415, 'unsupported_media_type', 'Send the report as multipart/form-data with the data file in the field "data" (and an optional PDF in "writeup").'));
    }
    parse(req, res, (err: unknown) => {
      if (!err) {
        const files = filesOf(req);
        if (files.data && files.data.size > limits.dataMaxBytes) {
          return next(new HttpError(413, 'payload_too_large', `The data file "${files.data.originalname}" is larger than the limit of ${megabytes(limits.dataMaxBytes)} (it has ${files.data.size.toLocaleString('en-GB')} bytes).`, { field: 'data' }));
        }
        if (files.writeup && files.writeup.size > limits.pdfMaxBytes) {
          return next(new HttpError(413, 'payload_too_large', `The write-up "${files.writeup.originalname}" is larger than the limit of ${megabytes(limits.pdfMaxBytes)} (it has ${files.writeup.size.toLocaleString('en-GB')} bytes).`, { field: 'writeup' }));
        }
        return next();
      }
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') {
          const limit = err.field === 'writeup' ? limits.pdfMaxBytes : limits.dataMaxBytes;
          const what = err.field === 'writeup' ? 'The write-up' : 'The data file';
          return next(new HttpError(413, 'payload_too_large', `${what} is larger than the limit of ${megabytes(limit)}.`, { field: err.field }));
        }
        if (err.code === 'LIMIT_UNEXPECTED_FILE') {
          return next(new HttpError(400, 'bad_request', `Unexpected file field "${err.field}": send the data file as "data" and the PDF write-up as "writeup", one each.`, { field: err.field }));
        }
        return next(new HttpError(400, 'bad_request', `The upload could not be read: ${err.message}.`, { field: err.field }));
      }
      return next(new HttpError(400, 'bad_request', `The upload could not be read: ${(err as Error).message}.`));
    });
  };
}

export interface ReceivedFile {
  fileName: string;
  bytes: Buffer;
  sizeBytes: number;
  sha256: string;
}

export function filesOf(req: Parameters<RequestHandler>[0]): { data?: Express.Multer.File; writeup?: Express.Multer.File } {
  const f = (req.files ?? {}) as Record<string, Express.Multer.File[] | undefined>;
  return { data: f.data?.[0], writeup: f.writeup?.[0] };
}

/** File names from browsers can carry paths or control characters; keep the last part, printable, ≤ 255. */
export function cleanFileName(name: string | undefined, fallback: string): string {
  // busboy hands us latin1-decoded bytes of a UTF-8 name
  let text = name ?? '';
  try {
    const recoded = Buffer.from(text, 'latin1').toString('utf8');
    if (!recoded.includes('\uFFFD')) text = recoded;
  } catch {
    /* keep */
  }
  const base = text.split(/[\\/]/).pop() ?? '';
  const printable = base.replace(/[\u0000-\u001f\u007f]/g, '').trim();
  return (printable || fallback).slice(0, 255);
}

export function received(file: Express.Multer.File, fallbackName: string): ReceivedFile {
  return {
    fileName: cleanFileName(file.originalname, fallbackName),
    bytes: file.buffer,
    sizeBytes: file.size,
    sha256: createHash('sha256').update(file.buffer).digest('hex'),
  };
}

/** A write-up must be a PDF by its content (it starts with %PDF-). */
export function checkWriteup(file: ReceivedFile): void {
  const head = file.bytes.subarray(0, 5).toString('latin1');
  if (head !== '%PDF-') {
    const detected = detectFileType(new Uint8Array(file.bytes.buffer, file.bytes.byteOffset, file.bytes.byteLength), file.fileName);
    throw new HttpError(422, 'bad_request', `The write-up "${file.fileName}" is not a PDF: its content is ${detected.description}. Save the write-up as PDF and upload it again.`, {
      field: 'writeup',
      reader: { code: 'not_pdf', expected: 'a PDF document (starting with %PDF-)' },
    });
  }
}
