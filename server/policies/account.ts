import { accountRule } from './types';

export const accountRules = {
  'account.changePassword': accountRule(),
} as const;
