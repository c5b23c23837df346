import { describe, expect, it } from 'vitest';
import { ACCOUNT_ACTIONS, OWNER_ACTIONS, WORKSPACE_ACTIONS } from '@shared/schemas/actions';
import { parseExact } from '@shared/schemas/exact';
import { abilitiesSchema, type Role, type Session } from '@shared/schemas/session';
import { canInWorkspace, canOnAccount } from '@/features/auth/abilities';
import { abilitiesFor, rules, type Actor } from '../../../server/policies';

const HOME = 'home-workspace';
const actor = (roles: Role[]): Actor => ({
  userId: 'user-1',
  memberships: new Map([[HOME, roles]]),
});
const sessionOf = (roles: Role[], abilities = abilitiesFor(actor(roles))): Session => ({
  user: { id: 'user-1', email: 'ada@example.com', name: 'Ada' },
  workspaces: [{ id: HOME, name: 'Home (invented)', slug: 'home', roles }],
  csrfToken: 'token',
  abilities,
});

describe('the action names the client types are the server rules', () => {
  it('names every rule once, under its scope', () => {
    const byScope = (scope: string) =>
      Object.entries(rules)
        .filter(([, rule]) => rule.scope === scope)
        .map(([action]) => action)
        .sort();
    expect(byScope('workspace')).toEqual([...WORKSPACE_ACTIONS].sort());
    expect(byScope('account')).toEqual([...ACCOUNT_ACTIONS].sort());
    expect(byScope('owner')).toEqual([...OWNER_ACTIONS].sort());
  });

  it('the abilities map has exactly the shared names, as the client parses it', () => {
    const abilities = abilitiesFor(actor(['reviewer']));
    expect(parseExact(abilitiesSchema, abilities).success).toBe(true);
    expect(Object.keys(abilities.workspaces[HOME]).sort()).toEqual([...WORKSPACE_ACTIONS].sort());
  });
});

describe('client abilities follow the server, with no role fallback', () => {
  it('an admin who is not a chemist may create routes and compounds, as the server allows', () => {
    const admin = sessionOf(['admin']);
    expect(canInWorkspace(admin, HOME, 'route.create')).toBe(true);
    expect(canInWorkspace(admin, HOME, 'compound.create')).toBe(true);
    expect(canOnAccount(admin, 'outbox.read')).toBe(true);
  });

  it('a reviewer or engineer may not', () => {
    for (const role of ['reviewer', 'engineer'] as const) {
      const session = sessionOf([role]);
      expect(canInWorkspace(session, HOME, 'route.create')).toBe(false);
      expect(canInWorkspace(session, HOME, 'member.invite')).toBe(false);
      expect(canOnAccount(session, 'outbox.read')).toBe(false);
    }
  });

  it('the roles a session lists never override what the abilities map says', () => {
    // The map says no, whatever the roles: the client does not guess from roles.
    const denied = abilitiesFor(actor(['reviewer']));
    const session = sessionOf(['chemist', 'admin'], denied);
    expect(canInWorkspace(session, HOME, 'route.create')).toBe(false);
    expect(canInWorkspace(session, 'another-workspace', 'route.read')).toBe(false);
  });
});
