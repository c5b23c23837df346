/**
 * Every problem the route validation can report is said in the chemist's words: the step by its
 * type and name, an input or output by what its card shows, a compound by its name — never a
 * step, stream or compound id, an input/output's internal name, or a field path. The machine-
 * readable step and field stay on each issue for scripts.
 * Source: this project's own wording rule (issue: every message a chemist sees is in the
 * chemist's words); no external source.
 */
import { describe, expect, it } from 'vitest';
import { evaluateRoute, parseRoute } from '../../../shared/engine/route/evaluate';
import { buildContext } from '../../../shared/engine/route/context';
import { validateRoute } from '../../../shared/engine/route/validate';
import type { RouteIssue, RouteValidationError } from '../../../shared/engine/route/errors';
import { demoAmideIsolation } from '../../fixtures/routes/demo-amide-isolation';
import type { RouteDocumentInput } from '../../../shared/schemas/route';

type Doc = RouteDocumentInput;
type Step = Doc['steps'][number];

/**
 * The demo route with every step and stream given an id that reads like no word
 * ("stp-crude-q9", "lnk-c1-q9"), so an id leaking into a message is found.
 */
function demo(): Doc {
  const d = structuredClone(demoAmideIsolation);
  const sid = (id: string) => `stp-${id}-q9`;
  d.steps = d.steps.map((s) => ({ ...s, id: sid(s.id) }));
  d.connections = d.connections.map((c) => ({
    ...c,
    id: `lnk-${c.id}-q9`,
    from: { ...c.from, stepId: sid(c.from.stepId) },
    to: { ...c.to, stepId: sid(c.to.stepId) },
  }));
  return d;
}
const step = (d: Doc, id: string) => d.steps.find((s) => s.id === `stp-${id}-q9`)!;
type ParamsOfKind<K extends Step['kind']> = Extract<Step, { kind: K }>['params'];
function params<K extends Step['kind']>(d: Doc, id: string, kind: K): ParamsOfKind<K> {
  const s: { kind: string; params: unknown } = step(d, id);
  if (s.kind !== kind) throw new Error(`${id} is not a ${kind}`);
  return s.params as ParamsOfKind<K>;
}

function issuesOf(d: Doc): RouteIssue[] {
  const doc = parseRoute(d);
  const { ctx, issues } = buildContext(doc);
  return validateRoute(doc, ctx, issues).issues;
}

