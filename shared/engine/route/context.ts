/**
 * The evaluation context: the route's components resolved against the
 * curated library, unit conversions at the engine's edge, the parameter
 * reader (nominal or Monte Carlo draw), and stream helpers.
 */
import type { AqueousSoluteRecord, SolventRecord } from '../data/types';
import { aqueousSoluteById, solventById } from '../data/index';
import { componentKey } from '../document';
import type { EngineWarning, MethodUsed, Stream } from './types';
import type { PortPhase, CompoundSnapshot, RouteDocument, Uncertain, Volume } from '../document';
import type { SeededRandom } from '../random';
import { createUnifacModelCache, type UnifacModelCache } from '../thermo/unifac';
import { idRecord } from '../text';

/** Density assumed for a compound without a stated density, g/mL (common practice for organic solids, typically 1.1–1.4). */
export const DEFAULT_COMPOUND_DENSITY_GML = 1.2;

export interface ResolvedComponent {
  id: string;
  name: string;
  kind: 'solvent' | 'aqueous-solute' | 'compound';
  role: 'solvent' | 'aqueous-solute' | 'product' | 'impurity' | 'reagent' | 'by-product';
  /** Molar mass [kg/mol]. */
  molarMassKgMol: number;
  solvent?: SolventRecord;
  aqueous?: AqueousSoluteRecord;
  compound?: CompoundSnapshot;
  isWater: boolean;
  /** Liquid (solvent) or density-apparent volume contribution: specific volume [m³/kg] at T [K]. */
  specificVolume(T_K: number): number;
}

export interface EvalContext {
  ids: string[];
  comps: Map<string, ResolvedComponent>;
  waterId: string | null;
  productId: string | null;
  referenceKg: number;
  referenceMol: number;
  /** Read a possibly uncertain parameter: nominal value, or a draw in Monte Carlo. */
  num(u: Uncertain, min: number, max: number): number;
  rng: SeededRandom | null;
  /**
   * Memo of things that depend on the document only, never on a drawn
   * parameter (fitted solubility curves, keyed by compound and solvent
   * component). Shared by the evaluations of one prepared route.
   */
  cache: Map<string, unknown>;
  /** UNIFAC models by mixture (same numbers as building each one afresh); shared like `cache`. */
  unifac: UnifacModelCache;
  /**
   * Memo for one step's evaluation only (results that depend on drawn
   * parameters, e.g. distribution ratios): the evaluator gives each step a
   * fresh one, so a step's result depends on its own inputs alone.
   */
  scratch: Map<string, unknown>;
}

/**
 * Caches that the evaluations of one prepared route share (Monte Carlo draws
 * change parameters only). Keyed by document content, so bounded by the
 * document's components; they make nothing differ from a fresh evaluation.
 */
export interface EvaluationCaches {
  memo: Map<string, unknown>;
  unifac: UnifacModelCache;
}

/**
 * Fresh caches for the evaluations of one prepared route.
 * Source: this project's own bookkeeping (no external source).
 * Validity: one route document (the caches are keyed by its content).
 * @returns an empty memo and an empty UNIFAC model cache
 */
export function createEvaluationCaches(): EvaluationCaches {
  return { memo: new Map(), unifac: createUnifacModelCache() };
}

/**
 * Density of water at the library's reference temperature [g/mL]; 0.9982
 * (water at 20 °C, Tanaka et al., Metrologia 2001, 38, 301) only if the library lacks water.
 * Source: the solvent library's water record (docs/data-sources.md).
 * Validity: the record's reference temperature (no temperature dependence here).
 * @returns density of water [g/mL]
 */
export function waterDensityGmL(): number {
  const w = solventById('water');
  return w ? w.density.value.gPerMl : 0.9982;
}

/**
 * Solvent density at T [g/mL]: ρ(T) = ρ_ref + (dρ/dT)(T − T_ref), linear; the
 * record's reference density when no coefficient is known; never below
 * 0.3 ρ_ref (a floor against runaway extrapolation).
 * Source: reference density and its temperature coefficient from the solvent
 * library (docs/data-sources.md); the linear form is common practice.
 * Validity: liquid range, well below the critical point (linear within about
 * 1 % over 0–80 °C for the library's solvents).
 * @param s    the solvent record
 * @param T_K  temperature [K]
 * @returns density [g/mL]
 */
export function solventDensityGmL(s: SolventRecord, T_K: number): number {
  const d = s.density.value;
  const rho = d.gPerMl + (d.dPerK ?? 0) * (T_K - 273.15 - d.temperatureC);
  return Math.max(rho, 0.3 * d.gPerMl);
}

