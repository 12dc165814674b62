/** The JSON error shape every route handler returns. */
export type ApiErrorBody = { error: { code: string; message: string; fieldErrors?: Record<string, string[]>; [k: string]: unknown } };

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly body: ApiErrorBody["error"],
  ) {
    super(body.message);
  }
  get fieldErrors(): Record<string, string[]> {
    return this.body.fieldErrors ?? {};
  }
}

/** fetch() for our route handlers: JSON in, JSON out, errors as ApiError with their message. */
export async function fetchJson<T>(url: string, init?: RequestInit & { json?: unknown }): Promise<T> {
  const { json, ...rest } = init ?? {};
  let res: Response;
  try {
    res = await fetch(url, {
      ...rest,
      headers: { Accept: "application/json", ...(json !== undefined ? { "Content-Type": "application/json" } : {}), ...rest.headers },
      body: json !== undefined ? JSON.stringify(json) : rest.body,
    });
  } catch {
    throw new ApiError(0, { code: "offline", message: "Could not reach Meniscus. Check your connection and try again." });
  }
  const text = await res.text();
  let body: unknown = null;
  try {
    body = text ? JSON.parse(text) : null;
  } catch {
    body = null;
  }
  if (!res.ok) {
    const err = (body as ApiErrorBody | null)?.error ?? { code: String(res.status), message: res.status === 401 ? "Your session has ended. Please sign in again." : "Something went wrong. Please try again." };
    throw new ApiError(res.status, err);
  }
  return body as T;
}
