import type { ErrorRequestHandler, RequestHandler } from "express";
import { z } from "zod";
import { NUL_CHARACTER_MESSAGE } from "@shared/schemas/nul-character";
import { isUnstorableText } from "../db/postgres-errors";
import { HttpError } from "../http-error";

/** Turns a zod error's issues into per-field messages for forms. */
export function fieldErrors(error: z.ZodError): Record<string, string[]> {
  const fields: Record<string, string[]> = {};
  for (const issue of error.issues) {
    const key = issue.path.join(".") || "_";
    (fields[key] ??= []).push(issue.message);
  }
  return fields;
}

export const notFoundHandler: RequestHandler = (req, res) => {
  res.status(404).json({ error: { code: "not_found", message: `No API route ${req.method} ${req.path}.` } });
};

/** The one place errors become responses, all in the shape of shared/schemas/errors.ts. */
export const errorHandler: ErrorRequestHandler = (error, req, res, _next) => {
  if (error instanceof HttpError) {
    res.status(error.status).json({ error: { code: error.code, message: error.message, fields: error.fields } });
    return;
  }
  if (error instanceof z.ZodError) {
    res.status(400).json({
      error: { code: "invalid_input", message: "Some of what was sent is not valid.", fields: fieldErrors(error) },
    });
    return;
  }
  // A safety net behind the NUL check on bodies: text PostgreSQL refuses is the sender's mistake, and nothing was stored.
  if (isUnstorableText(error)) {
    res.status(400).json({ error: { code: "invalid_input", message: NUL_CHARACTER_MESSAGE } });
    return;
  }
  const status = typeof error?.status === "number" && error.status >= 400 && error.status < 500 ? error.status : 500;
  if (status === 413) {
    res.status(413).json({ error: { code: "too_large", message: "The request is larger than the server accepts." } });
    return;
  }
  // body-parser's own refusals: a body that is not JSON, or text in an encoding other than UTF-8.
  if (error?.type === "entity.parse.failed") {
    res.status(400).json({ error: { code: "invalid_input", message: "What was sent could not be read: it is not valid JSON." } });
    return;
  }
  if (error?.type === "charset.unsupported" || error?.type === "encoding.unsupported") {
    res
      .status(400)
      .json({ error: { code: "invalid_input", message: "What was sent is in a text encoding Outroll does not read; send it as UTF-8." } });
    return;
  }
  if (status < 500) {
    res.status(status).json({ error: { code: error.type ?? "bad_request", message: String(error.message ?? "Bad request.") } });
    return;
  }
  req.log?.error({ err: error }, "unhandled error");
  res.status(500).json({ error: { code: "server_error", message: "Something went wrong on the server; nothing was saved." } });
};
