import { describe, expect, it } from 'vitest';
import { evaluateRoute } from '../../../shared/engine/route/evaluate';
import { RouteValidationError } from '../../../shared/engine/route/errors';
import { demoAmideIsolation } from '../../fixtures/routes/demo-amide-isolation';
import type { RouteDocumentInput } from '../../../shared/schemas/route';

function issuesOf(doc: RouteDocumentInput) {
  try {
    evaluateRoute(doc);
  } catch (e) {
    expect(e).toBeInstanceOf(RouteValidationError);
    return (e as RouteValidationError).issues;
  }
  throw new Error('expected a validation error');
}
const demo = () => structuredClone(demoAmideIsolation);

describe('route validation', () => {
  it('accepts the demo route', () => {
    expect(() => evaluateRoute(demo())).not.toThrow();
  });
  it('reports a cycle naming its steps', () => {
    const d = demo();
    d.steps.push({ id: 'back', kind: 'merge', name: 'back', params: {} });
    d.connections = d.connections.filter((c) => c.id !== 'c2');
    d.connections.push({
      id: 'x1',
      from: { stepId: 'acid-wash', port: 'organic' },
      to: { stepId: 'back', port: 'a' },
    });
    d.connections.push({
      id: 'x2',
      from: { stepId: 'base-wash', port: 'aqueous' },
      to: { stepId: 'back', port: 'b' },
    });
    d.connections.push({
      id: 'x3',
      from: { stepId: 'back', port: 'out' },
      to: { stepId: 'base-wash', port: 'feed' },
    });
    const issues = issuesOf(d);
    // One problem, said once for every step it stops (the loop's steps and those after it), the
    // loop named in stream order: the problem list shows it once, each card still carries it.
    const loopIssues = issues.filter((i) => i.field === 'connections');
    expect(new Set(loopIssues.map((i) => i.message))).toEqual(
      new Set([
        'The streams make a loop (8 % NaHCO3 wash (removes the acid) → back → back to 8 % NaHCO3 wash (removes the acid)), so the steps on it and after it cannot be worked out: a route runs one way; delete the stream that feeds back.',
      ]),
    );
    const stopped = loopIssues.map((i) => i.stepId);
    expect(stopped).toEqual(expect.arrayContaining(['back', 'base-wash', 'dry']));
    expect(stopped).not.toContain('acid-wash');
  });
  it('reports a required input left unconnected', () => {
    const d = demo();
    d.connections = d.connections.filter((c) => c.id !== 'c5');
    expect(issuesOf(d)).toContainEqual(
      expect.objectContaining({ stepId: 'antisolvent', field: 'inputs.feed' }),
    );
  });
  it('reports a port used twice', () => {
    const d = demo();
    d.connections.push({
      id: 'dup',
      from: { stepId: 'acid-wash', port: 'organic' },
      to: { stepId: 'swap', port: 'feed' },
    });
    const issues = issuesOf(d);
    expect(
      issues.some((i) => i.stepId === 'acid-wash' && /goes to two steps/.test(i.message)),
    ).toBe(true);
    expect(
      issues.some((i) => i.stepId === 'swap' && /comes from two streams/.test(i.message)),
    ).toBe(true);
  });
  it('reports an unknown port and an incompatible phase', () => {
    const d = demo();
    d.connections[0] = {
      id: 'c1',
      from: { stepId: 'crude', port: 'nope' },
      to: { stepId: 'acid-wash', port: 'feed' },
    };
    d.connections.push({
      id: 'p',
      from: { stepId: 'dry', port: 'vapour' },
      to: { stepId: 'filter', port: 'slurry' },
    });
    const issues = issuesOf(d);
    expect(issues.some((i) => i.field === 'connections[0].from.port')).toBe(true);
  });
  it('reports unknown components with the field path', () => {
    const d = demo();
    const s = d.steps.find((x) => x.id === 'swap')!;
    if (s.kind === 'distillation' && s.params.mode.kind === 'put-and-take')
      s.params.mode.addSolventId = 'unobtainium';
    expect(issuesOf(d)).toContainEqual(
      expect.objectContaining({ stepId: 'swap', field: 'params.mode.addSolventId' }),
    );
  });
  it('reports out-of-range parameters from the schema with their path and step', () => {
    const d = demo();
    const s = d.steps.find((x) => x.id === 'dry')!;
    if (s.kind === 'drying') s.params.temperatureC = 900;
    const issues = issuesOf(d);
    expect(issues[0].stepId).toBe('dry');
    expect(issues[0].field).toBe('params.temperatureC');
    expect(issues[0].message).toBe('Enter at most 250.');
  });
  it('reports a medium above its saturation wt%', () => {
    const d = demo();
    const s = d.steps.find((x) => x.id === 'base-wash')!;
    if (s.kind === 'wash' && s.params.addedLiquid.kind === 'aqueous')
      s.params.addedLiquid.wtPct = 30;
    expect(issuesOf(d)).toContainEqual(
      expect.objectContaining({ stepId: 'base-wash', field: 'params.addedLiquid.wtPct' }),
    );
  });
});
