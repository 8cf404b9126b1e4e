import { z } from "zod";
import { passwordSchema, signInSchema } from "./account";

/** How long a password-reset link works, in minutes (better-auth's resetPasswordTokenExpiresIn). */
export const PASSWORD_RESET_MINUTES = 60;

/** The "Forgot your password?" form. */
export const passwordResetRequestSchema = z.object({ email: signInSchema.shape.email });
export type PasswordResetRequestInput = z.infer<typeof passwordResetRequestSchema>;

/** The form behind the e-mailed link: the new password, typed twice. */
export const passwordResetSchema = z
  .object({ newPassword: passwordSchema, confirmPassword: z.string() })
  .refine((values) => values.newPassword === values.confirmPassword, {
    message: "The two passwords are not the same.",
    path: ["confirmPassword"],
  });
export type PasswordResetInput = z.infer<typeof passwordResetSchema>;

/** Query of the /reset-password page: the token from the e-mailed link. */
export const passwordResetQuerySchema = z.object({ token: z.string().min(8).max(200) });
