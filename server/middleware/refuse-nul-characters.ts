import type { RequestHandler } from "express";
import { hasNulCharacter, NUL_CHARACTER_MESSAGE } from "@shared/schemas/nul-character";
import { HttpError } from "../http-error";

/** 400 `invalid_input` for a parsed body or a query string holding a NUL character, before any route or better-auth sees it. */
export const refuseNulCharacters: RequestHandler = (req, _res, next) => {
  const found = hasNulCharacter(req.body) || req.originalUrl.includes("%00") || hasNulCharacter(req.query);
  next(found ? new HttpError(400, "invalid_input", NUL_CHARACTER_MESSAGE) : undefined);
};
