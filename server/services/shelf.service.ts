import { lessonSnapshotSchema, type LessonSnapshot } from "@shared/schemas/lessons";
import type {
  ApproveProposalInput,
  CopiedLesson,
  CopyTemplateInput,
  DeclineProposalInput,
  ProposeLessonInput,
  PublishTemplateInput,
  PublishVersionInput,
  ShelfProposal,
  TemplateDetail,
  TemplateStatus,
  TemplateSummary,
  WaitingProposals,
} from "@shared/schemas/shelf";
import type { SetDie } from "@shared/schemas/dice-sets";
import { db, type Executor } from "../db/client";
import { findOwnedDiceSetByName, insertDiceSet } from "../db/queries/dice-sets";
import { buildLessonSnapshot, findDiceSetReadableBy, findLessonById, insertLesson, lockLesson } from "../db/queries/lessons";
import {
  countPendingProposals,
  decideProposal,
  deleteProposal,
  findPendingProposalForLesson,
  findTemplate,
  findTemplateVersion,
  insertProposal,
  insertTemplate,
  insertTemplateVersion,
  listProposals,
  listTemplates,
  listTemplateVersions,
  lockProposal,
  lockTemplate,
  setTemplateCurrentVersion,
  setTemplateStatus,
  type TemplateWithCurrentVersion,
} from "../db/queries/shelf";
import { fieldErrors } from "../middleware/error-handler";
import { HttpError, notFound } from "../http-error";
import type { TeacherContext } from "../middleware/require-teacher";

function departmentOf(teacher: TeacherContext) {
  if (!teacher.department) throw new HttpError(403, "no_department", "Join or create a department first.");
  return teacher.department;
}

/** A stored snapshot, checked again on the way out so a copy is always a valid lesson. */
function readSnapshot(value: unknown): LessonSnapshot {
  const parsed = lessonSnapshotSchema.safeParse(value);
  if (!parsed.success) {
    throw new HttpError(
      500,
      "template_unreadable",
      "This template version cannot be read; ask your head of department to publish it again.",
    );
  }
  return parsed.data;
}

/** A lesson frozen for the shelf; refused with the lesson's own field errors when it is not a complete plan. */
async function publishableSnapshot(executor: Executor, lessonId: string): Promise<LessonSnapshot> {
  const snapshot = await buildLessonSnapshot(executor, lessonId);
  if (!snapshot) throw new HttpError(409, "lesson_gone", "The lesson was deleted, so it cannot go on the shelf.");
  const parsed = lessonSnapshotSchema.safeParse(snapshot);
  if (!parsed.success) {
    throw new HttpError(
      409,
      "lesson_not_publishable",
      "The lesson is not complete enough for the shelf; open it, fix what is marked and try again.",
      fieldErrors(parsed.error),
    );
  }
  return parsed.data;
}

/** The teacher's own lesson, or 404 (another teacher's lesson is not revealed). */
async function ownLesson(executor: Executor, teacher: TeacherContext, lessonId: string) {
  const record = await findLessonById(executor, lessonId);
  if (!record || record.ownerId !== teacher.user.id) throw notFound("The lesson");
  return record;
}

function summaryOf(row: TemplateWithCurrentVersion): TemplateSummary {
  const snapshot = readSnapshot(row.current.snapshot);
  return {
    id: row.template.id,
    title: row.template.title,
    status: row.template.status,
    currentVersion: row.template.currentVersion,
    classGroup: snapshot.lesson.classGroup,
    diceSetName: snapshot.diceSet?.name ?? null,
    durationMinutes: snapshot.lesson.durationMinutes,
    phases: snapshot.lesson.phases.filter((phase) => phase.included).map((phase) => phase.phase),
    objectiveCount: snapshot.lesson.objectives.length,
    changeNote: row.current.changeNote,
    publishedAt: row.current.publishedAt.toISOString(),
    publishedByName: row.publishedByName,
    proposedByName: row.proposedByName,
    createdAt: row.template.createdAt.toISOString(),
  };
}

/** A template the teacher may see: their department's, and for teachers only while it is published. */
async function visibleTemplate(executor: Executor, teacher: TeacherContext, templateId: string) {
  const found = await findTemplate(executor, templateId, departmentOf(teacher).id);
  if (!found || (found.template.status === "retired" && teacher.role !== "head")) throw notFound("The template");
  return found;
}

