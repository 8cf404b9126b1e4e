import { Router } from "express";
import {
  classRunIdParamsSchema,
  groupMatchupSchema,
  openClassRunSchema,
  padCodeParamsSchema,
  runGroupParamsSchema,
  runPhaseChangeSchema,
  runStatusChangeSchema,
  simulatedGroupsSchema,
} from "@shared/schemas/class-runs";
import { currentTeacher, requireTeacher } from "../middleware/require-teacher";
import { parseBody, parseParams } from "../middleware/validate";
import {
  addSimulatedGroups,
  assignGroupMatchup,
  changeRunPhase,
  changeRunStatus,
  getBoardSnapshot,
  getClassRun,
  listClassRuns,
  listRunnableLessons,
  openClassRun,
  previewRunByCode,
} from "../services/class-runs.service";

/** /api/class-runs: the teacher's runs, opening one from a lesson, its phases, status, groups and the virtual class. */
export const classRunsRouter = Router();
classRunsRouter.use(requireTeacher);

classRunsRouter.get("/", async (req, res) => {
  res.json(await listClassRuns(currentTeacher(req)));
});

classRunsRouter.get("/lessons", async (req, res) => {
  res.json(await listRunnableLessons(currentTeacher(req)));
});

classRunsRouter.post("/", async (req, res) => {
  const input = parseBody(openClassRunSchema, req);
  res.status(201).json(await openClassRun(currentTeacher(req), input.lessonId));
});

classRunsRouter.get("/:id", async (req, res) => {
  const { id } = parseParams(classRunIdParamsSchema, req);
  res.json(await getClassRun(currentTeacher(req), id));
});

classRunsRouter.get("/:id/board", async (req, res) => {
  const { id } = parseParams(classRunIdParamsSchema, req);
  res.json(await getBoardSnapshot(currentTeacher(req), id));
});

classRunsRouter.post("/:id/status", async (req, res) => {
  const { id } = parseParams(classRunIdParamsSchema, req);
  const { status } = parseBody(runStatusChangeSchema, req);
  res.json(await changeRunStatus(currentTeacher(req), id, status));
});

classRunsRouter.post("/:id/phase", async (req, res) => {
  const { id } = parseParams(classRunIdParamsSchema, req);
  res.json(await changeRunPhase(currentTeacher(req), id, parseBody(runPhaseChangeSchema, req)));
});

classRunsRouter.put("/:id/groups/:groupId/matchup", async (req, res) => {
  const { id, groupId } = parseParams(runGroupParamsSchema, req);
  const { matchup } = parseBody(groupMatchupSchema, req);
  res.json(await assignGroupMatchup(currentTeacher(req), id, groupId, matchup));
});

classRunsRouter.post("/:id/simulated-groups", async (req, res) => {
  const { id } = parseParams(classRunIdParamsSchema, req);
  res.status(201).json(await addSimulatedGroups(currentTeacher(req), id, parseBody(simulatedGroupsSchema, req)));
});

/** /api/pad: what the Roll pad may read without an account (pupils have none). */
export const padRouter = Router();

padRouter.get("/:code", async (req, res) => {
  const { code } = parseParams(padCodeParamsSchema, req);
  res.json(await previewRunByCode(code));
});
