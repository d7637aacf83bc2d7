import { randomBytes } from 'node:crypto';
import { createReadStream, type ReadStream } from 'node:fs';
import { mkdir, rename, rm, stat } from 'node:fs/promises';
import path from 'node:path';
import { pipeline } from 'node:stream/promises';
import type { Request, RequestHandler, Response } from 'express';
import { fileTypeFromFile } from 'file-type/node';
import multer from 'multer';
import { uploadFieldName } from '@lotwise/shared';
import { AppError } from './app-error';

/** What a file's content says it is (file-type reads its signature and structure). */
export interface DetectedType {
  /** e.g. `application/pdf`. */
  mime: string;
  /** The usual extension, without the dot: `pdf`, `png`, `jpg`. */
  ext: string;
}

/** The type of the file at `filePath` from its content; null when file-type knows none. */
export async function detectFileType(filePath: string): Promise<DetectedType | null> {
  const found = await fileTypeFromFile(filePath);
  return found ? { mime: found.mime, ext: found.ext } : null;
}

const typeNames: Record<string, string> = {
  'application/pdf': 'PDF',
  'image/png': 'PNG',
  'image/jpeg': 'JPEG',
  'image/webp': 'WebP',
};

/** Describes accepted types for a message: "a PDF", "a PDF, PNG or JPEG". */
export function describeTypes(types: readonly string[]): string {
  const names = types.map((type) => typeNames[type] ?? type);
  return names.length === 1
    ? `a ${names[0]}`
    : `a ${names.slice(0, -1).join(', ')} or ${names.at(-1)}`;
}

/** Extensions that name the same type as the one file-type answers. */
const sameExtension: Record<string, string[]> = { jpg: ['jpeg', 'jpe'], tif: ['tiff'] };

/**
 * The name with the extension of its detected type: kept when it already says so
 * (`scan.JPEG` for a JPEG), replaced when it names another type (`coa.pdf` holding a PNG
 * becomes `coa.png`), added when there is none. A download then opens in the right program.
 */
export function withExtension(fileName: string, ext: string): string {
  const match = /\.([A-Za-z0-9]{1,5})$/.exec(fileName);
  const current = match?.[1]?.toLowerCase();
  if (current === ext || (current && sameExtension[ext]?.includes(current))) return fileName;
  const stem = match && match.index > 0 ? fileName.slice(0, match.index) : fileName;
  return `${stem}.${ext}`;
}

/**
 * The file name a person gave, safe to keep and to send back in Content-Disposition: no
 * folders, control characters or surrounding dots/spaces, at most 200 characters (the
 * extension kept). Non-ASCII letters stay (the header encodes them).
 */
