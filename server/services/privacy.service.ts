import type { PrivacyNoticeSettings } from "@shared/schemas/privacy";
import { env } from "../env";

/** The controller's contact from the environment (PRIVACY_CONTROLLER_*); without a name there is no controller to show. */
export function privacyNoticeSettings(): PrivacyNoticeSettings {
  if (!env.PRIVACY_CONTROLLER_NAME) return { controller: null };
  return {
    controller: {
      name: env.PRIVACY_CONTROLLER_NAME,
      email: env.PRIVACY_CONTROLLER_EMAIL ?? null,
      postalAddress: env.PRIVACY_CONTROLLER_ADDRESS ?? null,
    },
  };
}
