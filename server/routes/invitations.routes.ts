import { Router } from "express";
import { invitationIdParamsSchema, inviteTeacherSchema } from "@shared/schemas/invitations";
import { currentTeacher, requireRole, requireTeacher } from "../middleware/require-teacher";
import { parseBody, parseParams } from "../middleware/validate";
import {
  acceptInvitation,
  cancelInvitation,
  inviteTeacher,
  listInvitations,
  previewInvitation,
  resendInvitation,
} from "../services/invitations.service";

/** E-mail invitations: the head invites and manages them; the invited colleague previews (signed out) and accepts. */
export const invitationsRouter = Router();

const head = [requireTeacher, requireRole("head")];

invitationsRouter.get("/", ...head, async (req, res) => {
  res.json({ invitations: await listInvitations(currentTeacher(req)) });
});

invitationsRouter.post("/", ...head, async (req, res) => {
  const { email } = parseBody(inviteTeacherSchema, req);
  res.status(201).json(await inviteTeacher(currentTeacher(req), email, req.headers));
});

invitationsRouter.post("/:id/resend", ...head, async (req, res) => {
  const { id } = parseParams(invitationIdParamsSchema, req);
  res.json(await resendInvitation(currentTeacher(req), id, req.headers));
});

invitationsRouter.delete("/:id", ...head, async (req, res) => {
  const { id } = parseParams(invitationIdParamsSchema, req);
  await cancelInvitation(currentTeacher(req), id, req.headers);
  res.status(204).end();
});

// Public: the id is the secret the e-mail carried, and the page must work before the colleague has an account.
invitationsRouter.get("/:id/preview", async (req, res) => {
  const { id } = parseParams(invitationIdParamsSchema, req);
  res.json(await previewInvitation(id));
});

invitationsRouter.post("/:id/accept", requireTeacher, async (req, res) => {
  const { id } = parseParams(invitationIdParamsSchema, req);
  res.json(await acceptInvitation(currentTeacher(req), id, req.headers));
});
