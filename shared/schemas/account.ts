import { z } from "zod";
import { departmentRoleSchema } from "./roles";

export const passwordSchema = z.string().min(10, "Use at least 10 characters.").max(128, "Use at most 128 characters.");

/** A teacher's name as colleagues see it: 2 to 80 characters once trimmed (sign-up and account changes alike). */
export const teacherNameSchema = z
  .string({ error: "Enter your name as colleagues know it." })
  .trim()
  .min(2, "Enter your name as colleagues know it.")
  .max(80, "Use at most 80 characters for your name.");

export const signInSchema = z.object({
  email: z.email("Enter an e-mail address such as name@school.test."),
  password: z.string().min(1, "Enter your password."),
});
export type SignInInput = z.infer<typeof signInSchema>;

export const signUpSchema = z.object({
  name: teacherNameSchema,
  email: z.email("Enter an e-mail address such as name@school.test."),
  password: passwordSchema,
  departmentName: z.string().trim().min(3, "Name your department, e.g. “Maths, Harbourside Academy”.").max(100),
});
export type SignUpInput = z.infer<typeof signUpSchema>;

/** What GET /api/me answers: the signed-in teacher and their department. */
export const currentTeacherSchema = z.object({
  user: z.object({ id: z.string(), name: z.string(), email: z.string() }),
  department: z.object({ id: z.string(), name: z.string() }).nullable(),
  role: departmentRoleSchema.nullable(),
});
export type CurrentTeacher = z.infer<typeof currentTeacherSchema>;

export const createDepartmentSchema = z.object({
  name: signUpSchema.shape.departmentName,
});
