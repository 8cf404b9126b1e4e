import { lessonSnapshotSchema, type LessonSnapshot } from "@shared/schemas/lessons";
import type { Database } from "../server/db/client";
import { buildLessonSnapshot, findLessonByOwnerAndTitle } from "../server/db/queries/lessons";
import { findTemplateByTitle, insertTemplate, insertTemplateVersion, setTemplateCurrentVersion } from "../server/db/queries/shelf";
import { demoTeachers } from "./demo-scenario";

type DemoTemplate = {
  lessonTitle: string;
  /** Older versions first, each made from the lesson as it is now by `change`; the lesson itself is the last version. */
  earlier: { changeNote: string; change: (lesson: LessonSnapshot["lesson"]) => LessonSnapshot["lesson"] }[];
  changeNote: string;
};

/** Priya Castellanos's two demo templates on the Harbourside shelf (our own scenario); the first has two versions. */
export const demoTemplates: DemoTemplate[] = [
  {
    lessonTitle: "Relative frequency settles down",
    earlier: [
      {
        changeNote: "First version, for 9M: twenty rolls per group.",
        change: (lesson) => ({
          ...lesson,
          rollsPerGroup: 20,
          phases: lesson.phases.map((phase) => (phase.phase === "Pool" ? { ...phase, minutes: 10, notes: "" } : phase)),
        }),
      },
    ],
    changeNote: "Thirty rolls per group instead of twenty, so the pooled share settles; the Pool phase now plots the running share.",
  },
  {
    lessonTitle: "When two dice change the winner",
    earlier: [],
    changeNote: "First version: two dice each from the start, for 8K.",
  },
];

/**
 * Publishes the demo templates from the head's demo lessons. Looks each template up by title first, so a second run adds
 * nothing; a demo lesson that is not there (the lessons step did not run) is skipped.
 */
export async function seedShelf(db: Database, teachers: { departmentId: string; teacherIds: Map<string, string> }) {
  const head = demoTeachers.find((teacher) => teacher.role === "head")!;
  const headId = teachers.teacherIds.get(head.email);
  const templateIds: string[] = [];
  if (!headId) return { templateIds };
  for (const demo of demoTemplates) {
    const existing = await findTemplateByTitle(db, teachers.departmentId, demo.lessonTitle);
    if (existing) {
      templateIds.push(existing.id);
      continue;
    }
    const source = await findLessonByOwnerAndTitle(db, headId, demo.lessonTitle);
    if (!source) continue;
    const id = await db.transaction(async (tx) => {
      const current = lessonSnapshotSchema.parse(await buildLessonSnapshot(tx, source.id));
      const versions = [
        ...demo.earlier.map((entry) => ({ changeNote: entry.changeNote, snapshot: { ...current, lesson: entry.change(current.lesson) } })),
        { changeNote: demo.changeNote, snapshot: current },
      ];
      const template = await insertTemplate(tx, {
        departmentId: teachers.departmentId,
        title: demo.lessonTitle,
        sourceLessonId: source.id,
        createdById: headId,
      });
      for (const [index, version] of versions.entries()) {
        await insertTemplateVersion(tx, {
          templateId: template.id,
          version: index + 1,
          changeNote: version.changeNote,
          snapshot: lessonSnapshotSchema.parse(version.snapshot),
          publishedById: headId,
        });
      }
      await setTemplateCurrentVersion(tx, template.id, versions.length, demo.lessonTitle);
      return template.id;
    });
    templateIds.push(id);
  }
  return { templateIds };
}
