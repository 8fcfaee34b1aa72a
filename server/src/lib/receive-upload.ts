import type { Request, Response } from 'express';
import multer from 'multer';
import { BadRequestError, PayloadTooLargeError } from './errors';

export const PHOTO_FIELD = 'file';

/**
 * Reads one multipart file into memory (photos and logos are small and go straight to sharp).
 * Multer and busboy errors become our problem types here, so a malformed upload is a 4xx.
 */
export function receiveUpload(
  req: Request,
  res: Response,
  maxBytes: number,
  what: 'photo' | 'logo' = 'photo',
): Promise<{ buffer: Buffer; originalname: string }> {
  const upload = multer({
    storage: multer.memoryStorage(),
    defParamCharset: 'utf8',
    limits: { fileSize: maxBytes, files: 1, fields: 4, fieldSize: 1024, parts: 5, headerPairs: 100 },
  }).single(PHOTO_FIELD);
  const mb = Math.round((maxBytes / (1024 * 1024)) * 10) / 10;
  return new Promise((resolve, reject) => {
    upload(req, res, (err: unknown) => {
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE')
          return reject(new PayloadTooLargeError(`The ${what} is larger than ${mb} MB.`));
        if (err.code === 'LIMIT_UNEXPECTED_FILE')
          return reject(new BadRequestError(`Send one ${what} in the form field "${PHOTO_FIELD}".`));
        return reject(
          new BadRequestError(`The upload does not fit the allowed limits: one ${what} and a few small fields.`),
        );
      }
      if (err) return reject(new BadRequestError('The upload could not be read as multipart/form-data.'));
      const file = req.file;
      if (!file)
        return reject(new BadRequestError(`Attach the ${what} as multipart/form-data in the field "${PHOTO_FIELD}".`));
      if (file.size === 0) return reject(new BadRequestError(`The ${what} file is empty.`));
      resolve({ buffer: file.buffer, originalname: file.originalname });
    });
  });
}
