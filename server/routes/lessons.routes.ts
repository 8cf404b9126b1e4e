import { Router, type RequestHandler } from "express";
import multer from "multer";
import {
  ATTACHMENT_BYTES_MAX,
  lessonArchiveSchema,
  lessonAttachmentParamsSchema,
  lessonIdParamsSchema,
  lessonInputSchema,
  lessonListQuerySchema,
  lessonUpdateSchema,
} from "@shared/schemas/lessons";
import { HttpError } from "../http-error";
import { currentTeacher, requireRole, requireTeacher } from "../middleware/require-teacher";
import { parseBody, parseParams, parseQuery } from "../middleware/validate";
import {
  addAttachment,
  archiveLesson,
  assertMayAttach,
  createLesson,
  deleteLesson,
  duplicateLesson,
  listAttachments,
  listLessons,
  readAttachment,
  readLesson,
  removeAttachment,
  updateLesson,
} from "../services/lessons.service";

export const lessonsRouter = Router();

lessonsRouter.use(requireTeacher, requireRole("head", "teacher"));

// Browsers send file names as raw UTF-8 without a charset parameter, so read them as UTF-8, not multer's default latin1.
const upload = multer({
  storage: multer.memoryStorage(),
  defParamCharset: "utf8",
  limits: { fileSize: ATTACHMENT_BYTES_MAX, files: 1, fields: 5 },
});

/** Reads one multipart file field "file"; multer's own errors become our error shape. */
const receiveFile: RequestHandler = (req, res, next) => {
  upload.single("file")(req, res, (error: unknown) => {
    if (!error) return next();
    if (error instanceof multer.MulterError) {
      if (error.code === "LIMIT_FILE_SIZE")
        return next(new HttpError(413, "too_large", "That file is larger than 10 MB; attach a smaller one."));
      return next(new HttpError(400, "invalid_upload", 'Send one file in the form field "file".'));
    }
    // busboy's own complaints (a form cut off half-way, a broken part header) are the upload's fault, not the server's.
    next(
      new HttpError(
        400,
        "invalid_input",
        "The upload was cut off or damaged before it finished, so nothing was stored. Choose the file and attach it again.",
      ),
    );
  });
};

/** Ownership is checked before the upload body is read, so a refused teacher never streams 10 MB to us. */
const ownerMayAttach: RequestHandler = async (req, _res, next) => {
  await assertMayAttach(currentTeacher(req), parseParams(lessonIdParamsSchema, req).id);
  next();
};

lessonsRouter.get("/", async (req, res) => {
  res.json({ lessons: await listLessons(currentTeacher(req), parseQuery(lessonListQuerySchema, req)) });
});

lessonsRouter.post("/", async (req, res) => {
  res.status(201).json({ lesson: await createLesson(currentTeacher(req), parseBody(lessonInputSchema, req)) });
});

lessonsRouter.get("/:id", async (req, res) => {
  res.json(await readLesson(currentTeacher(req), parseParams(lessonIdParamsSchema, req).id));
});

lessonsRouter.put("/:id", async (req, res) => {
  const { id } = parseParams(lessonIdParamsSchema, req);
  res.json({ lesson: await updateLesson(currentTeacher(req), id, parseBody(lessonUpdateSchema, req)) });
});

lessonsRouter.post("/:id/duplicate", async (req, res) => {
  res.status(201).json({ lesson: await duplicateLesson(currentTeacher(req), parseParams(lessonIdParamsSchema, req).id) });
});

lessonsRouter.post("/:id/archive", async (req, res) => {
  const { id } = parseParams(lessonIdParamsSchema, req);
  const { archived } = parseBody(lessonArchiveSchema, req);
  res.json({ lesson: await archiveLesson(currentTeacher(req), id, archived) });
});

lessonsRouter.delete("/:id", async (req, res) => {
  await deleteLesson(currentTeacher(req), parseParams(lessonIdParamsSchema, req).id);
  res.status(204).end();
});

lessonsRouter.get("/:id/attachments", async (req, res) => {
  res.json({ attachments: await listAttachments(currentTeacher(req), parseParams(lessonIdParamsSchema, req).id) });
});

lessonsRouter.post("/:id/attachments", ownerMayAttach, receiveFile, async (req, res) => {
  const { id } = parseParams(lessonIdParamsSchema, req);
  const file = req.file ? { originalName: req.file.originalname, bytes: req.file.buffer } : undefined;
  res.status(201).json({ attachment: await addAttachment(currentTeacher(req), id, file) });
});

/** RFC 6266 Content-Disposition with an ASCII fallback and the UTF-8 name (RFC 5987). */
function contentDisposition(fileName: string, kind: "inline" | "attachment"): string {
  const fallback = fileName.replace(/[^\x20-\x7e]/g, "_").replace(/["\\]/g, "_");
  return `${kind}; filename="${fallback}"; filename*=UTF-8''${encodeURIComponent(fileName)}`;
}

lessonsRouter.get("/:id/attachments/:attachmentId", async (req, res) => {
  const { id, attachmentId } = parseParams(lessonAttachmentParamsSchema, req);
  const { attachment, bytes } = await readAttachment(currentTeacher(req), id, attachmentId);
  res.set({
    "Content-Type": attachment.mimeType,
    "Content-Length": String(bytes.length),
    "Content-Disposition": contentDisposition(attachment.fileName, req.query.download === "1" ? "attachment" : "inline"),
    "X-Content-Type-Options": "nosniff",
    "Cache-Control": "private, no-store",
  });
  res.end(bytes);
});

lessonsRouter.delete("/:id/attachments/:attachmentId", async (req, res) => {
  const { id, attachmentId } = parseParams(lessonAttachmentParamsSchema, req);
  await removeAttachment(currentTeacher(req), id, attachmentId);
  res.status(204).end();
});
