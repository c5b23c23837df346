/**
 * Replies the page asks for before its code has arrived. Opening a route by its address
 * used to wait for the application's code to run, then for the route page's modules,
 * before the session and the route were even asked for; this module is the first the page
 * runs (src/main.tsx imports it first), and on a route's page it asks for both at once,
 * from the address alone. apiRequest takes such a reply instead of asking again: once,
 * only within a few seconds of the page's start and before any write, so any later read
 * goes to the server.
 */
import { api, paths } from '@/paths';

/** How long a reply started with the page may stand in for a request of the page's code [ms]. */
const FRESH_MS = 10_000;

const started = new Map<string, { at: number; reply: Promise<Response> }>();

/** The page's parameters when `pathname` is an address of `pattern` ('/w/:workspaceId/…'), else null. */
export function matchPattern(pattern: string, pathname: string): Record<string, string> | null {
  const want = pattern.split('/');
  const have = pathname.replace(/\/+$/, '').split('/');
  if (want.length !== have.length) return null;
  const params: Record<string, string> = {};
  for (let i = 0; i < want.length; i++) {
    if (want[i].startsWith(':')) {
      if (!have[i]) return null;
      try {
        params[want[i].slice(1)] = decodeURIComponent(have[i]);
      } catch {
        return null;
      }
    } else if (want[i] !== have[i]) return null;
  }
  return params;
}

/** The API reads a page at this address starts with (the route page: the session and the route). */
export function earlyReads(pathname: string): string[] {
  const route = matchPattern(paths.workspace.route.pattern, pathname);
  if (route) return [api.session, api.route(route.workspaceId, route.routeId)];
  return [];
}

/** Starts a GET of `url` now, for the page's code to take later (takeEarly). */
export function startEarlyRead(url: string, now = performance.now()) {
  const reply = fetch(url, { headers: { Accept: 'application/json' }, credentials: 'same-origin' });
  // Marked handled here: a failure reaches the request that takes this reply, as its own would.
  reply.catch(() => undefined);
  started.set(url, { at: now, reply });
}

/**
 * Drops every reply not yet taken: called on any write, since a write (signing in, above all)
 * can change what a read answers.
 */
export function forgetEarly(): void {
  started.clear();
}

/** The reply started with the page for this GET, if it is still fresh (taken once). */
export function takeEarly(url: string): Promise<Response> | null {
  const hit = started.get(url);
  if (!hit) return null;
  started.delete(url);
  return performance.now() - hit.at <= FRESH_MS ? hit.reply : null;
}

if (typeof location !== 'undefined' && typeof fetch === 'function')
  for (const url of earlyReads(location.pathname)) startEarlyRead(url);
