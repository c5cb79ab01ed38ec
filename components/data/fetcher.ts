/** SWR's fetcher for our own /api/v1: JSON in, problem documents turned into errors with their detail. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly body: unknown,
  ) {
    super(message);
  }
}

export async function fetchJson<T>(url: string, init?: RequestInit): Promise<T> {
  const res = await fetch(url, { ...init, headers: { accept: "application/json", ...init?.headers } });
  const body: unknown = await res.json().catch(() => null);
  if (!res.ok) {
    const problem = (body ?? {}) as { code?: string; detail?: string };
    throw new ApiError(res.status, problem.code ?? "http_error", problem.detail ?? `Request failed (${res.status}).`, body);
  }
  return body as T;
}

/** How often live pages ask for changes: well inside the 5 s a status change must take to show. */
export const LIVE_REFRESH_MS = 2_500;
