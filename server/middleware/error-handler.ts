import type { ErrorRequestHandler, RequestHandler } from "express";
import { HttpError } from "../lib/http-error";
import { DATABASE_RETRY_AFTER_S, isDatabaseUnavailable } from "../db/unavailable";

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
  // Errors from body-parser, the router and zlib carry a 4xx status: the client erred, so say what
  // was wrong with the request, never a 500 (RFC 9110 §15.5).
  const status =
    typeof err?.status === "number" ? err.status : typeof err?.statusCode === "number" ? err.statusCode : 500;
  if (status >= 400 && status < 500) {
    const known = clientError(err, status);
    // A body that cannot be read is wrong as a whole: its field is the root ("").
    const fields = known.code === "validation_failed" ? { "": known.message } : undefined;
    res.status(known.status).json({ error: { code: known.code, message: known.message, fields } });
    return;
  }
  if (isDatabaseUnavailable(err)) {
    // A restart or failover: clients (the Walk sync among them) retry a 5xx after the pause.
    req.log?.warn({ err: { message: err?.message, code: err?.code } }, "database unavailable");
    res
      .status(503)
      .set("Retry-After", String(DATABASE_RETRY_AFTER_S))
      .json({
        error: { code: "unavailable", message: "The service is briefly unavailable. Please try again shortly." },
      });
    return;
  }
  req.log?.error({ err }, "unhandled error");
  res.status(500).json({ error: { code: "internal", message: "Something went wrong on our side. Please try again." } });
};

// The message of each kind of malformed request; anything else with a 4xx status gets a plain one.
function clientError(err: { type?: string; code?: string; name?: string }, status: number) {
  const of = (s: number, code: string, message: string) => ({ status: s, code, message });
  if (err.type === "entity.parse.failed")
    return of(400, "validation_failed", "The request body is not valid JSON (an object or a list).");
  if (err.type === "entity.too.large" || status === 413) return of(413, "too_large", "The request is too large.");
  if (err.type === "encoding.unsupported")
    return of(
      415,
      "unsupported_encoding",
      "The request body's Content-Encoding is not one the server reads (gzip, deflate, br or none).",
    );
  if (err.type === "charset.unsupported")
    return of(415, "unsupported_charset", "The request body's charset is not one the server reads (send UTF-8).");
  if (typeof err.code === "string" && err.code.startsWith("Z_"))
    return of(400, "bad_encoding", "The request body is not encoded as its Content-Encoding says.");
  if (err.name === "URIError") return of(400, "bad_path", "The address has a broken percent-escape (%).");
  if (err.type === "request.aborted") return of(400, "aborted", "The request was cut off before its body arrived.");
  if (err.type === "request.size.invalid")
    return of(400, "bad_length", "The request body is not as long as its Content-Length says.");
  return of(status, "bad_request", "The request could not be read.");
}
