/**
 * The calculation API's work: resolve the components, call the engine, and
 * say which method and which data each answer used. Pure functions of the
 * request (no database).
 */
import { estimateHansen } from '@shared/chemistry';
import type {
  ActivityCoefficientsReply,
  ActivityCoefficientsRequest,
  AzeotropeReply,
  AzeotropeRequest,
  BubblePointReply,
  BubblePointRequest,
  HansenDistanceReply,
  HansenDistanceRequest,
  PartitionReply,
  SolubilityReply,
  SolubilityRequest,
  VapourPressureReply,
  VapourPressureRequest,
  partitionRequestSchema,
} from '@shared/schemas/calc';
import type { z } from 'zod';
import { AQUEOUS_SOLUTES, aqueousSoluteById, type SolventRecord } from '@shared/engine/data';
import {
  activityCorrectedSolubility,
  distributionRatio,
  hansenDistance,
  idealSolubility,
  saturatedPhasesWithWater,
  type DistributionInput,
} from '@shared/engine/properties';
import {
  activityCoefficients,
  bubblePoint,
  createVleSystem,
  findBinaryAzeotrope,
  solventVapourPressureData,
  vapourPressure,
  type VleComponent,
} from '@shared/engine/thermo';
import { celsiusToKelvin, kelvinToCelsius, kPaToPa, paToKPa } from '@shared/engine/units';
import {
  assignedGroupsSource,
  describeResolved,
  groupsOf,
  mapEngineErrors,
  presentSource,
  resolveSmiles,
  subgroupRows,
  unifacSource,
  unprocessable,
  type ResolvedSmiles,
} from './components';

const fallbackOf = (s: SolventRecord) => solventVapourPressureData(s).extra;

function requireLibrary(component: ResolvedSmiles, label: string, why: string): SolventRecord {
  if (component.basis === 'library') return component.solvent;
  throw unprocessable(
    'no_data',
    `${label} (${component.smiles}) is not in the solvent library, and ${why} needs its curated data (Antoine constants). Use a library solvent.`,
  );
}

export function calcVapourPressure(input: VapourPressureRequest): VapourPressureReply {
  const component = resolveSmiles(input.component.smiles, 'the component');
  const solvent = requireLibrary(component, 'The component', 'a vapour pressure');
  const result = mapEngineErrors(() =>
    vapourPressure(solvent.antoine, celsiusToKelvin(input.temperatureC), fallbackOf(solvent)),
  );
  return {
    pressureKPa: paToKPa(result.pressurePa),
    method: result.method,
    source: presentSource(result.source),
    component: describeResolved(component),
    warnings: result.warnings,
  };
}

export function calcActivityCoefficients(
  input: ActivityCoefficientsRequest,
): ActivityCoefficientsReply {
  const resolved = input.components.map((c, i) => resolveSmiles(c.smiles, `component ${i + 1}`));
  const groups = resolved.map((c, i) => groupsOf(c, `component ${i + 1}`));
  const gammas = mapEngineErrors(() =>
    activityCoefficients(groups, input.moleFractions, celsiusToKelvin(input.temperatureC)),
  );
  const warnings: string[] = [];
  if (input.temperatureC < 2 || input.temperatureC > 152) {
    warnings.push(
      `UNIFAC parameters were fitted at about 275–425 K; ${input.temperatureC} °C is outside.`,
    );
  }
  resolved.forEach((c, i) => {
    if (c.basis === 'structure')
      warnings.push(
        `Component ${i + 1}: groups assigned automatically from the structure; check them.`,
        ...c.assignment.warnings,
      );
  });
  return {
    activityCoefficients: gammas,
    groups: resolved.map((c, i) => ({
      ...describeResolved(c),
      subgroups: subgroupRows(groups[i]),
      source:
        c.basis === 'library' ? presentSource(c.solvent.unifac.source) : assignedGroupsSource(),
    })),
    method: 'UNIFAC (original; Fredenslund, Jones & Prausnitz 1975)',
    source: unifacSource(),
    warnings,
  };
}

