export const chromatogramKeys = {
  all: (workspaceId: string, routeId: string) =>
    ['workspaces', workspaceId, 'routes', routeId, 'chromatograms'] as const,
  list: (workspaceId: string, routeId: string, stepId: string) =>
    [...chromatogramKeys.all(workspaceId, routeId), 'list', stepId] as const,
  one: (workspaceId: string, routeId: string, id: string, full: boolean) =>
    [...chromatogramKeys.all(workspaceId, routeId), 'one', id, full] as const,
};
