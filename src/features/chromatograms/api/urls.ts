/** Addresses of the chromatograms API (kept here with the feature that calls them). */
const base = (workspaceId: string, routeId: string) =>
  `/api/v1/workspaces/${encodeURIComponent(workspaceId)}/routes/${encodeURIComponent(routeId)}/chromatograms`;

export const chromatogramsApi = {
  list: (workspaceId: string, routeId: string, q: { stepId?: string; cursor?: string } = {}) => {
    const params = new URLSearchParams({ limit: '200' });
    if (q.stepId) params.set('stepId', q.stepId);
    if (q.cursor) params.set('cursor', q.cursor);
    return `${base(workspaceId, routeId)}?${params}`;
  },
  upload: base,
  one: (workspaceId: string, routeId: string, id: string, full = false) =>
    `${base(workspaceId, routeId)}/${encodeURIComponent(id)}${full ? '?full=1' : ''}`,
  file: (workspaceId: string, routeId: string, id: string) =>
    `${base(workspaceId, routeId)}/${encodeURIComponent(id)}/file`,
} as const;
