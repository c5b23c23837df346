import { accountRule, ownerRule, type UserOwned } from './types';

/** Personal API tokens: every signed-in user manages their own, and only their own. */
export const tokenRules = {
  'token.list': accountRule(),
  'token.create': accountRule(),
  'token.revoke': ownerRule<UserOwned>(),
} as const;
