// The one way the client talks to the server: same-origin JSON with the session cookie.
// Every failure becomes an ApiError carrying the server's code, message and field errors.

export type FieldErrors = Record<string, string>;

export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fields: FieldErrors | undefined;

  constructor(status: number, code: string, message: string, fields?: FieldErrors) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.fields = fields;
  }
}

export function isApiError(error: unknown): error is ApiError {
  return error instanceof ApiError;
}

type RequestOptions = {
  method?: 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';
  body?: unknown;
  signal?: AbortSignal;
};

const FALLBACK_MESSAGES: Record<number, string> = {
  401: 'Please sign in to continue.',
  403: 'Your role does not allow this.',
  404: 'Not found.',
  429: 'Too many attempts. Wait a minute and try again.',
};

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

function readFields(value: unknown): FieldErrors | undefined {
  if (!isRecord(value)) return undefined;
  const fields: FieldErrors = {};
  for (const [name, message] of Object.entries(value)) {
    if (typeof message === 'string') fields[name] = message;
    else if (Array.isArray(message) && typeof message[0] === 'string') fields[name] = message[0];
  }
  return Object.keys(fields).length > 0 ? fields : undefined;
}

async function toApiError(response: Response): Promise<ApiError> {
  let payload: unknown;
  try {
    payload = await response.json();
  } catch {
    payload = undefined;
  }
  const error = isRecord(payload) && isRecord(payload.error) ? payload.error : undefined;
  const code = typeof error?.code === 'string' ? error.code : `http_${response.status}`;
  const message =
    typeof error?.message === 'string' && error.message.length > 0
      ? error.message
      : (FALLBACK_MESSAGES[response.status] ?? `The server answered ${response.status}. Try again.`);
  return new ApiError(response.status, code, message, readFields(error?.fields));
}

export async function apiRequest<T>(path: string, options: RequestOptions = {}): Promise<T> {
  const { method = 'GET', body, signal } = options;
  const headers: Record<string, string> = { Accept: 'application/json' };
  if (body !== undefined) headers['Content-Type'] = 'application/json';

  let response: Response;
  try {
    response = await fetch(path, {
      method,
      headers,
      body: body === undefined ? undefined : JSON.stringify(body),
      credentials: 'same-origin',
      signal,
    });
  } catch (cause) {
    if (cause instanceof DOMException && cause.name === 'AbortError') throw cause;
    throw new ApiError(0, 'network', 'Could not reach the Baywright server. Check your connection.');
  }

  if (!response.ok) throw await toApiError(response);
  if (response.status === 204) return undefined as T;
  const text = await response.text();
  return (text.length > 0 ? JSON.parse(text) : undefined) as T;
}

export const api = {
  get: <T>(path: string, signal?: AbortSignal) => apiRequest<T>(path, { signal }),
  post: <T>(path: string, body?: unknown) => apiRequest<T>(path, { method: 'POST', body }),
  patch: <T>(path: string, body?: unknown) => apiRequest<T>(path, { method: 'PATCH', body }),
  delete: <T = void>(path: string) => apiRequest<T>(path, { method: 'DELETE' }),
};
