import { Router } from "express";
import {
  approveProposalSchema,
  copyTemplateSchema,
  declineProposalSchema,
  proposalIdParamsSchema,
  proposeLessonSchema,
  publishTemplateSchema,
  publishVersionSchema,
  templateIdParamsSchema,
  templateListQuerySchema,
  templateVersionParamsSchema,
} from "@shared/schemas/shelf";
import { currentTeacher, requireRole, requireTeacher } from "../middleware/require-teacher";
import { parseBody, parseParams, parseQuery } from "../middleware/validate";
import {
  approveProposal,
  copyTemplate,
  countWaitingProposals,
  declineProposal,
  getTemplateDetail,
  listShelfProposals,
  listShelfTemplates,
  proposeLesson,
  publishTemplate,
  publishTemplateVersion,
  setTemplateRetired,
  withdrawProposal,
} from "../services/shelf.service";

/** The Department shelf: templates (head publishes, members browse and copy) and proposals (teachers propose, head decides). */
export const shelfRouter = Router();

shelfRouter.use(requireTeacher);
const member = requireRole("head", "teacher");
const head = requireRole("head");

shelfRouter.get("/templates", member, async (req, res) => {
  const { status } = parseQuery(templateListQuerySchema, req);
  res.json({ templates: await listShelfTemplates(currentTeacher(req), status) });
});

shelfRouter.post("/templates", head, async (req, res) => {
  const input = parseBody(publishTemplateSchema, req);
  res.status(201).json(await publishTemplate(currentTeacher(req), input));
});

shelfRouter.get("/templates/:id", member, async (req, res) => {
  const { id } = parseParams(templateIdParamsSchema, req);
  res.json(await getTemplateDetail(currentTeacher(req), id));
});

shelfRouter.get("/templates/:id/versions/:version", member, async (req, res) => {
  const { id, version } = parseParams(templateVersionParamsSchema, req);
  res.json(await getTemplateDetail(currentTeacher(req), id, version));
});

shelfRouter.post("/templates/:id/versions", head, async (req, res) => {
  const { id } = parseParams(templateIdParamsSchema, req);
  const input = parseBody(publishVersionSchema, req);
  res.status(201).json(await publishTemplateVersion(currentTeacher(req), id, input));
});

shelfRouter.post("/templates/:id/retire", head, async (req, res) => {
  const { id } = parseParams(templateIdParamsSchema, req);
  res.json(await setTemplateRetired(currentTeacher(req), id, true));
});

shelfRouter.post("/templates/:id/restore", head, async (req, res) => {
  const { id } = parseParams(templateIdParamsSchema, req);
  res.json(await setTemplateRetired(currentTeacher(req), id, false));
});

shelfRouter.post("/templates/:id/copy", member, async (req, res) => {
  const { id } = parseParams(templateIdParamsSchema, req);
  const input = parseBody(copyTemplateSchema, req);
  res.status(201).json(await copyTemplate(currentTeacher(req), id, input));
});

shelfRouter.get("/proposals", member, async (req, res) => {
  res.json({ proposals: await listShelfProposals(currentTeacher(req)) });
});

shelfRouter.get("/proposals/waiting", member, async (req, res) => {
  res.json(await countWaitingProposals(currentTeacher(req)));
});

shelfRouter.post("/proposals", requireRole("teacher"), async (req, res) => {
  const input = parseBody(proposeLessonSchema, req);
  res.status(201).json(await proposeLesson(currentTeacher(req), input));
});

shelfRouter.delete("/proposals/:id", requireRole("teacher"), async (req, res) => {
  const { id } = parseParams(proposalIdParamsSchema, req);
  await withdrawProposal(currentTeacher(req), id);
  res.status(204).end();
});

shelfRouter.post("/proposals/:id/approve", head, async (req, res) => {
  const { id } = parseParams(proposalIdParamsSchema, req);
  const input = parseBody(approveProposalSchema, req);
  res.json(await approveProposal(currentTeacher(req), id, input));
});

shelfRouter.post("/proposals/:id/decline", head, async (req, res) => {
  const { id } = parseParams(proposalIdParamsSchema, req);
  const input = parseBody(declineProposalSchema, req);
  res.json(await declineProposal(currentTeacher(req), id, input));
});
