import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { StepPanel } from '@/features/editor/components/step-panel';
import type { StepInput } from '@/features/editor/document';

// The step form is rendered as a component: each problem appears once, beside
// its field, and only problems with no field of their own are listed above the
// form. (Before, the form was called as a plain function and the removal rows,
// rendered later, were listed both above the form and beside their fields.)
const step = (removals: unknown[]): StepInput =>
  ({
    id: 's1',
    name: 'Carbon',
    kind: 'carbon-treatment',
    params: { carbonWtPct: 5, removals, temperatureC: 25 },
  }) as StepInput;

const count = (text: string, part: string) => text.split(part).length - 1;

describe('step form', () => {
  it('shows a removal row’s problem beside its field only', () => {
    const html = renderToStaticMarkup(
      createElement(StepPanel, {
        step: step([{ componentId: 'impurity-a', fractionRemoved: 1.5 }]),
      }),
    );
    expect(html).toContain('Fraction removed 1');
    expect(html).not.toContain('params.removals.0.fractionRemoved');
    expect(html).toContain('aria-invalid="true"');
    expect(count(html, 'Enter at most 1.')).toBe(1);
    expect(html).not.toContain('Too big');
    expect(html).not.toMatch(/<ul[^>]*role="alert"/);
  });

  it('lists a problem that has no field of its own above the form', () => {
    const html = renderToStaticMarkup(
      createElement(StepPanel, {
        step: { ...step([]), params: { ...step([]).params, stray: 1 } } as unknown as StepInput,
      }),
    );
    expect(html).toMatch(/<ul[^>]*role="alert"/);
    expect(html).toContain('This setting is not one the step has');
    expect(html).not.toContain('params');
  });

  it('puts a problem with the value of an uncertain number on its field, once, in words', () => {
    const html = renderToStaticMarkup(
      createElement(StepPanel, {
        step: {
          id: 's2',
          name: 'Antisolvent',
          kind: 'crystallisation',
          params: {
            mode: {
              kind: 'antisolvent',
              antisolventId: 'n-heptane',
              volume: { value: 5e6, unit: 'vol' },
              temperatureC: 20,
            },
            seeded: false,
          },
        } as unknown as StepInput,
      }),
    );
    expect(html).not.toMatch(/params\.|Too big|expected number/);
    expect(html).not.toMatch(/<ul[^>]*role="alert"/);
    expect(html).toContain('aria-invalid="true"');
  });

  it('renders a clean step with no problem list', () => {
    const html = renderToStaticMarkup(
      createElement(StepPanel, {
        step: step([{ componentId: 'impurity-a', fractionRemoved: 0.5 }]),
      }),
    );
    expect(html).not.toMatch(/<ul[^>]*role="alert"/);
  });
});
