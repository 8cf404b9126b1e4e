import { z } from "zod";
import type { LessonSnapshot } from "./lessons";

/** A template on the Department shelf is either on show (published) or taken down (retired). */
export const templateStatusSchema = z.enum(["published", "retired"]);
export type TemplateStatus = z.infer<typeof templateStatusSchema>;

export const proposalStatusSchema = z.enum(["pending", "approved", "declined"]);
export type ProposalStatus = z.infer<typeof proposalStatusSchema>;
export const proposalStatusLabels: Record<ProposalStatus, string> = {
  pending: "Waiting for a decision",
  approved: "Approved",
  declined: "Declined",
};

const lessonId = z.uuid({ error: "Pick one of your lessons." });

/** Every published version says what changed; the first one says what the template is for. */
export const changeNoteSchema = z
  .string({ error: "Write a change note." })
  .trim()
  .min(3, { error: "Write a change note of a few words, e.g. “First version” or “Shorter Prove phase”." })
  .max(500, { error: "Keep the change note under 500 characters." });

/** Body of POST /api/shelf/templates: publish one of the head's lessons as a new template (version 1). */
export const publishTemplateSchema = z.object({ lessonId, changeNote: changeNoteSchema });
export type PublishTemplateInput = z.infer<typeof publishTemplateSchema>;

/** Body of POST /api/shelf/templates/:id/versions: publish a lesson as the template's next version. */
export const publishVersionSchema = z.object({ lessonId, changeNote: changeNoteSchema });
export type PublishVersionInput = z.infer<typeof publishVersionSchema>;

/** Body of POST /api/shelf/templates/:id/copy: which version to copy (the current one when left out). */
export const copyTemplateSchema = z.object({
  version: z.number({ error: "The version must be a number." }).int().positive().optional(),
});
export type CopyTemplateInput = z.infer<typeof copyTemplateSchema>;

/** Body of POST /api/shelf/proposals: a teacher proposes one of their lessons for the shelf. */
export const proposeLessonSchema = z.object({
  lessonId,
  note: z.string().trim().max(1000, { error: "Keep the note under 1000 characters." }).default(""),
});
export type ProposeLessonInput = z.input<typeof proposeLessonSchema>;

/** Body of POST /api/shelf/proposals/:id/approve: publish as a new template, or as the next version of one. */
export const approveProposalSchema = z.discriminatedUnion(
  "target",
  [
    z.object({ target: z.literal("new"), changeNote: changeNoteSchema }),
    z.object({
      target: z.literal("version"),
      templateId: z.uuid({ error: "Pick the template this lesson updates." }),
      changeNote: changeNoteSchema,
    }),
  ],
  { error: "Choose whether it becomes a new template or the next version of one." },
);
export type ApproveProposalInput = z.infer<typeof approveProposalSchema>;

/** Body of POST /api/shelf/proposals/:id/decline: the teacher is told why. */
export const declineProposalSchema = z.object({
  note: z
    .string({ error: "Say why, so the teacher knows what to change." })
    .trim()
    .min(3, { error: "Say why, so the teacher knows what to change." })
    .max(1000, { error: "Keep the note under 1000 characters." }),
});
export type DeclineProposalInput = z.infer<typeof declineProposalSchema>;

export const templateIdParamsSchema = z.object({ id: z.uuid({ error: "That is not a template id." }) });
export const templateVersionParamsSchema = templateIdParamsSchema.extend({
  version: z.coerce.number({ error: "The version must be a number." }).int().positive(),
});
export const proposalIdParamsSchema = z.object({ id: z.uuid({ error: "That is not a proposal id." }) });

/** Query of GET /api/shelf/templates; retired templates are listed for the head of department only. */
export const templateListQuerySchema = z.object({ status: templateStatusSchema.default("published") });

/** One template on the shelf list, described by its current version. */
export type TemplateSummary = {
  id: string;
  title: string;
  status: TemplateStatus;
  currentVersion: number;
  classGroup: string;
  diceSetName: string | null;
  durationMinutes: number;
  phases: string[];
  objectiveCount: number;
  changeNote: string;
  publishedAt: string;
  publishedByName: string;
  /** The teacher whose approved proposal the current version is; null when the head published their own lesson. */
  proposedByName: string | null;
  createdAt: string;
};

/** One version in a template's history (newest first in the API). */
export type TemplateVersionSummary = {
  version: number;
  changeNote: string;
  publishedAt: string;
  publishedByName: string;
  /** Credit for the teacher whose approved proposal this version is; null for the head's own publication. */
  proposedByName: string | null;
};

/** GET /api/shelf/templates/:id and …/versions/:version: the template, its history and one version's frozen lesson. */
export type TemplateDetail = {
  template: TemplateSummary;
  versions: TemplateVersionSummary[];
  shown: TemplateVersionSummary & { snapshot: LessonSnapshot };
};

/** What copying a template answers: the teacher's new lesson. */
export type CopiedLesson = { lessonId: string; title: string; fromTemplateId: string; fromTemplateVersion: number };

/** A proposal as the head's queue and the proposing teacher see it. */
export type ShelfProposal = {
  id: string;
  lessonId: string;
  lessonTitle: string | null;
  proposedByName: string;
  isMine: boolean;
  note: string;
  status: ProposalStatus;
  decisionNote: string | null;
  decidedByName: string | null;
  decidedAt: string | null;
  createdAt: string;
  /** The lesson as it stands now, for the head to read before deciding (pending proposals only). */
  preview: LessonSnapshot | null;
};

/** GET /api/shelf/proposals/waiting: the head's count is the department's queue, a teacher's their own waiting proposals. */
export type WaitingProposals = { waiting: number; scope: "department" | "mine" };
