import { Router } from "express";
import type { CurrentTeacher } from "@shared/schemas/account";
import { currentTeacher, requireTeacher } from "../middleware/require-teacher";

export const meRouter = Router();

meRouter.get("/", requireTeacher, (req, res) => {
  const body: CurrentTeacher = currentTeacher(req);
  res.json(body);
});
