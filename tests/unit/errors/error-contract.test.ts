import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { API_ERROR_CODES, apiErrorSchema } from '@shared/schemas/errors';
import { parseExact } from '@shared/schemas/exact';
import {
  apiError,
  conflict,
  ERROR_STATUS,
  notFound,
  validationFailed,
} from '../../../server/errors';

const apiDoc = readFileSync(new URL('../../../docs/api.md', import.meta.url), 'utf8');

describe('the error contract', () => {
  it('gives every code a status and documents it in docs/api.md', () => {
    expect(Object.keys(ERROR_STATUS).sort()).toEqual([...API_ERROR_CODES].sort());
    for (const code of API_ERROR_CODES) expect(apiDoc, code).toContain(`\`${code}\``);
  });

  it('every factory builds a reply the contract accepts exactly, with the status of its code', () => {
    const samples = [
      notFound(),
      validationFailed([{ path: 'name', message: 'Enter a name.' }]),
      conflict('last_admin', 'A workspace needs at least one admin.'),
      apiError('structure_unparsable', 'Cannot read the SMILES.'),
      apiError('route_unevaluable', 'The route cannot be evaluated.', [
        { stepId: null, field: 'components', message: 'No product.', path: 'document.components' },
      ]),
    ];
    for (const error of samples) {
      expect(parseExact(apiErrorSchema, { error: error.body }).success, error.code).toBe(true);
      expect(error.status).toBe(ERROR_STATUS[error.code]);
    }
    expect(samples.map((e) => e.status)).toEqual([404, 400, 409, 422, 422]);
  });

  it('refuses details of the wrong shape for a code (checked by the type-check)', () => {
    const refused = () => [
      // @ts-expect-error a draft conflict carries the current draft, not field problems
      apiError('draft_conflict', 'Changed.', [{ path: '', message: '' }]),
      // @ts-expect-error not_found carries no details
      apiError('not_found', 'Missing.', []),
      // @ts-expect-error a validation failure must list its field problems
      apiError('validation_failed', 'Some fields are not valid.'),
      // @ts-expect-error conflict() takes 409 codes only
      conflict('not_found', 'Missing.'),
      // @ts-expect-error a code outside the contract
      apiError('made_up', 'Something.'),
    ];
    expect(refused).toBeTypeOf('function');
  });

  it('a reply with details that do not match its code is refused', () => {
    const wrong = { error: { code: 'draft_conflict', message: 'Changed.', details: [] } };
    expect(apiErrorSchema.safeParse(wrong).success).toBe(false);
    const extra = { error: { code: 'not_found', message: 'Missing.', details: [] } };
    expect(parseExact(apiErrorSchema, extra).success).toBe(false);
  });
});
