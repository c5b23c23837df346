import { Sequelize } from 'sequelize';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { useTestServer } from '../support/app';

const server = useTestServer();

describe('GET /api/v1/health', () => {
  it('answers ok when the database is reachable', async () => {
    const response = await request(server.app).get('/api/v1/health');
    expect(response.status).toBe(200);
    expect(response.body).toEqual({ status: 'ok', db: 'ok' });
  });

  it('answers 503 when the database cannot be reached', async () => {
    // Port 9 (discard) on loopback: nothing speaks PostgreSQL there.
    const unreachable = new Sequelize('postgres://postgres@127.0.0.1:9/none', {
      dialect: 'postgres',
      logging: false,
      retry: { max: 0 },
      pool: { acquire: 2_000 },
    });
    try {
      const app = server.anotherApp(undefined, { sequelize: unreachable });
      const response = await request(app).get('/api/v1/health');
      expect(response.status).toBe(503);
      expect(response.body).toEqual({ status: 'error', db: 'unreachable' });
    } finally {
      await unreachable.close();
    }
  });
});