async function detailOf(executor: Executor, teacher: TeacherContext, templateId: string, version?: number): Promise<TemplateDetail> {
  const found = await visibleTemplate(executor, teacher, templateId);
  const versions = await listTemplateVersions(executor, templateId);
  const shownVersion = version ?? found.template.currentVersion;
  const shown = await findTemplateVersion(executor, templateId, shownVersion);
  if (!shown) throw notFound(`Version ${shownVersion} of this template`);
  return {
    template: summaryOf(found),
    versions: versions.map((entry) => ({ ...entry, publishedAt: entry.publishedAt.toISOString() })),
    shown: {
      version: shown.version.version,
      changeNote: shown.version.changeNote,
      publishedAt: shown.version.publishedAt.toISOString(),
      publishedByName: shown.publishedByName,
      proposedByName: shown.proposedByName,
      snapshot: readSnapshot(shown.version.snapshot),
    },
  };
}

/** The shelf: published templates for every member; retired ones for the head of department only. */
export async function listShelfTemplates(teacher: TeacherContext, status: TemplateStatus): Promise<TemplateSummary[]> {
  const department = departmentOf(teacher);
  if (status === "retired" && teacher.role !== "head") {
    throw new HttpError(403, "forbidden", "Only a head of department may list retired templates.");
  }
  const rows = await listTemplates(db, department.id, status);
  return rows.map(summaryOf);
}

export async function getTemplateDetail(teacher: TeacherContext, templateId: string, version?: number) {
  return detailOf(db, teacher, templateId, version);
}

/** Adds the next version to a locked, published template and makes it current. */
async function addVersion(
  tx: Executor,
  teacher: TeacherContext,
  templateId: string,
  snapshot: LessonSnapshot,
  changeNote: string,
  proposedById: string | null = null,
) {
  const template = await lockTemplate(tx, templateId, departmentOf(teacher).id);
  if (!template) throw notFound("The template");
  if (template.status === "retired") {
    throw new HttpError(409, "template_retired", "This template is retired; restore it before publishing a new version.");
  }
  const version = template.currentVersion + 1;
  await insertTemplateVersion(tx, { templateId, version, changeNote, snapshot, publishedById: teacher.user.id, proposedById });
  await setTemplateCurrentVersion(tx, templateId, version, snapshot.lesson.title);
  return version;
}

async function createTemplate(
  tx: Executor,
  teacher: TeacherContext,
  lessonId: string,
  snapshot: LessonSnapshot,
  changeNote: string,
  proposedById: string | null = null,
) {
  const template = await insertTemplate(tx, {
    departmentId: departmentOf(teacher).id,
    title: snapshot.lesson.title,
    sourceLessonId: lessonId,
    createdById: teacher.user.id,
  });
  await insertTemplateVersion(tx, {
    templateId: template.id,
    version: 1,
    changeNote,
    snapshot,
    publishedById: teacher.user.id,
    proposedById,
  });
  return template.id;
}

/** The head publishes one of their lessons as a new template: a frozen copy, version 1, with a change note. */
export async function publishTemplate(teacher: TeacherContext, input: PublishTemplateInput): Promise<TemplateDetail> {
  return db.transaction(async (tx) => {
    await ownLesson(tx, teacher, input.lessonId);
    const snapshot = await publishableSnapshot(tx, input.lessonId);
    const templateId = await createTemplate(tx, teacher, input.lessonId, snapshot, input.changeNote);
    return detailOf(tx, teacher, templateId);
  });
}

/** The head publishes one of their lessons as the template's next version; older versions stay as they were. */
export async function publishTemplateVersion(teacher: TeacherContext, templateId: string, input: PublishVersionInput) {
  return db.transaction(async (tx) => {
    await ownLesson(tx, teacher, input.lessonId);
    const snapshot = await publishableSnapshot(tx, input.lessonId);
    await addVersion(tx, teacher, templateId, snapshot, input.changeNote);
    return detailOf(tx, teacher, templateId);
  });
}

