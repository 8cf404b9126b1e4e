import express, { Router } from "express";
import { diceSetIdParamsSchema, diceSetInputSchema, diceSetUpdateSchema } from "@shared/schemas/dice-sets";
import { currentTeacher, requireTeacher } from "../middleware/require-teacher";
import { parseBody, parseParams } from "../middleware/validate";
import {
  createDiceSet,
  deleteDiceSet,
  duplicateDiceSet,
  exportDiceSet,
  getDiceSet,
  ImportError,
  importDiceSet,
  listDiceSets,
  updateDiceSet,
} from "../services/dice-sets.service";

export const diceSetsRouter = Router();

diceSetsRouter.use(requireTeacher);

diceSetsRouter.get("/", async (req, res) => {
  res.json({ sets: await listDiceSets(currentTeacher(req)) });
});

diceSetsRouter.post("/", async (req, res) => {
  res.status(201).json(await createDiceSet(currentTeacher(req), parseBody(diceSetInputSchema, req)));
});

// The file arrives either as JSON or as its raw text (any other content type), so a file that is not JSON still gets a list of problems.
diceSetsRouter.post(
  "/import",
  express.text({ type: (req) => !String(req.headers["content-type"] ?? "").includes("json"), limit: "200kb" }),
  async (req, res) => {
    try {
      res.status(201).json(await importDiceSet(currentTeacher(req), typeof req.body === "string" ? parseFileText(req.body) : req.body));
    } catch (error) {
      if (!(error instanceof ImportError)) throw error;
      res.status(400).json({ error: { code: error.code, message: error.message, fields: error.fields, issues: error.issues } });
    }
  },
);

diceSetsRouter.get("/:id", async (req, res) => {
  const { id } = parseParams(diceSetIdParamsSchema, req);
  res.json(await getDiceSet(currentTeacher(req), id));
});

diceSetsRouter.put("/:id", async (req, res) => {
  const { id } = parseParams(diceSetIdParamsSchema, req);
  res.json(await updateDiceSet(currentTeacher(req), id, parseBody(diceSetUpdateSchema, req)));
});

diceSetsRouter.post("/:id/duplicate", async (req, res) => {
  const { id } = parseParams(diceSetIdParamsSchema, req);
  res.status(201).json(await duplicateDiceSet(currentTeacher(req), id));
});

diceSetsRouter.delete("/:id", async (req, res) => {
  const { id } = parseParams(diceSetIdParamsSchema, req);
  await deleteDiceSet(currentTeacher(req), id);
  res.status(204).end();
});

diceSetsRouter.get("/:id/file", async (req, res) => {
  const { id } = parseParams(diceSetIdParamsSchema, req);
  const { file, fileName } = await exportDiceSet(currentTeacher(req), id);
  res
    .attachment(fileName)
    .type("application/json")
    .send(JSON.stringify(file, null, 2));
});

/** Text that is not JSON becomes a refused import with the parser's complaint, not a 500. */
function parseFileText(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch (error) {
    const detail = error instanceof Error ? error.message : "unreadable";
    throw new ImportError("The file is not valid JSON; nothing was saved.", [`The file is not valid JSON (${detail}).`]);
  }
}
