import { z } from "zod";
import { curriculumStandardCodes } from "../curriculum/standards";
import { setDiceSchema } from "./dice-sets";

/** The six lesson phases, in the order a lesson runs them (a lesson may skip any). */
export const LESSON_PHASES = ["Guess", "Roll", "Pool", "Prove", "Twist", "Reflect"] as const;
export type LessonPhaseName = (typeof LESSON_PHASES)[number];

export const lessonStatusSchema = z.enum(["draft", "ready", "taught"]);
export type LessonStatus = z.infer<typeof lessonStatusSchema>;
export const lessonStatusLabels: Record<LessonStatus, string> = { draft: "Draft", ready: "Ready", taught: "Taught" };

/** Same strings as the engine's TieRule (shared/probability/tie-rule.ts). */
export const lessonTieRuleSchema = z.enum(["re-roll-ties", "ties-score-half", "ties-score-nothing"]);
export const tieRuleLabels: Record<z.infer<typeof lessonTieRuleSchema>, string> = {
  "re-roll-ties": "Re-roll ties",
  "ties-score-half": "Ties score half",
  "ties-score-nothing": "Ties score nothing",
};

export const matchupChoiceSchema = z.enum(["assigned", "group-choice"]);
export type MatchupChoice = z.infer<typeof matchupChoiceSchema>;
export const matchupChoiceLabels: Record<MatchupChoice, string> = {
  assigned: "Teacher assigns each group's matchups",
  "group-choice": "Groups choose their own matchups",
};

/** Limits the form, the route and the materials list share. */
export const LESSON_LIMITS = {
  durationMinutesMin: 10,
  durationMinutesMax: 300,
  groupsMax: 20,
  pupilsPerGroupMin: 2,
  pupilsPerGroupMax: 8,
  rollsPerGroupMax: 2000,
  objectivesMax: 12,
  promptsMax: 12,
  phaseMinutesMax: 120,
} as const;

const wholeNumber = (label: string, min: number, max: number) =>
  z
    .number({ error: `${label} must be a number.` })
    .int({ error: `${label} must be a whole number.` })
    .min(min, { error: `${label} must be at least ${min}.` })
    .max(max, { error: `${label} must be at most ${max}.` });

const text = (label: string, max: number) =>
  z
    .string()
    .trim()
    .max(max, { error: `Keep ${label} under ${max} characters.` });

/** One learning objective, optionally tagged with a built-in curriculum standard (shared/curriculum/standards.ts). */
export const lessonObjectiveSchema = z.object({
  text: text("an objective", 300).min(1, { error: "Write the objective, or remove it." }),
  curriculumCode: z.enum(curriculumStandardCodes, { error: "Pick a standard from the list." }).optional(),
});
export type LessonObjective = z.infer<typeof lessonObjectiveSchema>;

/** One phase of the lesson: whether it runs, for how long, and the teacher's notes. */
export const lessonPhaseSchema = z.object({
  phase: z.enum(LESSON_PHASES),
  included: z.boolean(),
  minutes: wholeNumber("Minutes", 0, LESSON_LIMITS.phaseMinutesMax),
  notes: text("the notes", 2000),
});
export type LessonPhase = z.infer<typeof lessonPhaseSchema>;

/** How each matchup is played: one or two dice each (faces summed), two or three players. */
export const lessonModeSchema = z.object({
  dicePerPlayer: z.union([z.literal(1), z.literal(2)], { error: "Choose one die each or two dice each." }),
  players: z.union([z.literal(2), z.literal(3)], { error: "Choose two players or three players." }),
});
export type LessonMode = z.infer<typeof lessonModeSchema>;