/** Takes a template off the shelf (or puts it back); lessons already copied from it keep working. */
export async function setTemplateRetired(teacher: TeacherContext, templateId: string, retired: boolean) {
  return db.transaction(async (tx) => {
    const template = await lockTemplate(tx, templateId, departmentOf(teacher).id);
    if (!template) throw notFound("The template");
    await setTemplateStatus(tx, templateId, retired ? "retired" : "published");
    return detailOf(tx, teacher, templateId);
  });
}

function sameDice(a: SetDie[], b: SetDie[]) {
  return (
    a.length === b.length &&
    a.every(
      (die, index) =>
        die.name === b[index].name &&
        die.colour === b[index].colour &&
        die.pattern === b[index].pattern &&
        die.faces.length === b[index].faces.length &&
        die.faces.every((face, faceIndex) => face === b[index].faces[faceIndex]),
    )
  );
}

/**
 * The dice set a copied lesson uses: the template's own set when the teacher can read it and its dice are unchanged,
 * else a set of theirs with the same name and dice, else a new private copy of the frozen dice.
 */
async function diceSetForCopy(tx: Executor, teacher: TeacherContext, snapshot: LessonSnapshot, title: string, version: number) {
  const frozen = snapshot.diceSet;
  if (!frozen) return null;
  const reader = { userId: teacher.user.id, departmentId: teacher.department?.id ?? null };
  if (frozen.id) {
    const original = await findDiceSetReadableBy(tx, frozen.id, reader);
    if (original && sameDice(original.dice, frozen.dice)) return original.id;
  }
  const namesake = await findOwnedDiceSetByName(teacher.user.id, frozen.name, tx);
  if (namesake) {
    const own = await findDiceSetReadableBy(tx, namesake.id, reader);
    if (own && sameDice(own.dice, frozen.dice)) return own.id;
  }
  return insertDiceSet(
    {
      ownerId: teacher.user.id,
      departmentId: teacher.department?.id ?? null,
      name: frozen.name,
      description: `Copied with the Department shelf template “${title}”, version ${version}.`,
      visibility: "private",
      dice: frozen.dice,
      duplicatedFromId: frozen.id,
    },
    tx,
  );
}

/** Copies a template version into the teacher's own lessons, in one transaction; the copy records where it came from. */
export async function copyTemplate(teacher: TeacherContext, templateId: string, input: CopyTemplateInput): Promise<CopiedLesson> {
  return db.transaction(async (tx) => {
    const found = await visibleTemplate(tx, teacher, templateId);
    if (found.template.status === "retired") {
      throw new HttpError(409, "template_retired", "This template is retired; restore it before copying it.");
    }
    const version = input.version ?? found.template.currentVersion;
    const stored = await findTemplateVersion(tx, templateId, version);
    if (!stored) throw notFound(`Version ${version} of this template`);
    const snapshot = readSnapshot(stored.version.snapshot);
    const diceSetId = await diceSetForCopy(tx, teacher, snapshot, found.template.title, version);
    const created = await insertLesson(tx, {
      ownerId: teacher.user.id,
      departmentId: teacher.department?.id ?? null,
      input: { ...snapshot.lesson, diceSetId, status: "draft" },
      fromTemplateId: templateId,
      fromTemplateVersion: version,
    });
    return { lessonId: created.id, title: created.title, fromTemplateId: templateId, fromTemplateVersion: version };
  });
}

type ProposalListRow = Awaited<ReturnType<typeof listProposals>>[number];

async function proposalOf(executor: Executor, teacher: TeacherContext, row: ProposalListRow): Promise<ShelfProposal> {
  const pending = row.proposal.status === "pending";
  return {
    id: row.proposal.id,
    lessonId: row.proposal.lessonId,
    lessonTitle: row.lessonTitle,
    proposedByName: row.proposedByName,
    isMine: row.proposal.proposedById === teacher.user.id,
    note: row.proposal.note,
    status: row.proposal.status,
    decisionNote: row.proposal.decisionNote,
    decidedByName: row.decidedByName,
    decidedAt: row.proposal.decidedAt?.toISOString() ?? null,
    createdAt: row.proposal.createdAt.toISOString(),
    preview: pending ? await buildLessonSnapshot(executor, row.proposal.lessonId) : null,
  };
}

