import type { Role } from '@shared/schemas/session';

// Invented demo scenario: the people, groups and e-mail addresses are fictitious.
export const DEMO_PASSWORD = 'phasewright-demo';

export const DEMO_WORKSPACES = [
  { key: 'demo', name: 'Demo process group (invented)', slug: 'demo-process-group' },
  { key: 'second', name: 'Second site (invented)', slug: 'second-site' },
] as const;

export const DEMO_ACCOUNTS: {
  email: string;
  name: string;
  workspace: (typeof DEMO_WORKSPACES)[number]['key'];
  roles: Role[];
  description: string;
}[] = [
  {
    email: 'chemist@example.com',
    name: 'Mira Okafor (demo chemist)',
    workspace: 'demo',
    roles: ['chemist'],
    description: 'Chemist, demo workspace',
  },
  {
    email: 'reviewer@example.com',
    name: 'Tomas Lindqvist (demo reviewer)',
    workspace: 'demo',
    roles: ['reviewer'],
    description: 'Reviewer, demo workspace',
  },
  {
    email: 'engineer@example.com',
    name: 'Ana Ribeiro (demo engineer)',
    workspace: 'demo',
    roles: ['engineer'],
    description: 'Scale-up engineer, demo workspace',
  },
  {
    email: 'admin@example.com',
    name: 'Priya Nair (demo admin)',
    workspace: 'demo',
    roles: ['admin'],
    description: 'Admin, demo workspace',
  },
  {
    email: 'other@example.com',
    name: 'Jonas Weber (demo chemist)',
    workspace: 'second',
    roles: ['chemist'],
    description: 'Chemist, second workspace',
  },
];