/**
 * Apparent specific volume of an aqueous solute [mL/g], from the densest
 * published solution point (w, ρ): v = (1/ρ − (1 − w)/ρ_water)/w. Ideal
 * mixing of water and solute at this apparent volume reproduces that
 * solution's density exactly and is approximate elsewhere. Without a
 * solution density point, 0.5 mL/g (an assumed solid density of 2 g/mL).
 * Source: density points of the aqueous-media library (docs/data-sources.md);
 * the apparent-volume formula is a mass and volume balance.
 * Validity: 0 ≤ w ≤ the densest tabulated point, at the table's temperature;
 * floored at 0.05 mL/g.
 * @param a  the aqueous solute record
 * @returns apparent specific volume of the solute [mL/g]
 */
export function aqueousApparentSpecificVolume(a: AqueousSoluteRecord): number {
  const pts = a.densityPoints.value.filter(([w]) => w > 0);
  const rw = waterDensityGmL();
  if (pts.length === 0) return 1 / 2.0;
  const [wPct, rho] = pts.reduce((m, p) => (p[0] > m[0] ? p : m));
  const w = wPct / 100;
  const v = (1 / rho - (1 - w) / rw) / w;
  return Math.max(v, 0.05);
}

/**
 * Resolve the route's components against the library and build the
 * evaluation context: specific volumes (solvents by solventDensityGmL,
 * aqueous solutes by their apparent volume, compounds at their stated density
 * or DEFAULT_COMPOUND_DENSITY_GML), the reference moles n = m_ref / M_ref and
 * the parameter reader (nominal value, or a uniform draw on value ± plusMinus
 * clipped to the field's range in Monte Carlo).
 * Source: this project's own bookkeeping (no external source).
 * Validity: any route document the schema accepts; unknown ids and a second
 * product are returned as issues with their field.
 * @param doc     the route document
 * @param rng     seeded random source for a Monte Carlo draw, or null for nominal values
 * @param caches  caches shared by the evaluations of one prepared route
 * @returns the context and the issues found (field and message)
 */
export function buildContext(
  doc: RouteDocument,
  rng: SeededRandom | null = null,
  caches: EvaluationCaches = createEvaluationCaches(),
): { ctx: EvalContext; issues: Array<{ field: string; message: string }> } {
  const issues: Array<{ field: string; message: string }> = [];
  const comps = new Map<string, ResolvedComponent>();
  doc.components.forEach((c, i) => {
    const key = componentKey(c);
    if (comps.has(key)) {
      issues.push({
        field: `components[${i}].id`,
        message: `${c.kind === 'compound' ? c.name : (comps.get(key)?.name ?? 'This compound')} is listed twice among the route's compounds: remove one of them.`,
      });
      return;
    }
    if (c.kind === 'solvent') {
      const s = solventById(c.solventId);
      if (!s) {
        issues.push({
          field: `components[${i}].solventId`,
          message: `Compound ${i + 1} of the route is a solvent that is not in the solvent library: remove it and choose a solvent from the library.`,
        });
        return;
      }
      comps.set(key, {
        id: key,
        name: s.name,
        kind: 'solvent',
        role: 'solvent',
        molarMassKgMol: s.molarMassGmol.value / 1000,
        solvent: s,
        isWater: s.id === 'water',
        specificVolume: (T) => 1 / (solventDensityGmL(s, T) * 1000),
      });
    } else if (c.kind === 'aqueous-solute') {
      const a = aqueousSoluteById(c.soluteId);
      if (!a) {
        issues.push({
          field: `components[${i}].soluteId`,
          message: `Compound ${i + 1} of the route is an aqueous solute that is not in the library: remove it and choose one from the library.`,
        });
        return;
      }
      const v = aqueousApparentSpecificVolume(a) / 1000;
      comps.set(key, {
        id: key,
        name: a.name,
        kind: 'aqueous-solute',
        role: 'aqueous-solute',
        molarMassKgMol: a.molarMassGmol.value / 1000,
        aqueous: a,
        isWater: false,
        specificVolume: () => v,
      });
    } else {
      const v = 1 / ((c.densityGmL ?? DEFAULT_COMPOUND_DENSITY_GML) * 1000);
      comps.set(key, {
        id: key,
        name: c.name,
        kind: 'compound',
        role: c.role,
        molarMassKgMol: c.molarMassGmol / 1000,
        compound: c,
        isWater: false,
        specificVolume: () => v,
      });
    }
  });
  const ids = [...comps.keys()];
  const water = [...comps.values()].find((c) => c.isWater);
  const products = [...comps.values()].filter((c) => c.role === 'product');
  if (products.length > 1)
    issues.push({
      field: 'components',
      message: `Only one compound can be the product, and ${products.map((p) => p.name).join(' and ')} are all marked so: mark the others as impurities or by-products.`,
    });
  const refComp = comps.get(doc.referenceInput.componentId);
  if (!refComp)
    issues.push({
      field: 'referenceInput.componentId',
      message: products.length
        ? `The reference compound is not one of the route's compounds: choose ${products[0].name}, the product, since yields are worked out per kg of it.`
        : 'Charge the compound you isolate (the product) in a Charge step: yield and purity are worked out per kg of it.',
    });
  const referenceKg = doc.referenceInput.massKg;
  const ctx: EvalContext = {
    ids,
    comps,
    waterId: water?.id ?? null,
    productId: products[0]?.id ?? null,
    referenceKg,
    referenceMol: refComp ? referenceKg / refComp.molarMassKgMol : NaN,
    rng,
    num(u, min, max) {
      if (typeof u === 'number') return u;
      if (!rng || u.plusMinus === 0) return u.value;
      const lo = Math.max(min, u.value - u.plusMinus);
      const hi = Math.min(max, u.value + u.plusMinus);
      return rng.uniform(lo, hi);
    },
    cache: caches.memo,
    unifac: caches.unifac,
    scratch: new Map(),
  };
  return { ctx, issues };
}

