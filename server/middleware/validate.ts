import type { RequestHandler } from "express";
import type { z } from "zod";
import { HttpError } from "../lib/http-error";
import { describeFields, zodFields } from "../lib/zod-fields";

type Part = "body" | "query" | "params";

/**
 * Parses one part of the request and KEEPS the parsed value: body is replaced, query and
 * params go to res.locals (Express 5's req.query is a getter and cannot be replaced).
 */
export function validate<S extends z.ZodType>(schema: S, part: Part = "body"): RequestHandler {
  const handler: RequestHandler = (req, res, next) => {
    const result = schema.safeParse(req[part] ?? {});
    if (!result.success) {
      const fields = zodFields(result.error);
      throw new HttpError(400, "validation_failed", describeFields(fields), fields);
    }
    if (part === "body") req.body = result.data;
    else res.locals[part] = result.data;
    next();
  };
  // Tagged so the route table (server/lib/route-table.ts) can say what each route reads.
  return Object.assign(handler, { validates: { part, schema } });
}

export function parsedQuery<T>(res: { locals: Record<string, unknown> }): T {
  return res.locals.query as T;
}
