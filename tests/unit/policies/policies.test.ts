import { describe, expect, it } from 'vitest';
import type { Role } from '@shared/schemas/session';
import { AppError } from '../../../server/errors';
import { abilitiesFor, authorize, can, type Actor } from '../../../server/policies';

const HOME = 'home-workspace';
const AWAY = 'away-workspace';

const actor = (memberships: Record<string, Role[]>, userId = 'user-1'): Actor => ({
  userId,
  memberships: new Map(Object.entries(memberships)),
});

function statusOf(run: () => void): number | 'allowed' {
  try {
    run();
    return 'allowed';
  } catch (error) {
    if (error instanceof AppError) return error.status;
    throw error;
  }
}

describe('workspace policies', () => {
  const adminOnly = ['member.invite', 'member.updateRoles', 'member.remove'] as const;
  const anyMember = ['workspace.read', 'member.list'] as const;

  for (const role of ['chemist', 'reviewer', 'engineer'] as const) {
    it(`a ${role} may read the workspace and its members but not manage them (403)`, () => {
      const member = actor({ [HOME]: [role] });
      for (const action of anyMember)
        expect(statusOf(() => authorize(member, action, { workspaceId: HOME }))).toBe('allowed');
      for (const action of adminOnly)
        expect(statusOf(() => authorize(member, action, { workspaceId: HOME }))).toBe(403);
    });
  }

  it('an admin may manage members', () => {
    const admin = actor({ [HOME]: ['admin'] });
    for (const action of [...anyMember, ...adminOnly])
      expect(can(admin, action, { workspaceId: HOME })).toBe(true);
  });

  it('roles add up: chemist + admin may invite', () => {
    expect(
      can(actor({ [HOME]: ['chemist', 'admin'] }), 'member.invite', { workspaceId: HOME }),
    ).toBe(true);
  });

  it("another workspace's objects are hidden (404), even from an admin there", () => {
    const outsider = actor({ [AWAY]: ['admin'] });
    for (const action of [...anyMember, ...adminOnly]) {
      expect(statusOf(() => authorize(outsider, action, { workspaceId: HOME }))).toBe(404);
    }
  });

  it('roles in one workspace do not carry over to another', () => {
    const mixed = actor({ [HOME]: ['chemist'], [AWAY]: ['admin'] });
    expect(can(mixed, 'member.invite', { workspaceId: AWAY })).toBe(true);
    expect(statusOf(() => authorize(mixed, 'member.invite', { workspaceId: HOME }))).toBe(403);
  });
});

describe('token and account policies', () => {
  it("a user may revoke their own token; another user's token is hidden (404)", () => {
    expect(can(actor({}, 'u1'), 'token.revoke', { userId: 'u1' })).toBe(true);
    expect(statusOf(() => authorize(actor({}, 'u1'), 'token.revoke', { userId: 'u2' }))).toBe(404);
  });

  it('every signed-in user may manage tokens and their password, even without a workspace', () => {
    const loner = actor({});
    for (const action of ['token.list', 'token.create', 'account.changePassword'] as const)
      expect(can(loner, action, null)).toBe(true);
  });

  it('only admins of some workspace may read the outbox', () => {
    expect(can(actor({ [AWAY]: ['admin'] }), 'outbox.read', null)).toBe(true);
    expect(
      statusOf(() =>
        authorize(actor({ [HOME]: ['chemist', 'reviewer', 'engineer'] }), 'outbox.read', null),
      ),
    ).toBe(403);
  });
});

describe('abilities map', () => {
  it('lists workspace actions per workspace the actor belongs to, and account actions under global', () => {
    const abilities = abilitiesFor(actor({ [HOME]: ['chemist'], [AWAY]: ['admin'] }));
    expect(Object.keys(abilities.workspaces).sort()).toEqual([AWAY, HOME].sort());
    expect(abilities.workspaces[HOME]).toMatchObject({
      'workspace.read': true,
      'member.list': true,
      'member.invite': false,
      'member.updateRoles': false,
      'member.remove': false,
    });
    // Every value in the map is a decision, never a missing rule.
    for (const allowed of Object.values(abilities.workspaces[HOME]))
      expect(typeof allowed).toBe('boolean');
    expect(abilities.workspaces[AWAY]['member.invite']).toBe(true);
    expect(abilities.global).toMatchObject({
      'token.list': true,
      'token.create': true,
      'account.changePassword': true,
      'outbox.read': true,
    });
  });

  it('agrees with can() for every workspace action', () => {
    const subject = actor({ [HOME]: ['reviewer'] });
    const abilities = abilitiesFor(subject);
    for (const [action, allowed] of Object.entries(abilities.workspaces[HOME])) {
      expect(can(subject, action as 'member.list', { workspaceId: HOME })).toBe(allowed);
    }
  });
});