// ---- units at the edge ----

/**
 * A document volume (L or vol) → m³. 1 vol = 1 L per kg of the reference input:
 * V = x/1000 (L) or x · m_ref/1000 (vol).
 * Source: common practice (the "volumes" of process chemistry, L per kg of input).
 * Validity: 0 ≤ x ≤ 10⁶ L or vol.
 * @param ctx  evaluation context (route components resolved against the library)
 * @param v    the volume with its unit (L or vol)
 * @returns volume [m³]
 */
export function volumeToM3(ctx: EvalContext, v: Volume): number {
  const x = ctx.num(v.value, 0, 1e6);
  return v.unit === 'L' ? x / 1000 : (x * ctx.referenceKg) / 1000;
}
/**
 * Celsius to kelvin: T = t + 273.15.
 * Source: the definition of the Celsius scale (SI Brochure, 9th ed., 2019).
 * Validity: any temperature.
 * @param c temperature [°C]
 * @returns temperature [K]
 */
export function cToK(c: number): number {
  return c + 273.15;
}

/**
 * Kelvin to Celsius: t = T − 273.15.
 * Source: the definition of the Celsius scale (SI Brochure, 9th ed., 2019).
 * Validity: any temperature.
 * @param k temperature [K]
 * @returns temperature [°C]
 */
export function kToC(k: number): number {
  return k - 273.15;
}

// ---- streams ----

/**
 * A stream with zero mass of every component.
 * Source: this project's own bookkeeping (no external source).
 * Validity: any route.
 * @param ctx  evaluation context (route components resolved against the library)
 * @param phase  the stream's phase
 * @param T_K    temperature [K]
 * @returns the empty stream (volume 0 m³)
 */
export function emptyStream(ctx: EvalContext, phase: PortPhase, T_K: number): Stream {
  // Indexed by component id: no prototype, so no id can read a built-in.
  const kg = idRecord<number>();
  const solidKg = idRecord<number>();
  for (const id of ctx.ids) {
    kg[id] = 0;
    solidKg[id] = 0;
  }
  return { phase, temperatureK: T_K, kg, solidKg, volumeM3: 0 };
}

/**
 * Volume by ideal mixing, V = Σ m_i v_i(T) [m³].
 * Source: ideal mixing of component volumes (common practice; excess volumes neglected).
 * Validity: excess volumes are neglected (a few % for alcohol–water,
 * acetonitrile–water); specific volumes as in buildContext.
 * @param ctx  evaluation context (route components resolved against the library)
 * @param kg   mass of each component [kg]
 * @param T_K  temperature [K]
 * @returns volume [m³]
 */
export function streamVolume(ctx: EvalContext, kg: Record<string, number>, T_K: number): number {
  let v = 0;
  for (const id of ctx.ids) {
    const m = kg[id];
    if (m > 0) v += m * ctx.comps.get(id)!.specificVolume(T_K);
  }
  return v;
}

