import { accountRule } from './types';

/** The dev/demo outbox shows every captured e-mail, so only admins (of any workspace) may read it. */
export const outboxRules = {
  'outbox.read': accountRule((actor) =>
    [...actor.memberships.values()].some((roles) => roles.includes('admin')),
  ),
} as const;