/** Every failure the validation (and the resolution of the components before it) can report, with the field it names. */
const CASES: Array<{ what: string; field: RegExp; make: (d: Doc) => void }> = [
  {
    what: 'a step id used twice',
    field: /^steps\[\d+\]\.id$/,
    make: (d) => d.steps.push({ ...structuredClone(step(d, 'dry')), name: 'Second dryer' }),
  },
  {
    what: 'a stream id used twice',
    field: /^connections\[\d+\]\.id$/,
    make: (d) => {
      d.connections[7] = { ...d.connections[7], id: d.connections[0].id };
    },
  },
  {
    what: 'a stream from a step not on the route',
    field: /\.from\.stepId$/,
    make: (d) => {
      d.connections[0].from.stepId = 'stp-gone-q9';
    },
  },
  {
    what: 'a stream to a step not on the route',
    field: /\.to\.stepId$/,
    make: (d) => {
      d.connections[0].to.stepId = 'stp-gone-q9';
    },
  },
  {
    what: 'an output a step does not have',
    field: /\.from\.port$/,
    make: (d) => {
      d.connections[0].from.port = 'nozzle';
    },
  },
  {
    what: 'an input a step does not have',
    field: /\.to\.port$/,
    make: (d) => {
      d.connections[0].to.port = 'nozzle';
    },
  },
  {
    what: 'a stream of the wrong phase',
    field: /^connections\[\d+\]$/,
    make: (d) => {
      d.connections.push({
        id: 'lnk-vap-q9',
        from: { stepId: 'stp-dry-q9', port: 'vapour' },
        to: { stepId: 'stp-filter-q9', port: 'slurry' },
      });
    },
  },
  {
    what: 'a step feeding itself',
    field: /^connections\[\d+\]$/,
    make: (d) => {
      d.connections.push({
        id: 'lnk-self-q9',
        from: { stepId: 'stp-swap-q9', port: 'distillate' },
        to: { stepId: 'stp-swap-q9', port: 'feed' },
      });
    },
  },
  {
    what: 'an output used twice and an input used twice',
    field: /\.(from|to)\.port$/,
    make: (d) => {
      d.connections.push({
        id: 'lnk-dup-q9',
        from: { stepId: 'stp-acid-wash-q9', port: 'organic' },
        to: { stepId: 'stp-swap-q9', port: 'feed' },
      });
    },
  },
  {
    what: 'a required input left open',
    field: /^inputs\.feed$/,
    make: (d) => {
      d.connections = d.connections.filter((c) => c.id !== 'lnk-c5-q9');
    },
  },
  {
    what: 'a loop',
    field: /^connections$/,
    make: (d) => {
      d.steps.push({ id: 'stp-back-q9', kind: 'merge', name: 'Recycle', params: {} });
      d.connections = d.connections.filter((c) => c.id !== 'lnk-c2-q9');
      d.connections.push(
        {
          id: 'lnk-x1-q9',
          from: { stepId: 'stp-acid-wash-q9', port: 'organic' },
          to: { stepId: 'stp-back-q9', port: 'a' },
        },
        {
          id: 'lnk-x2-q9',
          from: { stepId: 'stp-base-wash-q9', port: 'aqueous' },
          to: { stepId: 'stp-back-q9', port: 'b' },
        },
        {
          id: 'lnk-x3-q9',
          from: { stepId: 'stp-back-q9', port: 'out' },
          to: { stepId: 'stp-base-wash-q9', port: 'feed' },
        },
      );
    },
  },
  {
    what: 'a compound not on the route',
    field: /^params\.mode\.addSolventId$/,
    make: (d) => {
      const p = params(d, 'swap', 'distillation');
      if (p.mode.kind === 'put-and-take') p.mode.addSolventId = 'cmp-gone-q9';
    },
  },
  {
    what: 'a compound where a solvent is wanted',
    field: /^params\.mode\.antisolventId$/,
    make: (d) => {
      const p = params(d, 'antisolvent', 'crystallisation');
      if (p.mode.kind === 'antisolvent') p.mode.antisolventId = 'pw417-amide';
    },
  },
  {
    what: 'a solvent where an aqueous solute is wanted',
    field: /^params\.addedLiquid\.soluteId$/,
    make: (d) => {
      const p = params(d, 'acid-wash', 'wash');
      if (p.addedLiquid.kind === 'aqueous') p.addedLiquid.soluteId = 'water';
    },
  },
  {
    what: 'a solvent where a compound or aqueous solute is wanted',
    field: /^params\.reagentId$/,
    make: (d) => {
      d.steps.push({
        id: 'stp-quench-q9',
        kind: 'quench',
        name: 'Quench the amine',
        params: {
          reagentId: '2-propanol',
          equiv: 1,
          reactsWith: 'pw417-amine',
          temperatureC: 20,
        },
      });
      d.connections.push({
        id: 'lnk-q-q9',
        from: { stepId: 'stp-swap-q9', port: 'distillate' },
        to: { stepId: 'stp-quench-q9', port: 'feed' },
      });
    },
  },
  {
    what: 'an aqueous solution without water on the route',
    field: /^params\.addedLiquid\.wtPct$/,
    make: (d) => {
      d.components = d.components.filter((c) => !(c.kind === 'solvent' && c.id === 'water'));
    },
  },
  {
    what: 'an aqueous solution above its saturation',
    field: /^params\.addedLiquid\.wtPct$/,
    make: (d) => {
      const p = params(d, 'base-wash', 'wash');
      if (p.addedLiquid.kind === 'aqueous') p.addedLiquid.wtPct = 30;
    },
  },
  {
    what: 'wt % without a crude mass',
    field: /^params\.crudeMassKg$/,
    make: (d) => {
      const p = params(d, 'crude', 'charge');
      delete p.crudeMassKg;
      p.contents.push({ kind: 'component', componentId: 'coupling-urea', amount: 1, unit: 'wt%' });
    },
  },
  {
    what: 'an aqueous solute charged by volume',
    field: /^params\.contents\[\d+\]\.unit$/,
    make: (d) => {
      params(d, 'crude', 'charge').contents.push({
        kind: 'component',
        componentId: 'nacl',
        amount: 1,
        unit: 'L',
      });
    },
  },
  {
    what: 'a compound listed twice',
    field: /^components\[\d+\]\.id$/,
    make: (d) => {
      d.components.push(structuredClone(d.components.find((c) => c.kind === 'compound')!));
    },
  },
  {
    what: 'a solvent not in the library',
    field: /^components\[\d+\]\.solventId$/,
    make: (d) => {
      d.components.push({ kind: 'solvent', id: 'slv-gone-q9', solventId: 'slv-gone-q9' });
    },
  },
  {
    what: 'an aqueous solute not in the library',
    field: /^components\[\d+\]\.soluteId$/,
    make: (d) => {
      d.components.push({ kind: 'aqueous-solute', soluteId: 'aq-gone-q9' });
    },
  },
  {
    what: 'two products',
    field: /^components$/,
    make: (d) => {
      const c = d.components.find((x) => x.kind === 'compound' && x.role === 'impurity');
      if (c?.kind === 'compound') c.role = 'product';
    },
  },
  {
    what: 'a reference compound not on the route',
    field: /^referenceInput\.componentId$/,
    make: (d) => {
      d.referenceInput.componentId = 'cmp-gone-q9';
    },
  },
];