/**
 * Set a stream's volume from its masses (streamVolume at its temperature).
 * Source: streamVolume (ideal mixing; common practice).
 * Validity: as streamVolume.
 * @param ctx  evaluation context (route components resolved against the library)
 * @param s  the stream (volumeM3 [m³] modified)
 * @returns the same stream
 */
export function finishStream(ctx: EvalContext, s: Stream): Stream {
  s.volumeM3 = streamVolume(ctx, s.kg, s.temperatureK);
  return s;
}

/**
 * Copy of a stream (own mass records).
 * Source: this project's own bookkeeping (no external source).
 * Validity: any stream.
 * @param s  the stream
 * @returns a copy that shares nothing with s
 */
export function cloneStream(s: Stream): Stream {
  return {
    phase: s.phase,
    temperatureK: s.temperatureK,
    kg: Object.assign(idRecord<number>(), s.kg),
    solidKg: Object.assign(idRecord<number>(), s.solidKg),
    volumeM3: s.volumeM3,
  };
}

/**
 * Total mass, Σ m_i.
 * Source: this project's own bookkeeping (no external source).
 * Validity: any record of masses.
 * @param kg  mass of each component [kg]
 * @returns total mass [kg]
 */
export function totalKg(kg: Record<string, number>): number {
  let t = 0;
  for (const k in kg) t += kg[k];
  return t;
}

/**
 * Dissolved (liquid) mass of one component: m − m_solid.
 * Source: this project's own bookkeeping (no external source).
 * Validity: any stream.
 * @param s   the stream
 * @param id  component id
 * @returns liquid mass of the component [kg]
 */
export function liquidKg(s: Stream, id: string): number {
  return s.kg[id] - s.solidKg[id];
}

/**
 * Liquid part of a stream (solids removed): m_i − m_solid,i per component.
 * Source: this project's own bookkeeping (no external source).
 * Validity: any stream.
 * @param s  the stream
 * @returns liquid mass of each component [kg]
 */
export function liquidPart(s: Stream): Record<string, number> {
  const out = idRecord<number>();
  for (const id in s.kg) out[id] = s.kg[id] - s.solidKg[id];
  return out;
}

/**
 * kg of a liquid charge of `volumeM3` of a solvent at T: m = V / v(T).
 * Source: the component's specific volume (solvent library density; see solventDensityGmL).
 * Validity: as solventDensityGmL (liquid range).
 * @param ctx  evaluation context (route components resolved against the library)
 * @param id        the solvent's component id
 * @param volumeM3  volume charged [m³]
 * @param T_K       temperature [K]
 * @returns mass [kg]
 */
export function solventKgFromVolume(
  ctx: EvalContext,
  id: string,
  volumeM3: number,
  T_K: number,
): number {
  const c = ctx.comps.get(id)!;
  return volumeM3 / c.specificVolume(T_K);
}

/**
 * kg of water and solute in `volumeM3` of an aqueous medium at `wtPct`:
 * the medium's density from the ideal mixture of water and the solute's
 * apparent specific volume:
 *   m = V / (w v_solute + (1 − w) v_water),  m_water = (1 − w) m,  m_solute = w m.
 * Source: ideal mixing at the apparent specific volume (aqueousApparentSpecificVolume;
 * density points of the aqueous-media library).
 * Validity: 0 ≤ w up to the solute's saturation; exact at the tabulated
 * density point, approximate elsewhere.
 * @param ctx  evaluation context (route components resolved against the library)
 * @param soluteId  the aqueous solute's component id
 * @param wtPct     solute concentration [wt %]
 * @param volumeM3  volume of the medium [m³]
 * @param T_K       temperature [K]
 * @returns water and solute masses [kg]
 */
export function aqueousMediumKg(
  ctx: EvalContext,
  soluteId: string,
  wtPct: number,
  volumeM3: number,
  T_K: number,
): { waterKg: number; soluteKg: number } {
  const w = wtPct / 100;
  const vs = ctx.comps.get(soluteId)!.specificVolume(T_K);
  const vw = ctx.comps.get(ctx.waterId!)!.specificVolume(T_K);
  const specific = w * vs + (1 - w) * vw;
  const mass = volumeM3 / specific;
  return { waterKg: mass * (1 - w), soluteKg: mass * w };
}

// ---- warnings and cautions ----

