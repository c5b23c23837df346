/**
 * Shapes of the curated component data. Every number that the engine uses
 * carries its provenance: a `Sourced<T>` value says where it was read, or that
 * it is from memory and unverified.
 */

/** Where a value comes from. `ref` names the published source (book, table,
 * data file, page); `status` says whether the number was read there. */
export interface Source {
  ref: string;
  /**
   * - confirmed: read in the named source (the primary document, a standard's
   *   own table, or a handbook table through an open data file);
   * - secondary: read in a published reproduction of the primary document (a
   *   journal article or handbook that reprints it), not in the primary itself;
   * - unverified-memory: recalled, not read;
   * - estimated: computed here from other values or assigned by rule;
   * - common-practice: a fact of the trade, stated as such;
   * - not-confirmed: no value is held because none could be read in a primary
   *   or published source; the engine says so wherever the field matters.
   */
  status:
    | 'confirmed'
    | 'secondary'
    | 'unverified-memory'
    | 'estimated'
    | 'common-practice'
    | 'not-confirmed';
  note?: string;
}

export interface Sourced<T> {
  value: T;
  source: Source;
}

/**
 * Antoine constants. Two forms are carried exactly as published so that no
 * conversion error can creep in:
 *  - 'log10-bar-degC':  log10(P/bar) = A − B / (t/°C + C)   (Poling et al. 5th ed., App. A)
 *  - 'log10-bar-K':     log10(P/bar) = A − B / (T/K + C)    (NIST Chemistry WebBook)
 * Validity range in kelvin.
 */
export interface AntoineSet {
  form: 'log10-bar-degC' | 'log10-bar-K';
  A: number;
  B: number;
  C: number;
  TminK: number;
  TmaxK: number;
  source: Source;
}

/**
 * A wide-range vapour-pressure correlation, valid from the triple (or
 * melting) point to the critical point, with its coefficients exactly as
 * published:
 *  - 'dippr101': ln(P/Pa) = C1 + C2/T + C3 ln T + C4 T^C5, T in K (DIPPR
 *    equation 101; Perry's Chemical Engineers' Handbook, 8th ed., Table 2-8)
 *  - 'wagner-2.5-5': ln(P/Pc) = (Tc/T)(A τ + B τ^1.5 + C τ^2.5 + D τ^5),
 *    τ = 1 − T/Tc (the Wagner form of the VDI Heat Atlas, PPDS set)
 */
export type VapourPressureCorrelation =
  | {
      kind: 'dippr101';
      C1: number;
      C2: number;
      C3: number;
      C4: number;
      C5: number;
      /**
       * Anchor at the CRC normal boiling point where the row misses it: ln P gains
       * dLnP·(u − u1)(u − uc)/((ub − u1)(ub − uc)), u = 1/T, zero at T1K and at TmaxK (Tc),
       * dLnP at TbK [K] (thermo/antoine.ts correlationLnPressure).
       */
      anchor?: { TbK: number; T1K: number; dLnP: number };
      /** Lowest temperature of the fit [K]. */
      TminK: number;
      /** Highest temperature of the fit (the critical temperature) [K]. */
      TmaxK: number;
    }
  | {
      kind: 'wagner-2.5-5';
      /** Critical temperature [K]. */
      TcK: number;
      /** Critical pressure [Pa]. */
      PcPa: number;
      A: number;
      B: number;
      C: number;
      D: number;
      /** Lowest temperature of the fit (melting point) [K]. */
      TminK: number;
      /** Highest temperature of the fit (= Tc) [K]. */
      TmaxK: number;
    };

/** UNIFAC subgroup counts, keyed by the subgroup number of the original
 * UNIFAC table (Hansen et al. 1991), e.g. ethanol = { 1: 1, 2: 1, 14: 1 }. */
export type UnifacGroups = Record<number, number>;

/** Solvent-selection guide category (CHEM21, Prat et al., Green Chem. 2016, 18, 288). */
export type GuideCategory = 'recommended' | 'problematic' | 'hazardous' | 'highly-hazardous';

