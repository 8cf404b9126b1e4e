import { Router } from "express";
import { listReceivedMail } from "../services/dev-mail.service";

/** Development only: the messages the local fake mail server received (404 when real mail is configured). */
export const devMailRouter = Router();

devMailRouter.get("/mail", async (req, res) => {
  res.json(await listReceivedMail(req.ip));
});