/** The head of department sees the department's proposals; a teacher sees their own. */
export async function listShelfProposals(teacher: TeacherContext): Promise<ShelfProposal[]> {
  const department = departmentOf(teacher);
  const rows = await listProposals(db, department.id, teacher.role === "head" ? {} : { proposedById: teacher.user.id });
  return Promise.all(rows.map((row) => proposalOf(db, teacher, row)));
}

/** Proposals waiting for a decision: the department's for the head of department, a teacher's own for a teacher. */
export async function countWaitingProposals(teacher: TeacherContext): Promise<WaitingProposals> {
  const department = departmentOf(teacher);
  if (teacher.role === "head") return { waiting: await countPendingProposals(db, department.id), scope: "department" };
  return { waiting: await countPendingProposals(db, department.id, { proposedById: teacher.user.id }), scope: "mine" };
}

async function proposalById(executor: Executor, teacher: TeacherContext, proposalId: string) {
  const [row] = await listProposals(executor, departmentOf(teacher).id, { proposalId });
  if (!row) throw notFound("The proposal");
  return proposalOf(executor, teacher, row);
}

/** A teacher proposes one of their lessons for the shelf; one pending proposal per lesson. */
export async function proposeLesson(teacher: TeacherContext, input: ProposeLessonInput): Promise<ShelfProposal> {
  const department = departmentOf(teacher);
  return db.transaction(async (tx) => {
    // The lesson's row lock makes simultaneous proposals of one lesson take turns: the second sees the first's.
    await lockLesson(tx, input.lessonId);
    await ownLesson(tx, teacher, input.lessonId);
    await publishableSnapshot(tx, input.lessonId);
    if (await findPendingProposalForLesson(tx, input.lessonId)) {
      throw new HttpError(409, "already_proposed", "This lesson is already waiting for the head of department's decision.");
    }
    const proposal = await insertProposal(tx, {
      departmentId: department.id,
      lessonId: input.lessonId,
      proposedById: teacher.user.id,
      note: input.note ?? "",
    });
    return proposalById(tx, teacher, proposal.id);
  });
}

async function lockPendingProposal(tx: Executor, teacher: TeacherContext, proposalId: string) {
  const proposal = await lockProposal(tx, proposalId, departmentOf(teacher).id);
  if (!proposal) throw notFound("The proposal");
  if (proposal.status !== "pending") {
    throw new HttpError(409, "already_decided", `This proposal was already ${proposal.status}.`);
  }
  return proposal;
}

/**
 * The head approves: the lesson as it stands now goes on the shelf as a new template or as a template's next version,
 * crediting the proposing teacher beside the head who published it.
 */
export async function approveProposal(teacher: TeacherContext, proposalId: string, input: ApproveProposalInput) {
  return db.transaction(async (tx) => {
    const proposal = await lockPendingProposal(tx, teacher, proposalId);
    const snapshot = await publishableSnapshot(tx, proposal.lessonId);
    const templateId =
      input.target === "new"
        ? await createTemplate(tx, teacher, proposal.lessonId, snapshot, input.changeNote, proposal.proposedById)
        : (await addVersion(tx, teacher, input.templateId, snapshot, input.changeNote, proposal.proposedById), input.templateId);
    await decideProposal(tx, proposalId, { status: "approved", decidedById: teacher.user.id, decisionNote: input.changeNote });
    return { proposal: await proposalById(tx, teacher, proposalId), template: await detailOf(tx, teacher, templateId) };
  });
}

/** The head declines with a note the teacher reads. */
export async function declineProposal(teacher: TeacherContext, proposalId: string, input: DeclineProposalInput) {
  return db.transaction(async (tx) => {
    await lockPendingProposal(tx, teacher, proposalId);
    await decideProposal(tx, proposalId, { status: "declined", decidedById: teacher.user.id, decisionNote: input.note });
    return proposalById(tx, teacher, proposalId);
  });
}

/** The proposing teacher takes back a proposal that is still waiting. */
export async function withdrawProposal(teacher: TeacherContext, proposalId: string) {
  await db.transaction(async (tx) => {
    const proposal = await lockProposal(tx, proposalId, departmentOf(teacher).id);
    if (!proposal || proposal.proposedById !== teacher.user.id) throw notFound("The proposal");
    if (proposal.status !== "pending") throw new HttpError(409, "already_decided", `This proposal was already ${proposal.status}.`);
    await deleteProposal(tx, proposalId);
  });
}