export function safeFileName(name: string | undefined, fallback: string): string {
  const base = (name ?? '').split(/[/\\]/).pop() ?? '';
  // eslint-disable-next-line no-control-regex
  let clean = base.normalize('NFC').replace(/[\u0000-\u001f\u007f-\u009f"<>:|?*]/g, '_');
  clean = clean.replace(/\s+/g, ' ').replace(/^[\s.]+|[\s.]+$/g, '');
  if (clean.length > 200) {
    const dot = clean.lastIndexOf('.');
    const ext = dot > 0 && clean.length - dot <= 10 ? clean.slice(dot) : '';
    clean = clean.slice(0, 200 - ext.length) + ext;
  }
  return clean || fallback;
}

const storedNamePattern = /^[a-f0-9]{32}\.(pdf|png|jpg|webp)$/;

function isMultipart(req: Request): boolean {
  return Boolean(req.is('multipart/form-data'));
}

function toAppError(error: unknown, maxMb: number): unknown {
  if (error instanceof multer.MulterError) {
    if (error.code === 'LIMIT_FILE_SIZE') {
      return new AppError(
        'payload_too_large',
        `The file is larger than the upload limit of ${maxMb} MB.`,
        { [uploadFieldName]: `is larger than ${maxMb} MB` },
      );
    }
    if (error.code === 'LIMIT_UNEXPECTED_FILE' || error.code === 'LIMIT_FILE_COUNT') {
      return AppError.validation(`Send one file, in the form field "${uploadFieldName}".`, {
        [error.field ?? uploadFieldName]: `is not expected: send one file as "${uploadFieldName}"`,
      });
    }
    return AppError.validation(`The upload could not be read: ${error.message}.`);
  }
  return error;
}

export interface ReceivedFile {
  /** The sanitized name the person's file had. */
  fileName: string;
  size: number;
}

/**
 * Uploaded files on disk: multer writes each upload to `<dir>/.incoming/` under a random
 * name; once its content is checked it is renamed into `<dir>/` (same file system, so the
 * move is atomic) under another random name. Nothing here is served statically.
 */
export function fileStore(options: { dir: string; maxBytes: number; maxMb: number }) {
  const incoming = path.join(options.dir, '.incoming');
  const toDiskUpTo = (maxBytes: number) =>
    multer({
      storage: multer.diskStorage({
        destination: (_req, _file, cb) => {
          mkdir(incoming, { recursive: true, mode: 0o700 }).then(
            () => cb(null, incoming),
            (error: Error) => cb(error, incoming),
          );
        },
        filename: (_req, _file, cb) => cb(null, `${randomBytes(16).toString('hex')}.part`),
      }),
      limits: { fileSize: maxBytes, files: 1, fields: 5, parts: 8 },
      defParamCharset: 'utf8',
    });
  const toDisk = toDiskUpTo(options.maxBytes);
  const toMemory = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: options.maxBytes, files: 1, fields: 5, parts: 8 },
    defParamCharset: 'utf8',
  });

  const wrap =
    (handler: RequestHandler, maxMb = options.maxMb): RequestHandler =>
    (req, res, next) => {
      handler(req, res, (error?: unknown) => next(error ? toAppError(error, maxMb) : undefined));
    };

  function pathOf(storedName: string): string {
    if (!storedNamePattern.test(storedName))
      throw new Error(`Not a stored file name: ${storedName}`);
    return path.join(options.dir, storedName);
  }

  async function discard(file: Express.Multer.File | undefined) {
    if (file?.path) await rm(file.path, { force: true });
  }

  return {
    dir: options.dir,
    /** Middleware: the file in field `file` goes to a temporary file (`req.file.path`). */
    receiveToDisk: wrap(toDisk.single(uploadFieldName)),
    /**
     * Middleware: as `receiveToDisk`, refusing (413) a file above `maxBytes` or above the
     * lab's upload limit, whichever is lower.
     */
    receiveToDiskUpTo(maxBytes: number): RequestHandler {
      const limit = Math.min(maxBytes, options.maxBytes);
      return wrap(toDiskUpTo(limit).single(uploadFieldName), Math.round(limit / 1024 / 1024));
    },
    /** Middleware: the file in field `file` is kept in memory (`req.file.buffer`); for CSV. */
    receiveToMemory: wrap(toMemory.single(uploadFieldName)),

    /**
     * The uploaded file of a request: 415 when the request was not multipart, 400 when it
     * holds no file in the field.
     */
    uploaded(req: Request, what: string): Express.Multer.File {
      if (req.file) return req.file;
      if (!isMultipart(req)) {
        throw new AppError(
          'unsupported_media_type',
          `Send ${what} as multipart/form-data, in the field "${uploadFieldName}".`,
        );
      }
      throw AppError.validation(
        `No file was sent: put ${what} in the field "${uploadFieldName}".`,
        {
          [uploadFieldName]: 'is required',
        },
      );
    },

    /**
     * Checks the temporary file's content against `accepted` (415 otherwise, naming what is
     * accepted) and moves it into the store. Answers the random stored name and details; the
     * kept name ends in the extension of the detected type.
     */
    async keep<T extends string>(
      file: Express.Multer.File,
      accepted: readonly T[],
      what: string,
      fallbackName: string,
    ): Promise<ReceivedFile & { storedName: string; contentType: T }> {
      try {
        const detected = await detectFileType(file.path);
        const contentType = accepted.find((type) => type === detected?.mime);
        if (!detected || !contentType) {
          throw new AppError(
            'unsupported_media_type',
            `${what} must be ${describeTypes(accepted)} file; ${
              detected
                ? `this one is ${detected.ext.toUpperCase()} (${detected.mime})`
                : 'the content of this one is not'
            } (the type is read from the file itself, not from its name).`,
            { [uploadFieldName]: `must be ${describeTypes(accepted)}` },
          );
        }
        const { size } = await stat(file.path);
        const storedName = `${randomBytes(16).toString('hex')}.${detected.ext}`;
        await rename(file.path, path.join(options.dir, storedName));
        return {
          storedName,
          contentType,
          size,
          fileName: withExtension(safeFileName(file.originalname, fallbackName), detected.ext),
        };
      } finally {
        await discard(file);
      }
    },

    /** Removes a temporary upload that was not kept (safe to call twice). */
    discard,

    open(storedName: string): ReadStream {
      return createReadStream(pathOf(storedName));
    },

    /**
     * Sends a stored file as a download under its original name (Content-Disposition with
     * an ASCII fallback and the UTF-8 name). 404 when the file is gone from the folder.
     * `inline`: shown in the browser instead (an image whose type was checked by content).
     */
    async send(
      res: Response,
      file: { storedName: string; fileName: string; contentType: string },
      what: string,
      { inline = false }: { inline?: boolean } = {},
    ): Promise<void> {
      const full = pathOf(file.storedName);
      let size: number;
      try {
        size = (await stat(full)).size;
      } catch {
        throw AppError.notFound(
          `The file of ${what} is missing from the uploads folder; upload it again.`,
        );
      }
      res.status(200);
      // Files stored before names followed the detected type still download as what they are.
      res.attachment(withExtension(file.fileName, path.extname(file.storedName).slice(1)));
      if (inline) {
        const disposition = String(res.getHeader('Content-Disposition'));
        res.setHeader('Content-Disposition', disposition.replace(/^attachment/, 'inline'));
      }
      res.setHeader('Content-Type', file.contentType);
      res.setHeader('Content-Length', String(size));
      res.setHeader('Cache-Control', 'private, no-store');
      try {
        await pipeline(createReadStream(full), res);
      } catch (error) {
        res.destroy(error instanceof Error ? error : new Error(String(error)));
      }
    },

    /** Removes a stored file; a file already gone is fine. */
    async remove(storedName: string | null | undefined): Promise<void> {
      if (storedName) await rm(pathOf(storedName), { force: true });
    },
  };
}
export type FileStore = ReturnType<typeof fileStore>;
