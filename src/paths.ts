/**
 * Every URL of the client, in one place: `paths` are the pages (`pattern` is
 * what the router matches; `to(...)` builds a concrete link) and `api` the
 * server's endpoints. Lint refuses an `/api/` address written anywhere else in
 * src (eslint.config.js, "URLs").
 */
export const paths = {
  root: { pattern: '/', to: () => '/' },
  signIn: {
    pattern: '/sign-in',
    to: (next?: string) =>
      next && next !== '/' ? `/sign-in?next=${encodeURIComponent(next)}` : '/sign-in',
  },
  requestReset: { pattern: '/reset-password', to: () => '/reset-password' },
  completeReset: {
    pattern: '/reset-password/:token',
    to: (token: string) => `/reset-password/${encodeURIComponent(token)}`,
  },
  acceptInvitation: {
    pattern: '/invitations/:token',
    to: (token: string) => `/invitations/${encodeURIComponent(token)}`,
  },
  account: { pattern: '/account', to: () => '/account' },
  outbox: { pattern: '/outbox', to: () => '/outbox' },
  workspace: {
    home: { pattern: '/w/:workspaceId', to: (id: string) => `/w/${encodeURIComponent(id)}` },
    members: {
      pattern: '/w/:workspaceId/members',
      to: (id: string) => `/w/${encodeURIComponent(id)}/members`,
    },
    compounds: {
      pattern: '/w/:workspaceId/compounds',
      to: (id: string) => `/w/${encodeURIComponent(id)}/compounds`,
    },
    equipment: {
      pattern: '/w/:workspaceId/equipment',
      to: (id: string) => `/w/${encodeURIComponent(id)}/equipment`,
    },
    solvents: {
      pattern: '/w/:workspaceId/solvents',
      to: (id: string) => `/w/${encodeURIComponent(id)}/solvents`,
    },
    route: {
      pattern: '/w/:workspaceId/routes/:routeId',
      to: (id: string, routeId: string) =>
        `/w/${encodeURIComponent(id)}/routes/${encodeURIComponent(routeId)}`,
    },
    optimise: {
      pattern: '/w/:workspaceId/routes/:routeId/optimise',
      to: (id: string, routeId: string) =>
        `/w/${encodeURIComponent(id)}/routes/${encodeURIComponent(routeId)}/optimise`,
    },
    revisions: {
      pattern: '/w/:workspaceId/routes/:routeId/revisions',
      to: (id: string, routeId: string) =>
        `/w/${encodeURIComponent(id)}/routes/${encodeURIComponent(routeId)}/revisions`,
    },
    revision: {
      pattern: '/w/:workspaceId/routes/:routeId/revisions/:number',
      to: (id: string, routeId: string, number: number) =>
        `/w/${encodeURIComponent(id)}/routes/${encodeURIComponent(routeId)}/revisions/${number}`,
    },
    stepList: {
      pattern: '/w/:workspaceId/routes/:routeId/revisions/:number/step-list',
      to: (id: string, routeId: string, number: number) =>
        `/w/${encodeURIComponent(id)}/routes/${encodeURIComponent(routeId)}/revisions/${number}/step-list`,
    },
    audit: {
      pattern: '/w/:workspaceId/audit',
      to: (id: string) => `/w/${encodeURIComponent(id)}/audit`,
    },
  },
} as const;

/** Only same-site paths are accepted as a place to return to after sign-in. */
export function safeNext(next: string | null | undefined): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\'))
    return paths.root.to();
  return next;
}

const ws = (workspaceId: string) => `/api/v1/workspaces/${encodeURIComponent(workspaceId)}`;

/** IPC chromatograms of a route. */
const chromatogramsBase = (workspaceId: string, routeId: string) =>
  `/api/v1/workspaces/${encodeURIComponent(workspaceId)}/routes/${encodeURIComponent(routeId)}/chromatograms`;