/**
 * Add a warning unless the same code and message are already in the list.
 * Source: this project's own bookkeeping (no external source).
 * Validity: any warning.
 * @param list      the warnings (modified)
 * @param severity  hazard, warning, advisory or info
 * @param code      stable warning code
 * @param message   the message in the chemist's words
 */
export function warn(
  list: EngineWarning[],
  severity: EngineWarning['severity'],
  code: string,
  message: string,
) {
  if (!list.some((w) => w.code === code && w.message === message))
    list.push({ severity, code, message });
}

/**
 * Record a method used (what, method, source) unless already recorded.
 * Source: this project's own bookkeeping (no external source).
 * Validity: any method.
 * @param list    the methods (modified)
 * @param what    the quantity computed
 * @param m       the method
 * @param source  its source
 */
export function method(list: MethodUsed[], what: string, m: string, source: string) {
  if (!list.some((x) => x.what === what && x.method === m)) list.push({ what, method: m, source });
}

/** Flash-point margin [K]: a liquid handled within this margin of its flash point, or above it, gets a caution (common practice). */
export const FLASH_POINT_MARGIN_K = 10;

/**
 * Cautions that hold for any vessel contents: flammable liquids at or above
 * (flash point − margin), ICH Q3C class 1 solvents, and static-accumulating
 * low-conductivity solvents where liquid is transferred or filtered.
 * Rules: flammable when a solvent above 1 wt % of the contents is at
 * T ≥ flash point − FLASH_POINT_MARGIN_K; flash point not confirmed → treat as
 * flammable; static accumulator above 10 wt % in a transfer.
 *
 * Source: flash points, ICH Q3C classes and the low-conductivity flag from
 * the solvent library with their provenance (data/hazards.ts, data/ich-q3c.ts;
 * IEC 60079-20-1, ICH Q3C(R9) — docs/data-sources.md); the 10 K margin and the
 * 1 % and 10 % shares are common practice.
 * Validity: cautions only — they defer to local codes, the site's
 * process-safety review and licensed practice; mixture flash points are not
 * computed (any flammable component above 1 wt % counts).
 * @param ctx  evaluation context (route components resolved against the library)
 * @param kg        mass of each component in the vessel [kg]
 * @param T_K       handling temperature [K]
 * @param warnings  receives the cautions
 * @param opts      transfer: liquid is transferred or filtered (static caution)
 */
export function commonCautions(
  ctx: EvalContext,
  kg: Record<string, number>,
  T_K: number,
  warnings: EngineWarning[],
  opts: { transfer?: boolean } = {},
) {
  const liquidTotal = totalKg(kg);
  const flam: string[] = [];
  const flashUnknown: string[] = [];
  const lowCond: string[] = [];
  for (const id of ctx.ids) {
    const m = kg[id];
    if (!(m > 0)) continue;
    const c = ctx.comps.get(id)!;
    if (!c.solvent) continue;
    const s = c.solvent;
    const fp = s.flashPointC.value;
    if (fp !== null && m / liquidTotal > 0.01 && T_K - 273.15 >= fp - FLASH_POINT_MARGIN_K)
      flam.push(`${s.name} (flash point ${fp} °C)`);
    if (fp === null && s.flashPointC.source.status === 'not-confirmed' && m / liquidTotal > 0.01)
      flashUnknown.push(s.name);
    if (s.ich.value.class === 1) {
      warn(
        warnings,
        'hazard',
        'ich-class-1',
        `${s.name} is an ICH Q3C class 1 solvent (to be avoided); its use needs justification.`,
      );
    }
    if (opts.transfer && s.lowConductivity.value && m / liquidTotal > 0.1) lowCond.push(s.name);
  }
  if (flam.length) {
    warn(
      warnings,
      'advisory',
      'flammable-above-flash-point',
      `Handled above or within ${FLASH_POINT_MARGIN_K} K of the flash point of ${flam.join(', ')}: flammable atmosphere; inerting and ignition-source control apply.`,
    );
  }
  if (flashUnknown.length) {
    warn(
      warnings,
      'advisory',
      'flash-point-not-confirmed',
      `No flash point of ${flashUnknown.join(', ')} is confirmed in a standard's table (IEC 60079-20-1, NFPA 497): treat it as flammable at any process temperature; inerting and ignition-source control apply.`,
    );
  }
  if (lowCond.length) {
    warn(
      warnings,
      'advisory',
      'static-accumulation',
      `${lowCond.join(', ')} has low electrical conductivity: static charge accumulates in transfers and filtrations; bond and earth equipment, limit flow velocity.`,
    );
  }
}
