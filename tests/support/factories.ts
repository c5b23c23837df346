import { randomBytes } from 'node:crypto';
import type { Express } from 'express';
import request from 'supertest';
import type { Role, Session } from '@shared/schemas/session';
import { sessionSchema } from '@shared/schemas/session';
import { Membership, User, Workspace } from '../../server/models';
import { hashPassword } from '../../server/services/passwords';

export const DEFAULT_PASSWORD = 'correct-horse-battery';

const unique = () => randomBytes(5).toString('hex');

// One hash for the default password: argon2id is deliberately slow.
let defaultHash: Promise<string> | null = null;

export async function buildUser(
  attrs: { email?: string; name?: string; password?: string } = {},
): Promise<User> {
  const password = attrs.password ?? DEFAULT_PASSWORD;
  const passwordHash =
    password === DEFAULT_PASSWORD
      ? await (defaultHash ??= hashPassword(DEFAULT_PASSWORD))
      : await hashPassword(password);
  return User.create({
    email: attrs.email ?? `person-${unique()}@example.com`,
    name: attrs.name ?? `Test Person ${unique()}`,
    passwordHash,
  });
}

export async function buildWorkspace(
  attrs: { name?: string; slug?: string } = {},
): Promise<Workspace> {
  const suffix = unique();
  return Workspace.create({
    name: attrs.name ?? `Test group ${suffix}`,
    slug: attrs.slug ?? `test-group-${suffix}`,
  });
}

export async function buildMembership(
  user: User,
  workspace: Workspace,
  roles: Role[],
): Promise<Membership> {
  return Membership.create({ userId: user.id, workspaceId: workspace.id, roles });
}

/** A user who is a member of the workspace with the given roles. */
export async function buildMember(
  workspace: Workspace,
  roles: Role[],
  attrs: Parameters<typeof buildUser>[0] = {},
) {
  const user = await buildUser(attrs);
  await buildMembership(user, workspace, roles);
  return user;
}

export interface SignedIn {
  agent: ReturnType<typeof request.agent>;
  csrfToken: string;
  session: Session;
}

/** Signs in through the API; the agent keeps the session cookie. */
export async function signIn(
  app: Express,
  email: string,
  password = DEFAULT_PASSWORD,
): Promise<SignedIn> {
  const agent = request.agent(app);
  const response = await agent.post('/api/v1/session').send({ email, password });
  if (response.status !== 200)
    throw new Error(
      `sign-in as ${email} failed: ${response.status} ${JSON.stringify(response.body)}`,
    );
  const session = sessionSchema.parse(response.body);
  return { agent, csrfToken: session.csrfToken, session };
}
