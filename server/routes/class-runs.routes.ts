import { Router } from "express";
import {
  classRunIdParamsSchema,
  groupLeftOutSchema,
  groupMatchupSchema,
  groupRenameSchema,
  openClassRunSchema,
  padCodeParamsSchema,
  runGroupParamsSchema,
  runJoiningSchema,
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
  removeRunGroup,
  renameRunGroup,
  setRunGroupLeftOut,
  setRunJoiningLocked,
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
  res.status(201).json(await openClassRun(currentTeacher(req), input.lessonId, input.groupCap));
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

classRunsRouter.patch("/:id/groups/:groupId", async (req, res) => {
  const { id, groupId } = parseParams(runGroupParamsSchema, req);
  const { nickname } = parseBody(groupRenameSchema, req);
  res.json(await renameRunGroup(currentTeacher(req), id, groupId, nickname));
});

classRunsRouter.delete("/:id/groups/:groupId", async (req, res) => {
  const { id, groupId } = parseParams(runGroupParamsSchema, req);
  res.json(await removeRunGroup(currentTeacher(req), id, groupId));
});

classRunsRouter.put("/:id/groups/:groupId/left-out", async (req, res) => {
  const { id, groupId } = parseParams(runGroupParamsSchema, req);
  const { leftOut } = parseBody(groupLeftOutSchema, req);
  res.json(await setRunGroupLeftOut(currentTeacher(req), id, groupId, leftOut));
});

classRunsRouter.put("/:id/joining", async (req, res) => {
  const { id } = parseParams(classRunIdParamsSchema, req);
  const { locked } = parseBody(runJoiningSchema, req);
  res.json(await setRunJoiningLocked(currentTeacher(req), id, locked));
});

classRunsRouter.post("/:id/simulated-groups", async (req, res) => {
  const { id } = parseParams(classRunIdParamsSchema, req);
  res.status(201).json(await addSimulatedGroups(currentTeacher(req), id, parseBody(simulatedGroupsSchema, req)));
});

/** /api/pad: what the Roll pad may read without an account (pupils have none). */
export const padRouter = Router();

padRouter.get("/:code", async (req, res) => {
  const { code } = parseParams(padCodeParamsSchema, req);
  res.json(await previewRunByCode(code, req.ip ?? "unknown"));
});