/** A quoted lower-case identifier ("feed", 'water', “x”), a dotted path or an index — what a script reads, not a chemist. */
const RAW = [
  /["'`“”‘’]\s*[a-z0-9]+(?:[-_.][a-z0-9]+)*\s*["'`“”‘’]/,
  /\b[a-z]\w*\.[a-z]\w*\b/i,
  /\w\[\d+\]/,
  /\bport\b/i,
  /\bcomponent id\b/i,
];

function rawIdsOf(d: Doc): string[] {
  return [
    ...d.steps.map((s) => s.id),
    ...d.connections.map((c) => c.id),
    ...d.components.flatMap((c) => (c.kind === 'compound' ? [c.id] : [])),
    'stp-gone-q9',
    'cmp-gone-q9',
    'slv-gone-q9',
    'aq-gone-q9',
    'nozzle',
  ];
}

describe('route validation messages are in the chemist’s words', () => {
  it('the demo route itself has no problem (so each case below reports its own)', () => {
    expect(issuesOf(demo())).toEqual([]);
  });

  it.each(CASES)('$what: named with the field for scripts, and no raw id in the message', (c) => {
    const d = demo();
    c.make(d);
    const issues = issuesOf(d);
    // The failure is reported, with the machine-readable field kept as it was.
    expect(issues.some((i) => c.field.test(i.field))).toBe(true);
    const ids = rawIdsOf(d);
    for (const i of issues) {
      for (const pattern of RAW) expect(i.message, i.message).not.toMatch(pattern);
      for (const id of ids) expect(i.message.includes(id), `${id} in: ${i.message}`).toBe(false);
      // Says what to do, after a colon.
      expect(i.message, i.message).toMatch(/: \S/);
    }
  });

  it('the checks themselves catch a raw id (so the test above can fail)', () => {
    for (const leaked of [
      'Required input "feed" is not connected.',
      '"x" is not a solvent component.',
      'Port feed takes liquid, not the solid from stp-dry-q9.cake.',
    ])
      expect(RAW.some((r) => r.test(leaked))).toBe(true);
  });

  it('names the step, the input and the compound as the card shows them', () => {
    const open = demo();
    open.connections = open.connections.filter((c) => c.id !== 'lnk-c5-q9');
    expect(issuesOf(open)).toContainEqual(
      expect.objectContaining({
        stepId: 'stp-antisolvent-q9',
        field: 'inputs.feed',
        message:
          "The feed of the crystallisation “Heptane antisolvent at 60 °C, seeded” is not connected: draw a stream into it from an earlier step's output.",
      }),
    );
    const wrong = demo();
    const p = params(wrong, 'antisolvent', 'crystallisation');
    if (p.mode.kind === 'antisolvent') p.mode.antisolventId = 'pw417-amide';
    expect(issuesOf(wrong)).toContainEqual(
      expect.objectContaining({
        field: 'params.mode.antisolventId',
        message: 'PW-417 amide (invented) is not a solvent: choose a solvent here.',
      }),
    );
    const twice = demo();
    twice.connections.push({
      id: 'lnk-dup-q9',
      from: { stepId: 'stp-acid-wash-q9', port: 'organic' },
      to: { stepId: 'stp-swap-q9', port: 'feed' },
    });
    expect(issuesOf(twice).map((i) => i.message)).toContain(
      'The organic layer of the wash “1 M HCl wash (removes the amine)” goes to two steps: a stream goes to one step; add a split to divide it.',
    );
  });
});

describe('a step the engine cannot work out says why in the chemist’s words', () => {
  it('a distillation whose solvents have no boiling model names the step and the solvents, not the model’s groups', () => {
    // 2-MeTHF (an ether) and NMP: the UNIFAC table of Hansen et al. (Ind. Eng. Chem. Res. 1991,
    // 30, 2352) has no parameters for the ether–NMP main-group pair.
    const d = demo();
    d.components.push({ kind: 'solvent', id: 'nmp', solventId: 'nmp' });
    const p = params(d, 'swap', 'distillation');
    if (p.mode.kind !== 'put-and-take') throw new Error('the demo swap is put-and-take');
    p.mode.addSolventId = 'nmp';
    let issues: RouteIssue[] = [];
    try {
      evaluateRoute(d);
    } catch (e) {
      issues = (e as RouteValidationError).issues;
    }
    expect(issues).toHaveLength(1);
    expect(issues[0]).toMatchObject({ stepId: 'stp-swap-q9', field: 'params' });
    const message = issues[0].message;
    expect(message).toMatch(/^The distillation “Solvent swap to 2-propanol” cannot work out how /);
    expect(message).toMatch(/2-Methyltetrahydrofuran and N-Methyl-2-pyrrolidone/);
    expect(message).toMatch(/: \S/);
    for (const raw of [/VLE/, /UNIFAC cannot/, /main-group/, /\(\d+\)/, /stp-/, /pot solvents/])
      expect(message).not.toMatch(raw);
  });
});
