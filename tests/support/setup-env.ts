import { inject } from 'vitest';

process.env.DATABASE_URL = inject('databaseUrl');
process.env.DATABASE_OWNER_URL = inject('databaseOwnerUrl');
process.env.NODE_ENV = 'test';
