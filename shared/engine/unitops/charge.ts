/**
 * Charge: the crude input or an addition to a stream already in the vessel.
 *
 * Purpose: turn the chemist's charge list (kg, wt % of a crude mass, L or
 * "vol" of a liquid, equiv, aqueous media at wt %) into component masses.
 * Formulae: kg = wt%/100 · m_crude; kg = V ρ(T) (liquids; compounds at their
 * stated density or 1.2 g/mL, common practice); kg = equiv · n_ref · M;
 * aqueous medium: m = V / (w v_solute + (1 − w) v_water), split into water
 * and solute by w. Units: T [°C in the document → K], V [L or vol], m [kg].
 * Assumptions: everything charged mixes into one liquid at the charge
 * temperature (solids count as dissolved until a crystallisation says
 * otherwise); no reaction.
 */
import type { ParamsOf, RouteStep } from '../document';
import { RANGES } from '../document';
import type { EvalContext } from '../route/context';
import {
  aqueousMediumKg,
  cloneStream,
  commonCautions,
  cToK,
  emptyStream,
  finishStream,
  method,
  volumeToM3,
} from '../route/context';
import { StepError } from '../route/errors';
import { AQUEOUS_NEEDS_WATER } from '../route/step-words';
import type { StepOutput, Stream } from '../route/types';
import { addTo, COMMON_PRACTICE_BASIS, COMMON_PRACTICE_HOURS, newResult, round } from './common';

/**
 * Charge step model: turns the charge list into component masses added to the
 * feed (or to an empty vessel) at the charge temperature; formulae in the
 * module comment.
 * Source: mass and volume bookkeeping with ideal mixing of component volumes
 * (densities from the solvent library, see docs/data-sources.md); a compound
 * without a density at 1.2 g/mL (common practice).
 * Validity: any charge the schema accepts; volumes by ideal mixing (excess
 * volumes of a few % for e.g. alcohol–water are neglected); no reaction.
 * @param inputs  the incoming stream on port 'feed', if any
 * @param params  the step's parameters (contents, temperatureC [°C], crudeMassKg [kg])
 * @param ctx     evaluation context (route components resolved against the library)
 * @param step    the route step being evaluated
 * @returns the output stream 'out' and the step result (added kg, volumes [m³], cautions)
 */
export function charge(
  inputs: Record<string, Stream | undefined>,
  params: ParamsOf<'charge'>,
  ctx: EvalContext,
  step: RouteStep,
): StepOutput {
  const T = cToK(ctx.num(params.temperatureC, ...RANGES.temperatureC));
  const result = newResult(step, {
    hours: COMMON_PRACTICE_HOURS.charge,
    basis: COMMON_PRACTICE_BASIS,
  });
  const out = inputs.feed ? cloneStream(inputs.feed) : emptyStream(ctx, 'liquid', T);
  out.temperatureK = T;
  const crudeKg =
    params.crudeMassKg !== undefined ? ctx.num(params.crudeMassKg, ...RANGES.massKg) : undefined;
  let addedVolume = 0;
  params.contents.forEach((e, i) => {
    if (e.kind === 'aqueous') {
      if (!ctx.waterId) throw new StepError(`params.contents[${i}]`, AQUEOUS_NEEDS_WATER);
      const V = volumeToM3(ctx, e.volume);
      const { waterKg, soluteKg } = aqueousMediumKg(ctx, e.soluteId, ctx.num(e.wtPct, 0, 60), V, T);
      addTo(result.addedKg, ctx.waterId, waterKg);
      addTo(result.addedKg, e.soluteId, soluteKg);
      addedVolume += V;
      return;
    }
    const comp = ctx.comps.get(e.componentId)!;
    const amount = ctx.num(e.amount, ...RANGES.volume);
    let kg: number;
    switch (e.unit) {
      case 'kg':
        kg = amount;
        break;
      case 'wt%':
        if (crudeKg === undefined)
          throw new StepError(
            `params.contents[${i}].unit`,
            'Entries in wt% need the crude mass they refer to: enter the crude mass.',
          );
        kg = (amount / 100) * crudeKg;
        break;
      case 'L':
      case 'vol': {
        const V = volumeToM3(ctx, { value: amount, unit: e.unit });
        kg = V / comp.specificVolume(T);
        if (comp.kind !== 'compound') addedVolume += V;
        break;
      }
      case 'equiv':
        kg = amount * ctx.referenceMol * comp.molarMassKgMol;
        break;
    }
    addTo(result.addedKg, e.componentId, kg);
  });
  for (const id in result.addedKg) out.kg[id] += result.addedKg[id];
  finishStream(ctx, out);
  const anyLiquid = ctx.ids.some((id) => out.kg[id] > 0 && ctx.comps.get(id)!.kind === 'solvent');
  if (!anyLiquid) out.phase = 'solid';
  result.addedVolumeM3 = addedVolume;
  result.peakVolumeM3 = out.volumeM3;
  commonCautions(ctx, out.kg, T, result.warnings, { transfer: true });
  method(
    result.methods,
    'volumes',
    'ideal mixing of component volumes',
    'densities from the solvent library; compounds at their stated density or 1.2 g/mL (common practice)',
  );
  result.summary = {
    'charged kg': round(Object.values(result.addedKg).reduce((a, b) => a + b, 0)),
    'volume L': round(out.volumeM3 * 1000, 3),
  };
  result.details = { chargedKg: { ...result.addedKg } };
  return { outputs: { out }, result };
}
