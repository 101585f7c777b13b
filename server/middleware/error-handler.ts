import type { ErrorRequestHandler, RequestHandler } from "express";
import { HttpError } from "../lib/http-error";

export const notFoundApi: RequestHandler = (req) => {
  throw new HttpError(404, "not_found", `No API route ${req.method} ${req.path}.`);
};

/** The one JSON error handler: known errors keep their message; anything else is logged, never shown. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  if (err instanceof HttpError) {
    if (typeof err.details?.retryAfterSeconds === "number")
      res.set("Retry-After", String(err.details.retryAfterSeconds));
    res
      .status(err.status)
      .json({ error: { code: err.code, message: err.message, fields: err.fields, details: err.details } });
    return;
  }
  // body-parser and multer errors carry a status and a type; keep them specific but plain.
  const status =
    typeof err?.status === "number" ? err.status : typeof err?.statusCode === "number" ? err.statusCode : 500;
  if (status === 400 && err?.type === "entity.parse.failed") {
    res.status(400).json({ error: { code: "validation_failed", message: "The request body is not valid JSON." } });
    return;
  }
  if (status === 413) {
    res.status(413).json({ error: { code: "too_large", message: "The request is too large." } });
    return;
  }
  req.log?.error({ err }, "unhandled error");
  res.status(500).json({ error: { code: "internal", message: "Something went wrong on our side. Please try again." } });
};