export interface SolventRecord {
  id: string; // stable slug, e.g. 'ethyl-acetate'
  name: string;
  synonyms?: string[];
  smiles: string;
  cas: string;
  /**
   * Acid and base sites of a solvent that ionises in water (acetic acid,
   * pyridine): pKa [-] at 25 °C; for a base the pKa of its conjugate acid.
   * Washes put these solvents into the charge balance of the aqueous phase.
   */
  pKa?: Sourced<Array<{ value: number; type: 'acid' | 'base' }>>;
  molarMassGmol: Sourced<number>;
  /** Density in g/mL at `temperatureC`; optional linear temperature
   * coefficient in g/mL per K where known. */
  density: Sourced<{ gPerMl: number; temperatureC: number; dPerK?: number }>;
  boilingPointC: Sourced<number>;
  meltingPointC: Sourced<number>;
  /**
   * Closed-cup flash point [°C]; null where the liquid has none under the
   * standard test, or where no value was confirmed (source status
   * 'not-confirmed': the engine then treats the liquid as flammable at any
   * temperature). From shared/engine/data/hazards.ts.
   */
  flashPointC: Sourced<number | null>;
  /** Wide-range correlation (triple point to critical point) where one is published; preferred over Antoine. */
  vapourPressure?: Sourced<VapourPressureCorrelation>;
  antoine: AntoineSet[]; // in order of preference; may be empty
  /** Enthalpy of vaporisation at the normal boiling point, kJ/mol, for
   * Clausius–Clapeyron outside the Antoine range. */
  enthalpyVapKJmol?: Sourced<number>;
  hansen: Sourced<{ d: number; p: number; h: number }>;
  molarVolumeCm3mol?: Sourced<number>;
  unifac: Sourced<UnifacGroups>;
  /** Mutual solubility with water near 20–25 °C (wt %), where partly miscible. */
  waterMutualSolubility?: Sourced<{
    solventInWaterWtPct: number;
    waterInSolventWtPct: number;
    temperatureC: number;
  }>;
  /**
   * Further measured mutual solubilities with water at other temperatures
   * (wt %, °C; either phase or both), for the temperature dependence of the
   * liquid–liquid model (thermo/nrtl.ts, regressReplacingWaterPair).
   */
  waterMutualSolubilityCurve?: Sourced<
    Array<{ temperatureC: number; solventInWaterWtPct?: number; waterInSolventWtPct?: number }>
  >;
  /** 'miscible' | 'partial' | 'immiscible' with water at 25 °C. */
  waterMiscibility: 'miscible' | 'partial';
  viscosityMPas25C: Sourced<number>;
  /**
   * ICH Q3C class, Option 1 concentration limit [ppm] and PDE [mg/day], with
   * the guideline table the entry belongs to (Table 4: no adequate
   * toxicological data, no PDE). Class and limit are null where the solvent
   * is not a residual solvent in Q3C's sense, or where the entry could not be
   * confirmed (source status 'not-confirmed'). From shared/engine/data/ich-q3c.ts.
   */
  ich: Sourced<{
    class: 1 | 2 | 3 | null;
    limitPpm: number | null;
    pdeMgDay?: number | null;
    table?: 'Table 1' | 'Table 2' | 'Table 3' | 'Table 4';
  }>;
  /** On a published peroxide-former list (shared/engine/data/hazards.ts). */
  peroxideFormer: Sourced<boolean>;
  /** Low electrical conductivity: a static accumulator (shared/engine/data/hazards.ts). */
  lowConductivity: Sourced<boolean>;
  /** Dielectric constant, used by some estimates; optional. */
  dielectricConstant?: Sourced<number>;
}

/** The fields of a solvent record kept apart from the physical data, in the
 * regulatory and hazard modules (ich-q3c.ts, hazards.ts), keyed by solvent id. */
export type SolventSafetyFields = Pick<
  SolventRecord,
  'ich' | 'flashPointC' | 'peroxideFormer' | 'lowConductivity'
>;

/** A solvent record as the family files hold it: everything but the safety fields. */
export type SolventBaseRecord = Omit<SolventRecord, keyof SolventSafetyFields>;

/** An aqueous medium made from water and a solute at a given wt %. */
export interface AqueousSoluteRecord {
  id: string; // 'nacl', 'nahco3', ...
  name: string;
  formula: string;
  smiles: string;
  cas: string;
  molarMassGmol: Sourced<number>;
  /** What the solute does to pH: a strong acid/base, a buffer with pKa values, or neutral salt. */
  acidBase:
    | { kind: 'neutral' }
    | { kind: 'strong-acid'; protons: number }
    | { kind: 'strong-base'; hydroxides: number }
    | { kind: 'weak-acid'; pKa: Sourced<number[]> }
    | { kind: 'weak-base'; pKa: Sourced<number[]> } // pKa of the conjugate acid
    | { kind: 'amphoteric-salt'; pKa: Sourced<number[]> };
  /** Density of solutions: points (wt %, g/mL at 20 °C) for interpolation. */
  densityPoints: Sourced<Array<[number, number]>>;
  /** Setschenow salting-out coefficient, L/mol, for a typical neutral organic
   * solute, where published. */
  setschenowKs?: Sourced<number>;
  maxWtPct: number; // saturation or usual maximum
}
