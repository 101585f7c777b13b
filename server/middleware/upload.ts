import type { RequestHandler } from "express";
import multer from "multer";
import { HttpError } from "../lib/http-error";

/**
 * One file in memory (it is checked and decoded before anything touches the disk), with the
 * size limit enforced while the body streams in. Multer's errors become plain messages.
 */
export function singleUpload(field: string, maxBytes: () => number): RequestHandler {
  return (req, res, next) => {
    const limit = maxBytes();
    const handler = multer({
      storage: multer.memoryStorage(),
      limits: { fileSize: limit, files: 1, fields: 20 },
    }).single(field);
    handler(req, res, (err: unknown) => {
      if (!err) return next();
      if (err instanceof multer.MulterError) {
        if (err.code === "LIMIT_FILE_SIZE") {
          return next(
            new HttpError(
              413,
              "too_large",
              `The file is larger than ${(limit / (1024 * 1024)).toFixed(0)} MB, the most a plan image may be. Export it smaller (a PNG or JPEG of a few MB is plenty) and try again.`,
            ),
          );
        }
        if (err.code === "LIMIT_UNEXPECTED_FILE" || err.code === "LIMIT_FILE_COUNT") {
          return next(
            new HttpError(400, "validation_failed", `Send exactly one file, in the form field "${field}".`, {
              [field]: "send one file in this field only",
            }),
          );
        }
        return next(new HttpError(400, "validation_failed", `The upload could not be read: ${err.message}.`));
      }
      // Anything else comes from reading the multipart body (no boundary, cut off, empty): the
      // request is malformed, and nothing was stored (the file is held in memory only).
      next(
        new HttpError(400, "validation_failed", `The upload could not be read as a form with a file in "${field}".`, {
          [field]: "send one file as multipart/form-data",
        }),
      );
    });
  };
}