export const api = {
  chromatograms: {
    list: (workspaceId: string, routeId: string, q: { stepId?: string; cursor?: string } = {}) => {
      const params = new URLSearchParams({ limit: '200' });
      if (q.stepId) params.set('stepId', q.stepId);
      if (q.cursor) params.set('cursor', q.cursor);
      return `${chromatogramsBase(workspaceId, routeId)}?${params}`;
    },
    upload: (workspaceId: string, routeId: string) => chromatogramsBase(workspaceId, routeId),
    one: (workspaceId: string, routeId: string, id: string, full = false) =>
      `${chromatogramsBase(workspaceId, routeId)}/${encodeURIComponent(id)}${full ? '?full=1' : ''}`,
    file: (workspaceId: string, routeId: string, id: string) =>
      `${chromatogramsBase(workspaceId, routeId)}/${encodeURIComponent(id)}/file`,
  },
  session: '/api/v1/session',
  accountPassword: '/api/v1/account/password',
  members: (workspaceId: string) => `/api/v1/workspaces/${encodeURIComponent(workspaceId)}/members`,
  member: (workspaceId: string, userId: string) =>
    `/api/v1/workspaces/${encodeURIComponent(workspaceId)}/members/${encodeURIComponent(userId)}`,
  invitations: (workspaceId: string) =>
    `/api/v1/workspaces/${encodeURIComponent(workspaceId)}/invitations`,
  pendingInvitation: (workspaceId: string, invitationId: string) =>
    `/api/v1/workspaces/${encodeURIComponent(workspaceId)}/invitations/${encodeURIComponent(invitationId)}`,
  resendInvitation: (workspaceId: string, invitationId: string) =>
    `/api/v1/workspaces/${encodeURIComponent(workspaceId)}/invitations/${encodeURIComponent(invitationId)}/resend`,
  invitation: (token: string) => `/api/v1/invitations/${encodeURIComponent(token)}`,
  acceptInvitation: (token: string) => `/api/v1/invitations/${encodeURIComponent(token)}/accept`,
  passwordResets: '/api/v1/password-resets',
  passwordReset: (token: string) => `/api/v1/password-resets/${encodeURIComponent(token)}`,
  tokens: '/api/v1/tokens',
  token: (id: string) => `/api/v1/tokens/${encodeURIComponent(id)}`,
  outbox: '/api/v1/outbox',
  solvents: '/api/v1/solvents',
  solvent: (id: string) => `/api/v1/solvents/${encodeURIComponent(id)}`,
  compounds: (workspaceId: string) =>
    `/api/v1/workspaces/${encodeURIComponent(workspaceId)}/compounds`,
  compound: (workspaceId: string, compoundId: string) =>
    `/api/v1/workspaces/${encodeURIComponent(workspaceId)}/compounds/${encodeURIComponent(compoundId)}`,
  equipment: (workspaceId: string) =>
    `/api/v1/workspaces/${encodeURIComponent(workspaceId)}/equipment`,
  equipmentItem: (workspaceId: string, id: string) =>
    `/api/v1/workspaces/${encodeURIComponent(workspaceId)}/equipment/${encodeURIComponent(id)}`,
  structurePreview: '/api/v1/structures/preview',
  revisions: (workspaceId: string, routeId: string) =>
    `/api/v1/workspaces/${encodeURIComponent(workspaceId)}/routes/${encodeURIComponent(routeId)}/revisions`,
  revision: (workspaceId: string, routeId: string, number: number) =>
    `${api.revisions(workspaceId, routeId)}/${number}`,
  revisionCompare: (workspaceId: string, routeId: string, a: number, b: number) =>
    `${api.revisions(workspaceId, routeId)}/${a}/compare/${b}`,
  revisionReviewRequests: (workspaceId: string, routeId: string, number: number) =>
    `${api.revisions(workspaceId, routeId)}/${number}/review-requests`,
  revisionComments: (workspaceId: string, routeId: string, number: number) =>
    `${api.revisions(workspaceId, routeId)}/${number}/comments`,
  revisionComment: (workspaceId: string, routeId: string, number: number, commentId: string) =>
    `${api.revisions(workspaceId, routeId)}/${number}/comments/${encodeURIComponent(commentId)}`,
  revisionDecisions: (workspaceId: string, routeId: string, number: number) =>
    `${api.revisions(workspaceId, routeId)}/${number}/decisions`,
  stepList: (workspaceId: string, routeId: string, number: number) =>
    `${api.revisions(workspaceId, routeId)}/${number}/step-list`,
  attention: (workspaceId: string) =>
    `/api/v1/workspaces/${encodeURIComponent(workspaceId)}/attention`,
  audit: (workspaceId: string) => `/api/v1/workspaces/${encodeURIComponent(workspaceId)}/audit`,
  auditVerify: (workspaceId: string) =>
    `/api/v1/workspaces/${encodeURIComponent(workspaceId)}/audit/verify`,
  auditCsv: (workspaceId: string) =>
    `/api/v1/workspaces/${encodeURIComponent(workspaceId)}/audit/export.csv`,
  routes: (
    workspaceId: string,
    q: { archived?: boolean; q?: string; sort?: string; cursor?: string; limit?: number } = {},
  ) => {
    const params = new URLSearchParams();
    if (q.archived !== undefined) params.set('archived', String(q.archived));
    if (q.q) params.set('q', q.q);
    if (q.sort) params.set('sort', q.sort);
    if (q.limit) params.set('limit', String(q.limit));
    if (q.cursor) params.set('cursor', q.cursor);
    const s = params.toString();
    return `${ws(workspaceId)}/routes${s ? `?${s}` : ''}`;
  },
  route: (workspaceId: string, routeId: string) =>
    `${ws(workspaceId)}/routes/${encodeURIComponent(routeId)}`,
  routeDuplicate: (workspaceId: string, routeId: string) =>
    `${ws(workspaceId)}/routes/${encodeURIComponent(routeId)}/duplicate`,
  routeDraft: (workspaceId: string, routeId: string) =>
    `${ws(workspaceId)}/routes/${encodeURIComponent(routeId)}/draft`,
  projects: (workspaceId: string) => `${ws(workspaceId)}/projects`,
  evaluate: '/api/v1/evaluate',
  monteCarlo: '/api/v1/evaluate/monte-carlo',
  solventAlternatives: '/api/v1/solvent-alternatives',
  optimise: '/api/v1/optimise',
  job: (jobId: string) => `/api/v1/jobs/${encodeURIComponent(jobId)}`,
} as const;
