/**
 * The names of every action the server's policies decide (server/policies), by scope. The
 * rules themselves stay on the server; this list lets the client type the abilities map it
 * receives with the session, so a control asks about an action that exists. The server's
 * type-check fails when a rule is added, renamed or removed without this list following.
 */
import { z } from 'zod';

/** Actions inside one workspace; the session's abilities say, per workspace, which are allowed. */
export const WORKSPACE_ACTIONS = [
  'workspace.read',
  'member.list',
  'member.invite',
  'member.updateRoles',
  'member.remove',
  'invitation.list',
  'invitation.resend',
  'invitation.revoke',
  'route.list',
  'route.read',
  'route.create',
  'route.rename',
  'route.duplicate',
  'route.archive',
  'route.editDraft',
  'project.list',
  'compound.list',
  'compound.read',
  'compound.create',
  'compound.update',
  'compound.delete',
  'equipment.list',
  'equipment.create',
  'equipment.update',
  'equipment.delete',
  'stepList.export',
  'route.import',
  'audit.read',
  'audit.verify',
  'revision.list',
  'revision.listAll',
  'revision.read',
  'revision.create',
  'review.submit',
  'review.decide',
  'attention.list',
  'comment.create',
  'comment.resolve',
  'chromatogram.list',
  'chromatogram.read',
  'chromatogram.upload',
  'chromatogram.update',
  'chromatogram.delete',
] as const;
export type WorkspaceAction = (typeof WORKSPACE_ACTIONS)[number];

/** Account-wide actions (no resource); the session's abilities say which are allowed. */
export const ACCOUNT_ACTIONS = [
  'account.changePassword',
  'token.list',
  'token.create',
  'outbox.read',
  'route.evaluate',
  'job.create',
  'structure.preview',
  'solvent.read',
  'calc.run',
] as const;
export type AccountAction = (typeof ACCOUNT_ACTIONS)[number];

/** Actions on an object only its owner can see; decided per object, so not in the abilities map. */
export const OWNER_ACTIONS = ['token.revoke', 'job.read', 'job.cancel'] as const;
export type OwnerAction = (typeof OWNER_ACTIONS)[number];

export type Action = WorkspaceAction | AccountAction | OwnerAction;

const allowedEach = <A extends string>(actions: readonly A[]) =>
  z.object(
    Object.fromEntries(actions.map((action) => [action, z.boolean()])) as Record<A, z.ZodBoolean>,
  );

/** Whether each workspace action is allowed in one workspace. */
export const workspaceAbilitiesSchema = allowedEach(WORKSPACE_ACTIONS);
/** Whether each account-wide action is allowed. */
export const accountAbilitiesSchema = allowedEach(ACCOUNT_ACTIONS);
