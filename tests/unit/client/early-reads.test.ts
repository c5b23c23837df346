import { afterEach, describe, expect, it, vi } from 'vitest';
import { earlyReads, matchPattern, startEarlyRead } from '@/api/early';
import { apiRequest } from '@/api/client';
import { api, paths } from '@/paths';

// The reads a page starts from its address before its code has run (src/api/early.ts): a
// route's page asks for the session and that route; any other page asks for nothing early.
describe('reads started with the page', () => {
  it('asks for the session and the route on a route page, with the ids as the address has them', () => {
    const path = paths.workspace.route.to('ws 1', 'route/7');
    expect(earlyReads(path)).toEqual([api.session, api.route('ws 1', 'route/7')]);
    expect(earlyReads(`${path}/`)).toEqual([api.session, api.route('ws 1', 'route/7')]);
  });

  it('asks for nothing on other pages, nor on pages below a route', () => {
    for (const path of [
      paths.signIn.to(),
      paths.workspace.home.to('ws'),
      paths.workspace.revisions.to('ws', 'r'),
      paths.workspace.optimise.to('ws', 'r'),
      '/w//routes/r',
      '/w/ws/routes/%E0%A4%A',
    ])
      expect(earlyReads(path), path).toEqual([]);
  });

  it('reads the parameters of a pattern', () => {
    expect(matchPattern('/w/:workspaceId/routes/:routeId', '/w/a/routes/b')).toEqual({
      workspaceId: 'a',
      routeId: 'b',
    });
    expect(matchPattern('/w/:workspaceId/routes/:routeId', '/w/a/members/b')).toBeNull();
  });
});

describe('a read started with the page', () => {
  afterEach(() => vi.unstubAllGlobals());

  it('answers the first request for its address, once; later requests ask the server', async () => {
    let n = 0;
    const fetch = vi.fn(async () => new Response(JSON.stringify({ n: ++n }), { status: 200 }));
    vi.stubGlobal('fetch', fetch);
    startEarlyRead('/early/one');
    expect(fetch).toHaveBeenCalledTimes(1);
    await expect(apiRequest('/early/one', {})).resolves.toBeUndefined();
    expect(fetch).toHaveBeenCalledTimes(1);
    await apiRequest('/early/one', {});
    expect(fetch).toHaveBeenCalledTimes(2);
  });

  it('is not taken when stale, nor after a write (signing in may change what it answers)', async () => {
    const fetch = vi.fn(async () => new Response(null, { status: 204 }));
    vi.stubGlobal('fetch', fetch);
    startEarlyRead('/early/stale', performance.now() - 60_000);
    await apiRequest('/early/stale', {});
    expect(fetch).toHaveBeenCalledTimes(2);
    startEarlyRead('/early/route');
    await apiRequest('/early/sign-in', { method: 'POST', body: {} });
    await apiRequest('/early/route', {});
    expect(fetch).toHaveBeenCalledTimes(5);
  });
});
