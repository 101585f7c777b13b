import os from "node:os";
import path from "node:path";
import { rm } from "node:fs/promises";
import type { RequestHandler } from "express";
import multer from "multer";
import { HttpError } from "../lib/http-error";

/** The temporary folder uploads stream into while their request runs. */
export function uploadTmpDir(configured?: string): string {
  return configured ?? path.join(os.tmpdir(), "plumeline-uploads");
}

/**
 * One file, streamed to a temporary file (never held whole in memory while it arrives), with the
 * size limit enforced while the body streams in; the file is removed once the answer is sent or the
 * connection drops. Multer's errors become plain messages.
 */
export function singleUpload(field: string, maxBytes: () => number, tmpDir: () => string): RequestHandler {
  return (req, res, next) => {
    const limit = maxBytes();
    const handler = multer({
      dest: tmpDir(),
      limits: { fileSize: limit, files: 1, fields: 20 },
    }).single(field);
    res.on("close", () => {
      if (req.file?.path) void rm(req.file.path, { force: true });
    });
    handler(req, res, (err: unknown) => {
      if (!err) return next();
      if (err instanceof multer.MulterError) {
        if (err.code === "LIMIT_FILE_SIZE") {
          return next(
            new HttpError(
              413,
              "too_large",
              `The file is larger than ${(limit / (1024 * 1024)).toFixed(0)} MB, the most allowed here. Export it smaller (a PNG or JPEG of a few MB is plenty) and try again.`,
              { [field]: `must be at most ${(limit / (1024 * 1024)).toFixed(0)} MB` },
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
      // request is malformed, and nothing was stored (multer removes a partly written file).
      next(
        new HttpError(400, "validation_failed", `The upload could not be read as a form with a file in "${field}".`, {
          [field]: "send one file as multipart/form-data",
        }),
      );
    });
  };
}