export function calcBubblePoint(input: BubblePointRequest): BubblePointReply {
  const resolved = input.components.map((c, i) => resolveSmiles(c.smiles, `component ${i + 1}`));
  const warnings: string[] = [];
  const components: VleComponent[] = resolved.map((c, i) => {
    const unifac = groupsOf(c, `component ${i + 1}`);
    if (c.basis === 'library') {
      const s = c.solvent;
      const fb = fallbackOf(s);
      return {
        name: s.name,
        antoine: s.antoine,
        unifac,
        vapourPressure: fb.correlation,
        TbK: fb.TbK,
        dHvapJmol: fb.dHvapJmol,
      };
    }
    warnings.push(
      `Component ${i + 1} (${c.smiles}) is not in the solvent library: treated as non-volatile (it lowers the others' activity but does not enter the vapour).`,
    );
    return { name: c.smiles, antoine: [], unifac, nonVolatile: true };
  });
  const result = mapEngineErrors(() =>
    bubblePoint(createVleSystem(components), input.moleFractions, kPaToPa(input.pressureKPa)),
  );
  const sources = resolved.flatMap((c) =>
    c.basis === 'library'
      ? c.solvent.antoine.slice(0, 1).map((set) => presentSource(set.source))
      : [],
  );
  return {
    temperatureC: kelvinToCelsius(result.T_K),
    vapourMoleFractions: result.y,
    activityCoefficients: result.gammas,
    components: resolved.map((c, i) => ({
      ...describeResolved(c),
      volatile: !components[i].nonVolatile,
    })),
    method: "modified Raoult's law with UNIFAC activity coefficients and Antoine vapour pressures",
    sources: [...sources, unifacSource()],
    warnings: [...warnings, ...result.warnings],
  };
}

export function calcAzeotrope(input: AzeotropeRequest): AzeotropeReply {
  const resolved = input.components.map((c, i) => resolveSmiles(c.smiles, `component ${i + 1}`));
  const solvents = resolved.map((c, i) =>
    requireLibrary(c, `Component ${i + 1}`, 'an azeotrope search'),
  );
  const result = mapEngineErrors(() => {
    const system = createVleSystem(
      solvents.map((s) => ({
        name: s.name,
        antoine: s.antoine,
        unifac: s.unifac.value,
        vapourPressure: fallbackOf(s).correlation,
        TbK: fallbackOf(s).TbK,
        dHvapJmol: fallbackOf(s).dHvapJmol,
      })),
    );
    return findBinaryAzeotrope(system, kPaToPa(input.pressureKPa));
  });
  return {
    found: result.found,
    temperatureC: result.T_K !== undefined ? kelvinToCelsius(result.T_K) : null,
    moleFractions: result.x ? [...result.x] : null,
    kind: result.kind ?? null,
    components: resolved.map(describeResolved),
    method:
      "sign change of the relative volatility along the bubble-point curve (modified Raoult's law, UNIFAC, Antoine)",
    sources: [
      ...solvents.map((s) => presentSource(s.antoine[0]?.source ?? s.boilingPointC.source)),
      unifacSource(),
    ],
    warnings: result.warnings,
  };
}

function findSalt(name: string) {
  const key = name.trim().toLowerCase();
  return (
    aqueousSoluteById(key) ??
    AQUEOUS_SOLUTES.find((a) => a.name.toLowerCase() === key || a.formula.toLowerCase() === key)
  );
}

export function calcPartition(input: z.output<typeof partitionRequestSchema>): PartitionReply {
  const organic = resolveSmiles(input.organic.smiles, 'the organic solvent');
  if (organic.basis !== 'library') {
    throw unprocessable(
      'no_data',
      `The organic solvent (${organic.smiles}) is not in the solvent library; a partition needs its curated data. Use a library solvent.`,
    );
  }
  const solvent = organic.solvent;
  if (solvent.id === 'water')
    throw unprocessable('not_computable', 'The organic phase cannot be water.');
  if (solvent.waterMiscibility === 'miscible') {
    throw unprocessable(
      'not_computable',
      `${solvent.name} is miscible with water: there is no second phase to partition into.`,
    );
  }
  const solute = resolveSmiles(input.solute.smiles, 'the solute');
  const warnings: string[] = [];
  let soluteGroups: DistributionInput['solute']['unifac'];
  if (input.solute.logP === undefined) {
    soluteGroups = groupsOf(solute, 'the solute');
    if (solute.basis === 'structure')
      warnings.push('Solute UNIFAC groups assigned automatically from the structure.');
  }
  let salt: DistributionInput['aqueous']['salt'];
  if (input.aqueous.salt) {
    const record = findSalt(input.aqueous.salt.name);
    if (!record) {
      throw unprocessable(
        'no_data',
        `Unknown salt "${input.aqueous.salt.name}". Known: ${AQUEOUS_SOLUTES.map((a) => a.id).join(', ')}.`,
      );
    }
    if (!record.setschenowKs)
      throw unprocessable(
        'no_data',
        `No Setschenow coefficient is curated for ${record.name}; salting-out cannot be estimated.`,
      );
    salt = { ks_Lmol: record.setschenowKs.value, molar: input.aqueous.salt.molar };
    warnings.push(
      `Setschenow coefficient ${record.setschenowKs.value} L/mol for ${record.name} is a typical value for neutral organics, not specific to this solute.`,
    );
  }
  // The mutually saturated phases from the library's mutual solubility (the engine's one builder).
  const phases = saturatedPhasesWithWater(solvent);
  warnings.push(...phases.warnings);
  const result = mapEngineErrors(() =>
    distributionRatio({
      solute: { logP: input.solute.logP, pKa: input.solute.pKa, unifac: soluteGroups },
      organic: { solventId: solvent.id, ...phases.organic },
      aqueous: { pH: input.aqueous.pH, salt, ...phases.aqueous },
      T_K: celsiusToKelvin(input.temperatureC),
    }),
  );
  return {
    logD: result.logD,
    D: result.D,
    basis: result.basis,
    method: result.method,
    source: presentSource(result.source),
    organic: describeResolved(organic),
    warnings: [...warnings, ...result.warnings],
  };
}

