import { describe, expect, it } from 'vitest';
import { groupProblems } from '@/features/editor/problems';
import { parseRoute } from '@shared/engine/route/evaluate';
import { buildContext } from '@shared/engine/route/context';
import { validateRoute } from '@shared/engine/route/validate';
import { demoAmideIsolation } from '../../fixtures/routes/demo-amide-isolation';
import type { RouteDocumentInput } from '@shared/schemas/route';

// The problem list says a problem once, with the steps it is reported on: a recycle loop is
// reported by the validation on every step it stops, and is one problem to the chemist.
function issuesOf(d: RouteDocumentInput) {
  const doc = parseRoute(d);
  const { ctx, issues } = buildContext(doc);
  return validateRoute(doc, ctx, issues).issues;
}

describe('problem list grouping', () => {
  it('a recycle loop is one problem naming the steps on it, whatever else is wrong', () => {
    const d = structuredClone(demoAmideIsolation);
    d.steps.push({ id: 'back', kind: 'merge', name: 'Recycle', params: {} });
    d.connections = d.connections.filter((c) => c.id !== 'c2');
    d.connections.push(
      {
        id: 'x1',
        from: { stepId: 'acid-wash', port: 'organic' },
        to: { stepId: 'back', port: 'a' },
      },
      {
        id: 'x2',
        from: { stepId: 'base-wash', port: 'aqueous' },
        to: { stepId: 'back', port: 'b' },
      },
      {
        id: 'x3',
        from: { stepId: 'back', port: 'out' },
        to: { stepId: 'base-wash', port: 'feed' },
      },
    );
    // A second, unrelated problem stays its own entry.
    d.connections = d.connections.filter((c) => c.id !== 'c5');
    const issues = issuesOf(d);
    const loopIssues = issues.filter((i) => i.field === 'connections');
    expect(loopIssues.length).toBeGreaterThan(2);
    const groups = groupProblems(issues);
    const loops = groups.filter((g) => g.field === 'connections');
    expect(loops).toHaveLength(1);
    expect(loops[0].message).toMatch(/loop \(.*Recycle.*back to /);
    expect(loops[0].stepIds).toEqual(loopIssues.map((i) => i.stepId));
    expect(groups).toHaveLength(issues.length - loopIssues.length + 1);
    expect(groups.some((g) => g.field === 'inputs.feed')).toBe(true);
  });

  it('keeps different problems on one step apart, and the same problem on two steps together', () => {
    const groups = groupProblems([
      { stepId: 'a', field: 'params', message: 'One.' },
      { stepId: 'a', field: 'params.x', message: 'One.' },
      { stepId: 'b', field: 'params', message: 'One.' },
      { stepId: 'a', field: 'params', message: 'Two.' },
    ]);
    expect(groups.map((g) => [g.field, g.message, g.stepIds])).toEqual([
      ['params', 'One.', ['a', 'b']],
      ['params.x', 'One.', ['a']],
      ['params', 'Two.', ['a']],
    ]);
  });
});
