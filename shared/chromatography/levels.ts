/**
 * The level of each compound the route predicts at a step, to set beside the
 * measured area %. Pure.
 *
 * The predicted level is the compound's share of all compounds (product,
 * impurities, reagents, by-products — not solvents or salts) in the stream
 * the route carries on from the step: the kept layer of a wash or
 * extraction, otherwise the step's first output. Area % equals this mass
 * share only when every compound has the same detector response per mass; the
 * comparison assumes that (no response factors are applied).
 */
import { PORTS, type RouteComponent, type StepKind } from '../engine/document';
import type { Stream } from '../engine/route/types';

export interface PredictedLevel {
  componentId: string;
  name: string;
  /** Share of all compounds in the stream [%]. */
  levelPct: number;
}

interface StepLike {
  id: string;
  kind: StepKind;
  params?: unknown;
}

interface ResultLike {
  streams: Record<string, Stream>;
  terminals: Array<{ stepId: string; port: string; stream: Stream }>;
}

interface DocLike {
  components: RouteComponent[];
  steps: StepLike[];
  connections: Array<{ id: string; from: { stepId: string; port: string } }>;
}

/** The port a sample taken at this step comes from. */
export function sampledPort(step: StepLike): string {
  if (step.kind === 'wash' || step.kind === 'extraction') {
    const keep = (step.params as { keep?: string } | undefined)?.keep;
    return keep === 'aqueous' ? 'aqueous' : 'organic';
  }
  return PORTS[step.kind].outputs[0].name;
}

export function predictedLevels(
  doc: DocLike,
  result: ResultLike,
  stepId: string,
): PredictedLevel[] {
  const step = doc.steps.find((s) => s.id === stepId);
  if (!step) return [];
  const port = sampledPort(step);
  const connection = doc.connections.find((c) => c.from.stepId === stepId && c.from.port === port);
  const stream = connection
    ? result.streams[connection.id]
    : result.terminals.find((t) => t.stepId === stepId && t.port === port)?.stream;
  if (!stream) return [];
  const compounds = doc.components.filter(
    (c): c is Extract<RouteComponent, { kind: 'compound' }> => c.kind === 'compound',
  );
  const total = compounds.reduce((sum, c) => sum + (stream.kg[c.id] ?? 0), 0);
  if (!(total > 0)) return [];
  return compounds.map((c) => ({
    componentId: c.id,
    name: c.name,
    levelPct: (100 * (stream.kg[c.id] ?? 0)) / total,
  }));
}