export function calcSolubility(input: SolubilityRequest): SolubilityReply {
  const base = {
    meltingPointK: celsiusToKelvin(input.solute.meltingPointC),
    enthalpyFusionJmol: input.solute.enthalpyFusionKJmol * 1000,
    T_K: celsiusToKelvin(input.temperatureC),
  };
  if (!input.solvent || !input.solute.smiles) {
    const ideal = mapEngineErrors(() => idealSolubility(base));
    const warnings = [...ideal.warnings];
    if (input.solvent && !input.solute.smiles)
      warnings.push(
        "No solute SMILES given: the activity correction needs the solute's structure, so the ideal solubility is returned.",
      );
    return {
      idealMoleFraction: ideal.moleFraction,
      moleFraction: ideal.moleFraction,
      activityCoefficient: null,
      method: ideal.method,
      solvent: input.solvent
        ? describeResolved(resolveSmiles(input.solvent.smiles, 'the solvent'))
        : null,
      warnings,
    };
  }
  const solute = resolveSmiles(input.solute.smiles, 'the solute');
  const solvent = resolveSmiles(input.solvent.smiles, 'the solvent');
  const soluteGroups = groupsOf(solute, 'the solute');
  const solventGroups = groupsOf(solvent, 'the solvent');
  const result = mapEngineErrors(() =>
    activityCorrectedSolubility({
      ...base,
      soluteGroups,
      solventGroups: [solventGroups],
      solventMoleFractions: [1],
    }),
  );
  return {
    idealMoleFraction: result.idealMoleFraction,
    moleFraction: result.moleFraction,
    activityCoefficient: result.gamma,
    method: result.method,
    solvent: describeResolved(solvent),
    warnings: result.warnings,
  };
}

type HansenOperand = HansenDistanceRequest['a'];

function hansenOf(operand: HansenOperand, label: string): HansenDistanceReply['a'] {
  if (!('smiles' in operand)) return { ...operand, basis: 'given', source: null, method: null };
  const component = resolveSmiles(operand.smiles, label);
  if (component.basis === 'library') {
    return {
      ...component.solvent.hansen.value,
      basis: 'library',
      source: presentSource(component.solvent.hansen.source),
      method: null,
    };
  }
  const estimate = estimateHansen({ smiles: operand.smiles }, { kind: 'fedors' });
  if (!estimate.ok)
    throw unprocessable(
      'no_data',
      `${label.charAt(0).toUpperCase()}${label.slice(1)} (${operand.smiles}): Hansen parameters cannot be estimated: ${estimate.reason}`,
    );
  return { ...estimate.params, basis: 'estimated', source: null, method: estimate.method };
}

export function calcHansenDistance(input: HansenDistanceRequest): HansenDistanceReply {
  const a = hansenOf(input.a, 'material a');
  const b = hansenOf(input.b, 'material b');
  const ra = mapEngineErrors(() => hansenDistance(a, b));
  const warnings: string[] = [];
  for (const [label, x] of [
    ['a', a],
    ['b', b],
  ] as const) {
    if (x.basis === 'estimated')
      warnings.push(
        `Material ${label}: Hansen parameters estimated by group contributions (Hoftyzer–Van Krevelen, Fedors volume); increments unverified, prefer measured values.`,
      );
  }
  return {
    ra,
    a,
    b,
    method:
      "Hansen distance Ra² = 4(ΔδD)² + (ΔδP)² + (ΔδH)² (Hansen, Hansen Solubility Parameters: A User's Handbook, 2nd ed., 2007, eq. 1.9)",
    warnings,
  };
}
