// Browser-side calls to the stock API; the server checks the role on every one of them.
import type { FieldIssue } from "@/lib/errors";

export class StockApiError extends Error {
  constructor(
    message: string,
    readonly status: number,
    readonly issues: FieldIssue[] = [],
  ) {
    super(message);
  }
}

export const stockUrl = (slug: string, path = "") => `/api/v1/labs/${encodeURIComponent(slug)}/stock${path}`;

export async function readApiError(res: Response): Promise<StockApiError> {
  const body = (await res.json().catch(() => null)) as { error?: { message?: string; issues?: FieldIssue[] } } | null;
  const fallback =
    res.status === 403
      ? "Your role in this lab does not allow this change."
      : `The server answered ${res.status}. Please try again.`;
  return new StockApiError(body?.error?.message ?? fallback, res.status, body?.error?.issues ?? []);
}

export async function stockRequest<T>(method: "POST" | "PATCH" | "DELETE", url: string, body?: unknown): Promise<T> {
  let res: Response;
  try {
    res = await fetch(url, {
      method,
      headers: body === undefined ? undefined : { "content-type": "application/json" },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
  } catch {
    throw new StockApiError("Could not reach the server. Check your connection and try again; nothing was changed.", 0);
  }
  if (!res.ok) throw await readApiError(res);
  return (await res.json()) as T;
}