const planFields = {
  durationMinutes: wholeNumber("The duration", LESSON_LIMITS.durationMinutesMin, LESSON_LIMITS.durationMinutesMax),
  objectives: z
    .array(lessonObjectiveSchema)
    .max(LESSON_LIMITS.objectivesMax, { error: `A lesson has at most ${LESSON_LIMITS.objectivesMax} objectives.` }),
  mode: lessonModeSchema,
  tieRule: lessonTieRuleSchema,
  groups: wholeNumber("The number of groups", 1, LESSON_LIMITS.groupsMax),
  pupilsPerGroup: wholeNumber("Pupils per group", LESSON_LIMITS.pupilsPerGroupMin, LESSON_LIMITS.pupilsPerGroupMax),
  rollsPerGroup: wholeNumber("Rolls per group", 1, LESSON_LIMITS.rollsPerGroupMax),
  matchupChoice: matchupChoiceSchema,
  phases: z
    .array(lessonPhaseSchema)
    .length(LESSON_PHASES.length, { error: "A lesson lists all six phases (skip one by leaving it out of the lesson)." })
    .refine((phases) => phases.every((entry, index) => entry.phase === LESSON_PHASES[index]), {
      error: `The phases run in order: ${LESSON_PHASES.join(", ")}.`,
    }),
  discussionPrompts: z
    .array(text("a prompt", 300).min(1, { error: "Write the prompt, or remove it." }))
    .max(LESSON_LIMITS.promptsMax, { error: `A lesson has at most ${LESSON_LIMITS.promptsMax} discussion prompts.` }),
  exitTicket: text("the exit ticket", 1000),
  /**
   * The Wall view keeps the exact chances back until the Prove phase, so the class judges its own figures first. Plans saved before
   * the setting existed read as on.
   */
  hideExactUntilProve: z.boolean({ error: "Say whether the Wall hides exact values until Prove." }).default(true),
  differentiation: z.object({ support: text("the support notes", 2000), stretch: text("the stretch notes", 2000) }),
};

const playersFitGroups = (plan: { mode: LessonMode; pupilsPerGroup: number }) => plan.pupilsPerGroup >= plan.mode.players;
const playersFitGroupsIssue = { error: "Each group needs at least as many pupils as players.", path: ["pupilsPerGroup"] };

/** The JSON document stored in lesson.plan: everything of a lesson that is not a searchable column. */
export const lessonPlanSchema = z.object(planFields).refine(playersFitGroups, playersFitGroupsIssue);
export type LessonPlan = z.infer<typeof lessonPlanSchema>;

/** The plan fields the materials list and the rolls verdict read (shared/lessons/lesson-materials.ts). */
export const lessonMaterialsFieldsSchema = z
  .object({
    mode: planFields.mode,
    tieRule: planFields.tieRule,
    groups: planFields.groups,
    pupilsPerGroup: planFields.pupilsPerGroup,
    rollsPerGroup: planFields.rollsPerGroup,
    matchupChoice: planFields.matchupChoice,
    phases: z.array(lessonPhaseSchema.pick({ phase: true, included: true, minutes: true })),
    exitTicket: z.string(),
  })
  .refine(playersFitGroups, playersFitGroupsIssue);
export type LessonMaterialsFields = z.infer<typeof lessonMaterialsFieldsSchema>;

/** What a teacher sends to create a lesson (form, route and tests share it). */
export const lessonInputSchema = z
  .object({
    title: text("the title", 120).min(1, { error: "Give the lesson a title." }),
    classGroup: text("the class", 40),
    diceSetId: z.uuid({ error: "Pick a dice set from the list." }).nullable(),
    status: lessonStatusSchema,
    ...planFields,
  })
  .refine(playersFitGroups, playersFitGroupsIssue);
export type LessonInput = z.infer<typeof lessonInputSchema>;

/** An update carries the version the teacher started from; a stale one is refused with 409 stale_version. */
export const lessonUpdateSchema = lessonInputSchema.safeExtend({ version: z.number().int().positive() });
export type LessonUpdate = z.infer<typeof lessonUpdateSchema>;

/** Splits a lesson input into its searchable columns and its stored plan document. */
export function lessonPlanFromInput(input: LessonInput): LessonPlan {
  const { title: _title, classGroup: _classGroup, diceSetId: _diceSetId, status: _status, ...plan } = input;
  return plan;
}

