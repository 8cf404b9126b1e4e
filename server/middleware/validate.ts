import type { Request } from "express";
import type { z } from "zod";

/** Parses one part of a request with its shared zod schema and returns the parsed value (a bad one throws, as 400). */
export function parseBody<S extends z.ZodType>(schema: S, req: Request): z.infer<S> {
  return schema.parse(req.body);
}
export function parseQuery<S extends z.ZodType>(schema: S, req: Request): z.infer<S> {
  return schema.parse(req.query);
}
export function parseParams<S extends z.ZodType>(schema: S, req: Request): z.infer<S> {
  return schema.parse(req.params);
}
