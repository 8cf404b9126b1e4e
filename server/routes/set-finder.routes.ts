import { Router } from "express";
import { setFinderRequestSchema, setFinderSearchIdParamsSchema } from "@shared/schemas/set-finder";
import { currentTeacher, requireTeacher } from "../middleware/require-teacher";
import { parseBody, parseParams } from "../middleware/validate";
import { cancelSearch, getSearch, listRecentSearches, startSearch } from "../services/set-finder.service";

export const setFinderRouter = Router();

setFinderRouter.use(requireTeacher);

setFinderRouter.post("/searches", async (req, res) => {
  res.status(202).json(await startSearch(currentTeacher(req), parseBody(setFinderRequestSchema, req)));
});

setFinderRouter.get("/searches", async (req, res) => {
  res.json(await listRecentSearches(currentTeacher(req)));
});

setFinderRouter.get("/searches/:id", async (req, res) => {
  const { id } = parseParams(setFinderSearchIdParamsSchema, req);
  res.json(await getSearch(currentTeacher(req), id));
});

setFinderRouter.delete("/searches/:id", async (req, res) => {
  const { id } = parseParams(setFinderSearchIdParamsSchema, req);
  const job = await cancelSearch(currentTeacher(req), id);
  res.json({ status: job.status, job });
});
