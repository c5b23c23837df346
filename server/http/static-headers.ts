import type { IncomingMessage, ServerResponse } from 'node:http';
import type { RequestHandler } from 'express';

type HeaderMiddleware = (
  req: IncomingMessage,
  res: ServerResponse,
  next: (error?: unknown) => void,
) => void;

/**
 * Runs a middleware that only sets and removes fixed response headers (the security headers)
 * once, and applies what it did to every response: the same headers, without a dozen
 * middleware calls and a policy string built per request. Throws at start-up if the
 * middleware does anything else with the response or does not call next at once, so a
 * per-request header (a CSP nonce) cannot be frozen by mistake.
 */
export function staticHeaders(middleware: HeaderMiddleware): RequestHandler {
  const set: Array<[string, string | number | readonly string[]]> = [];
  const removed: string[] = [];
  const recorder = new Proxy(
    {
      setHeader(name: string, value: string | number | readonly string[]) {
        set.push([name, value]);
      },
      removeHeader(name: string) {
        removed.push(name);
      },
    },
    {
      get(target, property) {
        if (property in target) return target[property as keyof typeof target];
        throw new Error(
          `The header middleware reads res.${String(property)}: its headers depend on the response and cannot be fixed once.`,
        );
      },
    },
  ) as unknown as ServerResponse;
  const request = new Proxy({} as IncomingMessage, {
    get(_target, property) {
      throw new Error(
        `The header middleware reads req.${String(property)}: its headers depend on the request and cannot be fixed once.`,
      );
    },
  });
  let called = false;
  middleware(request, recorder, (error) => {
    if (error) throw error;
    called = true;
  });
  if (!called) throw new Error('The header middleware did not call next() at once.');
  return (_req, res, next) => {
    for (const [name, value] of set) res.setHeader(name, value);
    for (const name of removed) res.removeHeader(name);
    next();
  };
}