/** A new lesson's starting values: every phase in, a short plan for four groups of three. */
export function emptyLessonInput(): LessonInput {
  return {
    title: "",
    classGroup: "",
    diceSetId: null,
    status: "draft",
    durationMinutes: 60,
    objectives: [],
    mode: { dicePerPlayer: 1, players: 2 },
    tieRule: "re-roll-ties",
    groups: 8,
    pupilsPerGroup: 3,
    rollsPerGroup: 30,
    matchupChoice: "assigned",
    phases: LESSON_PHASES.map((phase) => ({ phase, included: true, minutes: 10, notes: "" })),
    discussionPrompts: [],
    exitTicket: "",
    hideExactUntilProve: true,
    differentiation: { support: "", stretch: "" },
  };
}

/** Query parameters of GET /api/lessons. */
export const lessonListQuerySchema = z.object({
  search: z.string().trim().max(120).optional(),
  diceSetId: z.uuid({ error: "The set filter must be a dice set id." }).optional(),
  classGroup: z.string().trim().max(40).optional(),
  status: lessonStatusSchema.optional(),
  includeArchived: z.stringbool({ error: "includeArchived must be true or false." }).optional(),
});
export type LessonListQuery = z.infer<typeof lessonListQuerySchema>;

export const lessonIdParamsSchema = z.object({ id: z.uuid({ error: "That is not a lesson id." }) });
export const lessonAttachmentParamsSchema = lessonIdParamsSchema.extend({
  attachmentId: z.uuid({ error: "That is not an attachment id." }),
});

/** Body of POST /api/lessons/:id/archive. */
export const lessonArchiveSchema = z.object({ archived: z.boolean() });

/** The file types a lesson may carry, as detected from the file's content. */
export const ATTACHMENT_TYPES = ["application/pdf", "image/png", "image/jpeg"] as const;
export type AttachmentType = (typeof ATTACHMENT_TYPES)[number];
/** Largest attachment accepted: 10 MB. */
export const ATTACHMENT_BYTES_MAX = 10 * 1024 * 1024;

/** A lesson's attachment as the API answers it. */
export interface LessonAttachment {
  id: string;
  lessonId: string;
  fileName: string;
  mimeType: AttachmentType;
  sizeBytes: number;
  uploadedByName: string;
  createdAt: string;
}

/** A lesson as GET /api/lessons/:id answers it. */
export type Lesson = LessonInput & {
  id: string;
  version: number;
  ownerId: string;
  ownerName: string;
  departmentId: string | null;
  isOwner: boolean;
  diceSetName: string | null;
  fromTemplateId: string | null;
  fromTemplateVersion: number | null;
  archivedAt: string | null;
  createdAt: string;
  updatedAt: string;
};

/** One row of the Lessons list. */
export interface LessonSummary {
  id: string;
  title: string;
  classGroup: string;
  status: LessonStatus;
  diceSetId: string | null;
  diceSetName: string | null;
  durationMinutes: number;
  groups: number;
  rollsPerGroup: number;
  attachmentCount: number;
  fromTemplateId: string | null;
  fromTemplateVersion: number | null;
  archivedAt: string | null;
  updatedAt: string;
}

/** The dice set frozen inside a lesson snapshot (for Department shelf templates). */
export const lessonSnapshotDiceSetSchema = z.object({
  id: z.uuid().nullable(),
  name: z.string(),
  description: z.string(),
  dice: setDiceSchema,
});

/**
 * A lesson frozen in full, with its dice set's dice, as a Department shelf template version stores it.
 * `lesson` is a complete lesson input, so copying a template is `insertLesson(tx, { input: snapshot.lesson, … })`.
 */
export const lessonSnapshotSchema = z.object({
  lesson: lessonInputSchema,
  diceSet: lessonSnapshotDiceSetSchema.nullable(),
});
export type LessonSnapshot = z.infer<typeof lessonSnapshotSchema>;
