import type { RequestHandler } from "express";
import { fromNodeHeaders } from "better-auth/node";
import type { DepartmentRole } from "@shared/schemas/roles";
import { auth } from "../auth";
import { HttpError } from "../http-error";
import { findMembershipForUser } from "../db/queries/memberships";

export type TeacherContext = {
  user: { id: string; name: string; email: string };
  department: { id: string; name: string } | null;
  role: DepartmentRole | null;
};

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      teacher?: TeacherContext;
    }
  }
}

/** 401 without a session; otherwise attaches the teacher, their department and role to the request. */
export const requireTeacher: RequestHandler = async (req, _res, next) => {
  const current = await auth.api.getSession({ headers: fromNodeHeaders(req.headers) });
  if (!current) throw new HttpError(401, "unauthenticated", "Sign in to continue.");
  const membership = await findMembershipForUser(current.user.id);
  req.teacher = {
    user: { id: current.user.id, name: current.user.name, email: current.user.email },
    department: membership ? { id: membership.departmentId, name: membership.departmentName } : null,
    role: membership?.role ?? null,
  };
  next();
};

/** 403 unless the signed-in teacher holds one of the roles in their department (use after requireTeacher). */
export function requireRole(...roles: DepartmentRole[]): RequestHandler {
  return (req, _res, next) => {
    const role = req.teacher?.role;
    if (!role || !roles.includes(role)) {
      const wanted = roles.map((r) => (r === "head" ? "a head of department" : "a teacher")).join(" or ");
      throw new HttpError(403, "forbidden", `Only ${wanted} may do this.`);
    }
    next();
  };
}

/** The teacher on a request that passed requireTeacher. */
export function currentTeacher(req: Express.Request): TeacherContext {
  if (!req.teacher) throw new HttpError(401, "unauthenticated", "Sign in to continue.");
  return req.teacher;
}
