import type { z } from 'zod';
import { apiErrorSchema, type ApiErrorDetail } from '@shared/schemas/errors';

/** An error reply from the API (or a failure to reach it), with what the UI needs to show it. */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly details: ApiErrorDetail[];

  constructor(status: number, code: string, message: string, details: ApiErrorDetail[] = []) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.details = details;
  }

  /** Field problems keyed by dotted path, for mapping onto form fields. */
  fieldErrors(): Record<string, string> {
    const out: Record<string, string> = {};
    for (const d of this.details) if (!(d.path in out)) out[d.path] = d.message;
    return out;
  }
}

export function isApiError(error: unknown, status?: number): error is ApiError {
  return error instanceof ApiError && (status === undefined || error.status === status);
}

type ClientHooks = {
  /** The CSRF token of the current session, sent on every write. */
  getCsrfToken: () => string | undefined;
  /** Called when a request answers 401: the session has ended. */
  onUnauthorized: () => void;
};

let hooks: ClientHooks = { getCsrfToken: () => undefined, onUnauthorized: () => {} };

/** The app's provider wires the client to the session held in the query cache. */
export function configureApiClient(next: ClientHooks) {
  hooks = next;
}

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

type RequestOptions<S extends z.ZodType | undefined> = {
  method?: Method;
  body?: unknown;
  /** Parses the reply; leave out for replies without a body (204, 202). */
  schema?: S;
  signal?: AbortSignal;
  /** The session probe handles its own 401 (it means "signed out", not "session lost"). */
  ignoreUnauthorized?: boolean;
};

type Result<S> = S extends z.ZodType ? z.infer<S> : void;

const WRITE_METHODS: ReadonlySet<Method> = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

export async function apiRequest<S extends z.ZodType | undefined = undefined>(
  url: string,
  options: RequestOptions<S> = {},
): Promise<Result<S>> {
  const method = options.method ?? 'GET';
  const headers: Record<string, string> = { Accept: 'application/json' };
  if (options.body !== undefined) headers['Content-Type'] = 'application/json';
  if (WRITE_METHODS.has(method)) {
    const csrf = hooks.getCsrfToken();
    if (csrf) headers['X-CSRF-Token'] = csrf;
  }

  let response: Response;
  try {
    response = await fetch(url, {
      method,
      headers,
      credentials: 'same-origin',
      body: options.body === undefined ? undefined : JSON.stringify(options.body),
      signal: options.signal,
    });
  } catch (cause) {
    if (cause instanceof DOMException && cause.name === 'AbortError') throw cause;
    throw new ApiError(
      0,
      'network_error',
      'The server could not be reached. Check your connection and try again.',
    );
  }

  const text = await response.text();
  let payload: unknown = undefined;
  if (text) {
    try {
      payload = JSON.parse(text);
    } catch {
      payload = undefined;
    }
  }

  if (!response.ok) {
    if (response.status === 401 && !options.ignoreUnauthorized) hooks.onUnauthorized();
    const parsed = apiErrorSchema.safeParse(payload);
    if (parsed.success) {
      const { code, message, details } = parsed.data.error;
      throw new ApiError(response.status, code, message, details ?? []);
    }
    throw new ApiError(
      response.status,
      'unexpected_reply',
      `The server answered ${response.status} ${response.statusText}.`.trim(),
    );
  }

  if (!options.schema) return undefined as Result<S>;
  const parsed = options.schema.safeParse(payload);
  if (!parsed.success) {
    throw new ApiError(
      response.status,
      'invalid_reply',
      'The server sent a reply this page does not understand. Reload and try again.',
    );
  }
  return parsed.data as Result<S>;
}
