import { apiErrorSchema } from "@shared/schemas/errors";

/** An API answer that was not 2xx, carrying the server's code, message and field errors. */
export class ApiRequestError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields: Record<string, string[]> = {},
    /** Plain messages listing what is wrong, when the server sends them (e.g. a refused file). */
    readonly issues: string[] = [],
  ) {
    super(message);
    this.name = "ApiRequestError";
  }
}

type Body = Record<string, unknown> | unknown[] | FormData;

/** The one fetch layer: same-origin JSON with cookies; errors become ApiRequestError. */
export async function apiRequest<T>(method: string, url: string, body?: Body): Promise<T> {
  const isForm = body instanceof FormData;
  let response: Response;
  try {
    response = await fetch(url, {
      method,
      credentials: "same-origin",
      headers: body && !isForm ? { "content-type": "application/json" } : undefined,
      body: body === undefined ? undefined : isForm ? body : JSON.stringify(body),
    });
  } catch {
    throw new ApiRequestError(0, "offline", "Outroll's server could not be reached. Check the connection and try again.");
  }
  if (response.status === 204) return undefined as T;
  const text = await response.text();
  const data: unknown = text ? JSON.parse(text) : undefined;
  if (!response.ok) {
    const parsed = apiErrorSchema.safeParse(data);
    if (parsed.success) {
      const { code, message, fields } = parsed.data.error;
      const issues = (data as { error: { issues?: unknown } }).error.issues;
      const issueList = Array.isArray(issues) ? issues.filter((issue): issue is string => typeof issue === "string") : [];
      throw new ApiRequestError(response.status, code, message, fields, issueList);
    }
    const message = (data as { message?: string } | undefined)?.message ?? `The server answered ${response.status}.`;
    throw new ApiRequestError(response.status, "request_failed", message);
  }
  return data as T;
}

export const api = {
  get: <T>(url: string) => apiRequest<T>("GET", url),
  post: <T>(url: string, body?: Body) => apiRequest<T>("POST", url, body ?? {}),
  put: <T>(url: string, body: Body) => apiRequest<T>("PUT", url, body),
  patch: <T>(url: string, body: Body) => apiRequest<T>("PATCH", url, body),
  delete: <T>(url: string) => apiRequest<T>("DELETE", url),
};
