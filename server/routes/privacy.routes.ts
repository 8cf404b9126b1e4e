import { Router } from "express";
import { privacyNoticeSettings } from "../services/privacy.service";

/** The public privacy notice's settings: anyone, signed in or not, may read who the controller is. */
export const privacyRouter = Router();

privacyRouter.get("/", (_req, res) => {
  res.json(privacyNoticeSettings());
});
