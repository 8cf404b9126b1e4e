import { Router, type RequestHandler, type Response } from "express";
import multer from "multer";
import {
  PAPER_IMPORT_MAX_BYTES,
  paperImportOptionsSchema,
  paperRunInputSchema,
  pooledQuerySchema,
  resultsExportQuerySchema,
  resultsListQuerySchema,
  resultsRunParamsSchema,
} from "@shared/schemas/results";
import { tallyGridCountsInputSchema, tallyGridRollsInputSchema } from "@shared/schemas/tally-grid";
import { HttpError } from "../http-error";
import { currentTeacher, requireTeacher } from "../middleware/require-teacher";
import { parseBody, parseParams, parseQuery } from "../middleware/validate";
import { commitPaperImport, commitTallyGridRolls, previewPaperImport, type PaperUpload } from "../services/paper-import.service";
import { getTallyGrid, saveTallyCounts } from "../services/tally-grid.service";
import { rollsCsvDownload, summaryCsvDownload, workbookDownload, type ResultsDownload } from "../services/results-export.service";
import {
  createPaperRun,
  deleteResultsRun,
  getRunResults,
  listPaperRunLessons,
  listResultsRuns,
  pooledAcrossRuns,
} from "../services/results.service";

export const resultsRouter = Router();

resultsRouter.use(requireTeacher);

const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: PAPER_IMPORT_MAX_BYTES, files: 1, fields: 4, parts: 6 } });

/** One CSV file in the "file" field; multer's limits become our error shape. */
const receiveCsv: RequestHandler = (req, res, next) => {
  upload.single("file")(req, res, (error: unknown) => {
    if (error instanceof multer.MulterError) {
      if (error.code === "LIMIT_FILE_SIZE") {
        next(
          new HttpError(
            413,
            "too_large",
            `The file is larger than ${PAPER_IMPORT_MAX_BYTES / 1024} KB; split the rolls into several files.`,
          ),
        );
      } else {
        next(new HttpError(400, "invalid_upload", "Send one CSV file in the field named file."));
      }
      return;
    }
    // busboy's own complaints (a form cut off half-way, a broken part header) are the upload's fault, not the server's.
    if (error) {
      next(
        new HttpError(
          400,
          "invalid_input",
          "The upload was cut off or damaged before it finished, so nothing was read. Choose the file and upload it again.",
        ),
      );
      return;
    }
    next();
  });
};

function uploadedCsv(file: Express.Multer.File | undefined): PaperUpload {
  if (!file) throw new HttpError(400, "no_file", "Choose the CSV file typed up from the recording sheets.");
  if (!/\.(csv|txt)$/i.test(file.originalname)) {
    throw new HttpError(415, "not_csv", "Upload a .csv file: in your spreadsheet choose “Save as” → “CSV UTF-8”.");
  }
  return { originalName: file.originalname, buffer: file.buffer };
}

async function sendDownload(res: Response, download: ResultsDownload) {
  res.setHeader("content-type", download.contentType);
  res.setHeader(
    "content-disposition",
    `attachment; filename="${download.fileName}"; filename*=UTF-8''${encodeURIComponent(download.fileName)}`,
  );
  res.setHeader("cache-control", "no-store");
  try {
    await download.write(res);
    res.end();
  } catch (error) {
    // Headers are out, so the error shape cannot follow; a cut download must not look complete.
    if (!res.headersSent) throw error;
    res.destroy(error instanceof Error ? error : undefined);
    if (!res.req.destroyed) res.req.log?.error({ err: error }, "results export failed midway");
  }
}

resultsRouter.get("/runs", async (req, res) => {
  res.json(await listResultsRuns(currentTeacher(req), parseQuery(resultsListQuerySchema, req)));
});

resultsRouter.get("/runs/:id", async (req, res) => {
  const { id } = parseParams(resultsRunParamsSchema, req);
  const { includeSimulated, includeLeftOut } = parseQuery(resultsExportQuerySchema, req);
  res.json(await getRunResults(currentTeacher(req), id, includeSimulated, includeLeftOut));
});

resultsRouter.get("/runs/:id/rolls.csv", async (req, res) => {
  const { id } = parseParams(resultsRunParamsSchema, req);
  const { includeSimulated, includeLeftOut } = parseQuery(resultsExportQuerySchema, req);
  await sendDownload(res, await rollsCsvDownload(currentTeacher(req), id, includeSimulated, includeLeftOut));
});

resultsRouter.get("/runs/:id/summary.csv", async (req, res) => {
  const { id } = parseParams(resultsRunParamsSchema, req);
  const { includeSimulated, includeLeftOut } = parseQuery(resultsExportQuerySchema, req);
  await sendDownload(res, await summaryCsvDownload(currentTeacher(req), id, includeSimulated, includeLeftOut));
});

resultsRouter.get("/runs/:id/results.xlsx", async (req, res) => {
  const { id } = parseParams(resultsRunParamsSchema, req);
  const { includeSimulated, includeLeftOut } = parseQuery(resultsExportQuerySchema, req);
  await sendDownload(res, await workbookDownload(currentTeacher(req), id, includeSimulated, includeLeftOut));
});

resultsRouter.post("/runs/:id/paper-import/preview", receiveCsv, async (req, res) => {
  const { id } = parseParams(resultsRunParamsSchema, req);
  const options = parseBody(paperImportOptionsSchema, req);
  res.json(await previewPaperImport(currentTeacher(req), id, uploadedCsv(req.file), options));
});

resultsRouter.post("/runs/:id/paper-import", receiveCsv, async (req, res) => {
  const { id } = parseParams(resultsRunParamsSchema, req);
  const options = parseBody(paperImportOptionsSchema, req);
  const result = await commitPaperImport(currentTeacher(req), id, uploadedCsv(req.file), options);
  res.status(result.imported ? 201 : 200).json(result);
});

resultsRouter.get("/runs/:id/tally-grid", async (req, res) => {
  const { id } = parseParams(resultsRunParamsSchema, req);
  res.json(await getTallyGrid(currentTeacher(req), id));
});

resultsRouter.post("/runs/:id/tally-grid/rolls", async (req, res) => {
  const { id } = parseParams(resultsRunParamsSchema, req);
  const result = await commitTallyGridRolls(currentTeacher(req), id, parseBody(tallyGridRollsInputSchema, req));
  res.status(result.imported ? 201 : 200).json(result);
});

resultsRouter.put("/runs/:id/tally-grid/counts", async (req, res) => {
  const { id } = parseParams(resultsRunParamsSchema, req);
  res.json(await saveTallyCounts(currentTeacher(req), id, parseBody(tallyGridCountsInputSchema, req)));
});

resultsRouter.delete("/runs/:id", async (req, res) => {
  const { id } = parseParams(resultsRunParamsSchema, req);
  res.json(await deleteResultsRun(currentTeacher(req), id));
});

resultsRouter.get("/pooled", async (req, res) => {
  const query = parseQuery(pooledQuerySchema, req);
  const { includeSimulated } = parseQuery(resultsExportQuerySchema, req);
  res.json(await pooledAcrossRuns(currentTeacher(req), { ...query, includeSimulated }));
});

resultsRouter.get("/paper-runs/lessons", async (req, res) => {
  res.json(await listPaperRunLessons(currentTeacher(req)));
});

resultsRouter.post("/paper-runs", async (req, res) => {
  res.status(201).json(await createPaperRun(currentTeacher(req), parseBody(paperRunInputSchema, req)));
});
