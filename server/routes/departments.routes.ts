import { Router } from "express";
import { createDepartmentSchema } from "@shared/schemas/account";
import { currentTeacher, requireRole, requireTeacher } from "../middleware/require-teacher";
import { parseBody } from "../middleware/validate";
import { createDepartment, membersOfDepartment, renameTeacherDepartment } from "../services/department.service";

export const departmentsRouter = Router();

departmentsRouter.use(requireTeacher);

departmentsRouter.post("/", async (req, res) => {
  const { name } = parseBody(createDepartmentSchema, req);
  res.status(201).json(await createDepartment(currentTeacher(req), name, req.headers));
});

departmentsRouter.get("/current/members", requireRole("head", "teacher"), async (req, res) => {
  res.json({ members: await membersOfDepartment(currentTeacher(req)) });
});

departmentsRouter.patch("/current", requireRole("head"), async (req, res) => {
  const { name } = parseBody(createDepartmentSchema, req);
  res.json(await renameTeacherDepartment(currentTeacher(req), name));
});
