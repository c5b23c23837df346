/** Addresses of the routes API (kept here with the feature that calls them). */
const ws = (workspaceId: string) => `/api/v1/workspaces/${encodeURIComponent(workspaceId)}`;

export const routesApi = {
  list: (workspaceId: string, q: { archived?: boolean; q?: string } = {}) => {
    const params = new URLSearchParams();
    if (q.archived !== undefined) params.set('archived', String(q.archived));
    if (q.q) params.set('q', q.q);
    const s = params.toString();
    return `${ws(workspaceId)}/routes${s ? `?${s}` : ''}`;
  },
  create: (workspaceId: string) => `${ws(workspaceId)}/routes`,
  one: (workspaceId: string, routeId: string) =>
    `${ws(workspaceId)}/routes/${encodeURIComponent(routeId)}`,
  duplicate: (workspaceId: string, routeId: string) =>
    `${ws(workspaceId)}/routes/${encodeURIComponent(routeId)}/duplicate`,
  draft: (workspaceId: string, routeId: string) =>
    `${ws(workspaceId)}/routes/${encodeURIComponent(routeId)}/draft`,
  projects: (workspaceId: string) => `${ws(workspaceId)}/projects`,
  compounds: (workspaceId: string) => `${ws(workspaceId)}/compounds`,
  evaluate: '/api/v1/evaluate',
  monteCarlo: '/api/v1/evaluate/monte-carlo',
  job: (jobId: string) => `/api/v1/jobs/${encodeURIComponent(jobId)}`,
} as const;
