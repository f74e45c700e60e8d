/**
 * The one way the client talks to the REST API: same-origin cookies, JSON in and out, and every
 * non-2xx answer turned into an ApiError parsed from the contract's error shape
 * `{"error": {"code", "message", "fields"?}}`, so forms and toasts can show it in place.
 */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fields: Record<string, string>;

  constructor(status: number, code: string, message: string, fields: Record<string, string> = {}) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.fields = fields;
  }
}

export function isApiError(err: unknown): err is ApiError {
  return err instanceof ApiError;
}

type Method = 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';

interface ErrorBody {
  error?: { code?: unknown; message?: unknown; fields?: unknown };
}

function stringFields(raw: unknown): Record<string, string> {
  if (!raw || typeof raw !== 'object') return {};
  const out: Record<string, string> = {};
  for (const [key, value] of Object.entries(raw as Record<string, unknown>)) {
    if (typeof value === 'string') out[key] = value;
  }
  return out;
}

async function toApiError(res: Response): Promise<ApiError> {
  let body: ErrorBody | null = null;
  try {
    body = (await res.json()) as ErrorBody;
  } catch {
    // A proxy or a crashed server may answer with HTML or nothing; fall back to the status line.
  }
  const err = body?.error;
  const code = typeof err?.code === 'string' ? err.code : `http_${res.status}`;
  const message =
    typeof err?.message === 'string' ? err.message : `The server answered ${res.status} ${res.statusText}`.trim();
  return new ApiError(res.status, code, message, stringFields(err?.fields));
}

/** Sends one request to `/api…`; resolves with the parsed JSON body (undefined for 204). */
export async function apiRequest<T>(method: Method, path: string, body?: unknown): Promise<T> {
  let res: Response;
  try {
    res = await fetch(path, {
      method,
      credentials: 'same-origin',
      headers: body === undefined ? { Accept: 'application/json' } : { Accept: 'application/json', 'Content-Type': 'application/json' },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
  } catch {
    throw new ApiError(0, 'network_error', 'Could not reach the Gatefold server. Check your connection and try again.');
  }
  if (!res.ok) throw await toApiError(res);
  if (res.status === 204) return undefined as T;
  const text = await res.text();
  return (text ? JSON.parse(text) : undefined) as T;
}

export const api = {
  get: <T>(path: string) => apiRequest<T>('GET', path),
  post: <T>(path: string, body?: unknown) => apiRequest<T>('POST', path, body ?? {}),
  patch: <T>(path: string, body: unknown) => apiRequest<T>('PATCH', path, body),
  delete: <T = void>(path: string) => apiRequest<T>('DELETE', path),
};

/** A human sentence for any thrown value (toasts, error states). */
export function errorMessage(err: unknown): string {
  if (isApiError(err)) return err.message;
  if (err instanceof Error) return err.message;
  return 'Something went wrong.';
}
