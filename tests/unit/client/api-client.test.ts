import { afterEach, describe, expect, it, vi } from 'vitest';
import { routeSummarySchema } from '@shared/schemas/routes';
import demoRoute from '../../fixtures/routes/demo-amide-isolation.json';
import { apiRequest, type ApiError } from '@/api/client';
import { updateRoute } from '@/features/routes/api/update-route';
import { apiError } from '../../../server/errors';

/** Answers the next fetch with this status and JSON body. */
function reply(status: number, body: unknown) {
  vi.stubGlobal(
    'fetch',
    vi.fn(async () => new Response(JSON.stringify(body), { status })),
  );
}

async function failure(request: Promise<unknown>): Promise<ApiError> {
  try {
    await request;
  } catch (error) {
    return error as ApiError;
  }
  throw new Error('the request succeeded');
}

const summary = {
  id: 'r1',
  name: 'Amide isolation (invented)',
  project: null,
  status: 'draft',
  owner: { id: 'u1', name: 'Ada Chemist' },
  updatedAt: '2026-12-03T10:00:00.000Z',
  draftVersion: 4,
  version: 1,
  totals: { yieldPct: 88.1, purityPct: 99.2, pmi: 41, engineVersion: '1.2.0' },
  stepCount: 7,
};

// A PATCH of a route answers with the route as the editor reads it (the server's
// declared reply, routeDetailSchema): the summary plus the draft and abilities.
const detail = {
  ...summary,
  draft: {
    document: demoRoute,
    version: 4,
    updatedAt: '2026-12-03T10:00:00.000Z',
    updatedBy: { id: 'u1', name: 'Ada Chemist' },
    evaluationError: null,
  },
  abilities: { read: true, edit: true, rename: true, duplicate: true, archive: true },
};

afterEach(() => vi.unstubAllGlobals());

describe('the client reads error replies with the shared error contract', () => {
  it('a draft conflict carries the current draft and who saved it', async () => {
    // The body exactly as the server's factory builds it.
    const { body } = apiError('draft_conflict', 'This draft was changed by Bea Colleague.', {
      current: {
        version: 5,
        updatedAt: '2026-12-03T10:00:00.000Z',
        updatedBy: { id: 'u2', name: 'Bea Colleague' },
        document: demoRoute as never,
      },
    });
    reply(409, { error: body });
    const error = await failure(apiRequest('/api/v1/anything', { method: 'PUT', body: {} }));
    expect(error.status).toBe(409);
    if (error.reply.code !== 'draft_conflict') throw new Error(`read as ${error.reply.code}`);
    expect(error.reply.details.current.version).toBe(5);
    expect(error.reply.details.current.updatedBy.name).toBe('Bea Colleague');
    expect(error.reply.details.current.document.steps.length).toBe(demoRoute.steps.length);
  });

  it('an evaluation failure keeps its route issues, placed on their fields', async () => {
    const { body } = apiError('route_invalid', 'The route cannot be evaluated.', [
      {
        stepId: 'wash-1',
        field: 'params.stages',
        message: 'Enter at least one stage.',
        path: 'document.steps.2.params.stages',
      },
    ]);
    reply(422, { error: body });
    const error = await failure(apiRequest('/api/v1/evaluate', { method: 'POST', body: {} }));
    expect(error.code).toBe('route_invalid');
    if (error.reply.code !== 'route_invalid') throw new Error(`read as ${error.reply.code}`);
    expect(error.reply.details[0].stepId).toBe('wash-1');
    expect(error.fieldErrors()).toEqual({
      'document.steps.2.params.stages': 'Enter at least one stage.',
    });
  });

  it('a validation failure maps every field problem', async () => {
    reply(400, {
      error: {
        code: 'validation_failed',
        message: 'Some fields are not valid.',
        details: [
          { path: 'name', message: 'Enter a name.' },
          { path: 'roles.0', message: 'Pick a role.' },
        ],
      },
    });
    const error = await failure(apiRequest('/api/v1/anything', { method: 'POST', body: {} }));
    expect(error.fieldErrors()).toEqual({ name: 'Enter a name.', 'roles.0': 'Pick a role.' });
  });

  it('an error reply outside the contract is reported as unexpected, with its status', async () => {
    // Details of the wrong shape for the code.
    reply(409, { error: { code: 'draft_conflict', message: 'Changed.', details: [] } });
    expect((await failure(apiRequest('/api/v1/x'))).code).toBe('unexpected_reply');
    // A code the contract does not know.
    reply(409, { error: { code: 'made_up', message: 'Something.' } });
    const unknown = await failure(apiRequest('/api/v1/x'));
    expect(unknown.code).toBe('unexpected_reply');
    expect(unknown.message).toContain('409');
    // An extra field beside the contract's.
    reply(404, { error: { code: 'not_found', message: 'Gone.', hint: 'x' } });
    expect((await failure(apiRequest('/api/v1/x'))).code).toBe('unexpected_reply');
  });
});

describe('the client parses every reply with its exact schema', () => {
  it('a PATCH reply with a field the schema does not declare is refused', async () => {
    reply(200, { ...detail, secretFlag: true });
    const error = await failure(updateRoute('w1', 'r1', { name: 'Renamed', baseVersion: 1 }));
    expect(error.code).toBe('invalid_reply');
  });

  it('an unknown field deep inside a reply is refused too', async () => {
    reply(200, { ...summary, owner: { ...summary.owner, email: 'ada@example.com' } });
    const error = await failure(apiRequest('/api/v1/x', { schema: routeSummarySchema }));
    expect(error.code).toBe('invalid_reply');
  });

  it('the exact reply is accepted', async () => {
    reply(200, detail);
    expect(await updateRoute('w1', 'r1', { name: 'Renamed', baseVersion: 1 })).toEqual(detail);
  });
});
