/** An error the client may see: status, a stable code, a plain message and optional field messages. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
    /** Extra facts the client acts on, e.g. the current layoutRevision of a conflict. */
    readonly details?: Record<string, unknown>,
  ) {
    super(message);
  }
}

export const notFound = (what = "That item") => new HttpError(404, "not_found", `${what} was not found.`);
export const forbidden = (message = "Your role does not allow this.") => new HttpError(403, "forbidden", message);
export const conflict = (message: string) => new HttpError(409, "conflict", message);
export const badRequest = (message: string, fields?: Record<string, string>) =>
  new HttpError(400, "validation_failed", message, fields);
