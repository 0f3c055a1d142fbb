// Multipart uploads through multer, with every way a form can be broken answered in the one error shape.
import type { Request, RequestHandler } from 'express';
import multer from 'multer';
import { AppError, ValidationFailed } from './errors';

export interface UploadRule {
  /** The form field the files come in. */
  field: string;
  maxFiles: number;
  maxBytes: number;
  /** Told to the person when a file is too large or the count or field is wrong. */
  tooLarge: string;
  wrongField: string;
}

/**
 * Parses `rule.field` into req.files (maxFiles > 1) or req.file. A file over the size answers 413; a wrong field,
 * too many files, a form without a boundary, a cut-off body or a malformed part answers 400; never 500.
 */
export function multipartUpload(rule: UploadRule): RequestHandler {
  const parser = multer({ storage: multer.memoryStorage(), limits: { fileSize: rule.maxBytes, files: rule.maxFiles } });
  const parse = rule.maxFiles > 1 ? parser.array(rule.field, rule.maxFiles) : parser.single(rule.field);
  return (req: Request, res, next) =>
    parse(req, res, (error: unknown) => {
      if (!error) return next();
      if (error instanceof multer.MulterError) {
        if (error.code === 'LIMIT_FILE_SIZE') return next(new AppError(413, 'too_large', rule.tooLarge, { [rule.field]: rule.tooLarge }));
        const message = error.code === 'LIMIT_FILE_COUNT' || error.code === 'LIMIT_UNEXPECTED_FILE' ? rule.wrongField : `The upload form is not valid (${error.message}).`;
        return next(new ValidationFailed({ [rule.field]: message }, message));
      }
      // busboy's own errors: no boundary, an unexpected end of the form, a malformed part header.
      const message = 'The upload was cut off or is not a well-formed multipart form. Send the file again.';
      next(new AppError(400, 'malformed_request', message, { [rule.field]: message }));
    });
}
