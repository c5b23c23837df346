import type { z } from 'zod';
import { apiErrorSchema, type ApiErrorBody, type ApiErrorDetail } from '@shared/schemas/errors';
import { parseExact } from '@shared/schemas/exact';
import { forgetEarly, takeEarly } from './early';

/**
 * Failures the client detects itself: the server could not be reached, an error reply is not
 * one the contract describes, or a success reply does not match its schema exactly.
 */
export type ClientFailure = {
  code: 'network_error' | 'unexpected_reply' | 'invalid_reply';
  message: string;
};

/** What went wrong: an error reply of the API contract (shared/schemas/errors.ts), or a client failure. */
export type ApiErrorReply = ApiErrorBody | ClientFailure;

/** An error reply from the API (or a failure to reach it), with what the UI needs to show it. */
export class ApiError extends Error {
  readonly status: number;
  /** Narrow on `reply.code` to read the details that code carries (e.g. a draft conflict's `current`). */
  readonly reply: ApiErrorReply;

  constructor(status: number, reply: ApiErrorReply) {
    super(reply.message);
    this.name = 'ApiError';
    this.status = status;
    this.reply = reply;
  }

  get code(): ApiErrorReply['code'] {
    return this.reply.code;
  }

  /**
   * Problems placed on fields: a validation failure's details, or the issues of a route that
   * cannot be evaluated (each names its field path).
   */
  get details(): ApiErrorDetail[] {
    const reply = this.reply;
    if (!('details' in reply) || !Array.isArray(reply.details)) return [];
    return reply.details.map(({ path, message }) => ({ path, message }));
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

/** The session's CSRF token, for requests not sent through apiRequest (uploads with progress). */
export const csrfToken = () => hooks.getCsrfToken();

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

type RequestOptions<S extends z.ZodType | undefined> = {
  method?: Method;
  body?: unknown;
  /** Parses the reply exactly (no unknown field); leave out for replies without a body (204, 202). */
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
    forgetEarly();
    const csrf = hooks.getCsrfToken();
    if (csrf) headers['X-CSRF-Token'] = csrf;
  }

  let response: Response;
  try {
    // A read the page started before this code arrived (./early.ts) answers once in its place.
    const early = method === 'GET' && options.body === undefined ? takeEarly(url) : null;
    response = await (early ??
      fetch(url, {
        method,
        headers,
        credentials: 'same-origin',
        body: options.body === undefined ? undefined : JSON.stringify(options.body),
        signal: options.signal,
      }));
  } catch (cause) {
    if (cause instanceof DOMException && cause.name === 'AbortError') throw cause;
    throw new ApiError(0, {
      code: 'network_error',
      message: 'The server could not be reached. Check your connection and try again.',
    });
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
    const parsed = parseExact(apiErrorSchema, payload);
    if (parsed.success) throw new ApiError(response.status, parsed.data.error);
    throw new ApiError(response.status, {
      code: 'unexpected_reply',
      message: `The server answered ${response.status} ${response.statusText}.`.trim(),
    });
  }

  if (!options.schema) return undefined as Result<S>;
  const parsed = parseExact(options.schema, payload);
  if (!parsed.success) {
    throw new ApiError(response.status, {
      code: 'invalid_reply',
      message: 'The server sent a reply this page does not understand. Reload and try again.',
    });
  }
  return parsed.data as Result<S>;
}

/**
 * POSTs a request whose reply is a file, and hands the file to the browser as
 * a download under the name the server gives. Errors come back as ApiError,
 * like apiRequest's.
 */
export async function apiDownload(url: string, body: unknown): Promise<{ filename: string }> {
  const headers: Record<string, string> = { 'Content-Type': 'application/json' };
  const csrf = hooks.getCsrfToken();
  if (csrf) headers['X-CSRF-Token'] = csrf;
  let response: Response;
  try {
    response = await fetch(url, {
      method: 'POST',
      headers,
      credentials: 'same-origin',
      body: JSON.stringify(body),
    });
  } catch {
    throw new ApiError(0, {
      code: 'network_error',
      message: 'The server could not be reached. Check your connection and try again.',
    });
  }
  if (!response.ok) {
    if (response.status === 401) hooks.onUnauthorized();
    let payload: unknown;
    try {
      payload = await response.json();
    } catch {
      payload = undefined;
    }
    const parsed = parseExact(apiErrorSchema, payload);
    if (parsed.success) throw new ApiError(response.status, parsed.data.error);
    throw new ApiError(response.status, {
      code: 'unexpected_reply',
      message: `The server answered ${response.status} without an explanation. Try again.`,
    });
  }
  const disposition = response.headers.get('Content-Disposition') ?? '';
  // Express writes filename=name, or filename="name" when the name needs quoting.
  const filename = /filename="?([^";]+)"?/.exec(disposition)?.[1] ?? 'download';
  const blob = await response.blob();
  const link = document.createElement('a');
  link.href = URL.createObjectURL(blob);
  link.download = filename;
  document.body.append(link);
  link.click();
  link.remove();
  setTimeout(() => URL.revokeObjectURL(link.href), 10_000);
  return { filename };
}
