/**
 * Bibliography of the curated component data. A `Source.ref` in the solvent
 * and aqueous-media tables is one of these ids; `citation` is the full
 * reference a chemist can look up. Where a published table was read through an
 * open data file, `via` names the repository and path that carries it — the
 * number was read there, and the original is cited beside it.
 *
 * Entries whose id ends in `-memory` are not sources that were read: they mark
 * values recalled by the data author from the usual handbooks, to be verified.
 */

export interface SourceEntry {
  /** Full citation of the published original. */
  citation: string;
  /** Open data file (repository and path) or public page through which it was read. */
  via?: string;
  url?: string;
}

export const SOURCES = {
  // --- Handbooks read through open data files ---------------------------------
  'crc-organic-constants': {
    citation:
      'W. M. Haynes (ed.), CRC Handbook of Chemistry and Physics, "Physical Constants of Organic Compounds" (melting point, boiling point, density; the density column carries the temperature as a superscript)',
    via: 'CalebBell/chemicals: chemicals/Misc/Physical Constants of Organic Compounds.csv (T in K, density in kg/m³ with the CRC temperature digits appended)',
  },
  'crc-inorganic-constants': {
    citation: 'CRC Handbook of Chemistry and Physics, "Physical Constants of Inorganic Compounds"',
    via: 'CalebBell/chemicals: chemicals/Misc/Physical Constants of Inorganic Compounds.csv (as read for reference-data.md §H)',
  },
  'perry-8e-2-150-hvap': {
    citation:
      'D. W. Green, R. H. Perry (eds.), Perry\'s Chemical Engineers\' Handbook, 8th ed., McGraw-Hill, 2007, Table 2-150 "Heats of Vaporization of Inorganic and Organic Liquids" (DIPPR equation 106: ΔH = C1 (1 − Tr)^(C2 + C3 Tr + C4 Tr²), Tr = T/Tc)',
    via: 'CalebBell/chemicals: chemicals/Phase Change/Table 2-150 Heats of Vaporization of Inorganic and Organic Liquids.tsv (Tc in K, C1 in J/mol, C2–C4, Tmin, Tmax in K)',
  },
  'vn-dutt-prasad-viscosity': {
    citation:
      'D. S. Viswanath, G. Natarajan, Data Book on the Viscosity of Liquids, Taylor & Francis, New York, 1989 (as cited in the chemicals library’s viscosity module) — Dutt–Prasad three-constant equation log10(μ/mPa·s) = A + B/(C − T/K), with its fitted range',
    via: 'CalebBell/chemicals: chemicals/Viscosity/Dutt Prasad 3 term.tsv (columns A, B, C, Tmin, Tmax in K; μ in mPa·s)',
  },
  'vn-3term-viscosity': {
    citation:
      'D. S. Viswanath, G. Natarajan, Data Book on the Viscosity of Liquids, Taylor & Francis, New York, 1989 (as cited in the chemicals library’s viscosity module) — three-term equation log10(μ/mPa·s) = A + B/(C − T/K), with its fitted range',
    via: 'CalebBell/chemicals: chemicals/Viscosity/Viswanath Natarajan Dynamic 3 term.tsv (columns A, B, C, Tmin, Tmax in K; μ in mPa·s)',
  },
  'perry-8e-2-313-viscosity': {
    citation:
      'D. W. Green, R. H. Perry (eds.), Perry\'s Chemical Engineers\' Handbook, 8th ed., McGraw-Hill, 2007, Table 2-313 "Viscosity of Inorganic and Organic Liquids" (DIPPR equation 101: μ/Pa·s = exp(C1 + C2/T + C3 ln T + C4 T^C5), T/K)',
    via: 'CalebBell/chemicals: chemicals/Viscosity/Table 2-313 Viscosity of Inorganic and Organic Liquids.tsv (columns C1–C5, Tmin, Tmax in K)',
  },
  'vdi-ppds9-viscosity': {
    citation:
      "VDI Heat Atlas, 2nd ed., Springer, Berlin, 2010, PPDS equation 9 for the dynamic viscosity of saturated liquids: μ = E exp[A ((C − T)/(T − D))^(1/3) + B ((C − T)/(T − D))^(4/3)], μ in Pa·s, T in K (the edition as cited in the chemicals library's PPDS9 docstring, which gives this form and reproduces its own example: acetic acid, 400 K, 3.509e-4 Pa·s)",
    via: 'CalebBell/chemicals: chemicals/Viscosity/VDI PPDS Dynamic viscosity of saturated liquids polynomials.tsv (columns A–E)',
  },
  'crc-enthalpy-vaporization': {
    citation:
      'CRC Handbook of Chemistry and Physics, "Enthalpy of Vaporization" (ΔvapH at the normal boiling point)',
    via: 'CalebBell/chemicals: chemicals/Phase Change/CRC Handbook Heat of Vaporization.tsv (column HvapTb, J/mol)',
  },
  'perry-8e-2-8-vapour-pressure': {
    citation:
      'D. W. Green, R. H. Perry (eds.), Perry\'s Chemical Engineers\' Handbook, 8th ed., McGraw-Hill, 2007, Table 2-8 "Vapor Pressure of Inorganic and Organic Liquids" (DIPPR equation 101: ln(P/Pa) = C1 + C2/T + C3 ln T + C4 T^C5, T/K, from Tmin, usually the triple point, to Tmax, the critical temperature)',
    via: 'CalebBell/chemicals: chemicals/Vapor Pressure/Table 2-8 Vapor Pressure of Inorganic and Organic Liquids.tsv (columns C1–C5, Tmin, Tmax in K)',
  },
  'vdi-ppds-wagner': {
    citation:
      'VDI Heat Atlas (VDI-Gesellschaft, ed.), 2nd ed., Springer, Berlin/New York, 2010 (edition and publisher as cited in the chemicals library’s PPDS docstrings; the part, D3.1, is recalled), PPDS vapour-pressure equation in the Wagner form ln(P/Pc) = (Tc/T)(A τ + B τ^1.5 + C τ^2.5 + D τ^5), τ = 1 − T/Tc',
    via: 'CalebBell/chemicals: chemicals/Vapor Pressure/VDI PPDS Boiling temperatures at different pressures.tsv (columns Tm, Tc in K, Pc in Pa, A–D); the form was checked here by reproducing the CRC normal boiling points of pyridine and isobutanol to 0.1 K',
  },
  'kistiakowsky-trouton': {
    citation:
      "Kistiakowsky's rule for the entropy of vaporisation at the normal boiling point, ΔSvb = 36.1 + R ln(Tb/K) J/(mol·K) (W. Kistiakowsky, Z. Phys. Chem. 1923, 107, 65; as given in Poling, Prausnitz & O'Connell, 5th ed., chapter 7 — citation recalled); typical error ±5 % for non-associating liquids",
  },
  'poling-5e-antoine': {
    citation:
      "B. E. Poling, J. M. Prausnitz, J. P. O'Connell, The Properties of Gases and Liquids, 5th ed., McGraw-Hill, New York, 2001, Appendix A (Antoine constants, log10 P/bar, t/°C)",
    via: 'CalebBell/chemicals: chemicals/Vapor Pressure/Antoine Collection Poling.tsv (stored as log10 P/Pa, T/K)',
  },
  'nist-webbook-antoine': {
    citation:
      'NIST Chemistry WebBook, NIST Standard Reference Database 69 (P. J. Linstrom, W. G. Mallard, eds.), phase-change data: Antoine equation parameters (log10 P/bar, T/K)',
    via: 'CalebBell/chemicals: chemicals/Misc/webbook_constants.tsv (stored as ln P/Pa, T/K)',
    url: 'https://webbook.nist.gov/chemistry/',
  },
  'nist-webbook-constants': {
    citation:
      'NIST Chemistry WebBook, NIST Standard Reference Database 69, phase-change data (melting point)',
    via: 'CalebBell/chemicals: chemicals/Misc/webbook_constants.tsv (column Tm, K)',
  },
  'landolt-iv20-antoine': {
    citation:
      'Landolt-Börnstein, New Series IV/20, Vapor Pressure of Chemicals, Springer: K. R. Hall (ed.), Vapor Pressure and Antoine Constants for Hydrocarbons, and S, Se, Te, and Halogen Containing Organic Compounds (1999); J. Dykyj, K. R. Hall, … for Oxygen Containing Organic Compounds (2000); K. R. Hall, … for Nitrogen Containing Organic Compounds (titles, editors and years as cited in the chemicals library’s vapour-pressure module; subvolume letters and full author lists recalled)',
    via: 'CalebBell/chemicals: chemicals/Vapor Pressure/Landolt_antoine_V20.tsv (stored as ln P/Pa, T/K)',
  },
  'iec-60079-20-1': {
    citation:
      'IEC 60079-20-1:2010, Explosive atmospheres – Part 20-1: Material characteristics for gas and vapour classification – Test methods and data (closed-cup flash points)',
    via: 'CalebBell/chemicals: chemicals/Safety/IS IEC 60079-20-1 2010.tsv (flash point in K)',
  },
  'nfpa-497': {
    citation:
      'NFPA 497 (2008), Recommended Practice for the Classification of Flammable Liquids, Gases, or Vapors and of Hazardous (Classified) Locations',
    via: 'CalebBell/chemicals: chemicals/Safety/NFPA 497 2008.tsv (flash point in K)',
  },
  'cas-common-chemistry': {
    citation:
      'CAS Common Chemistry (CAS, a division of the American Chemical Society; open community resource, CC BY-NC 4.0), experimental properties: melting point and boiling point',
    via: 'CalebBell/chemicals: chemicals/Misc/common_chemistry_data.tsv (columns Tm, Tb in K; rows 872-50-4 and 5614-37-9 read in December 2026)',
  },
  'opennotebook-melting-points': {
    citation: 'Open Notebook Science melting point data set (J.-C. Bradley et al.)',
    via: 'CalebBell/chemicals: chemicals/Phase Change/OpenNotebook Melting Points.tsv (as read for reference-data.md §H)',
  },
  'hansen-hspipy': {
    citation:
      "Hansen solubility parameters after C. M. Hansen, Hansen Solubility Parameters: A User's Handbook, 2nd ed., CRC Press, 2007 (attribution recalled: neither the HSPiPy repository nor the chemicals library, which cites only the repository, says where the table comes from), in the HSPiPy data set (A. Gutiérrez, github.com/Gnpd/HSPiPy)",
    via: 'CalebBell/chemicals: chemicals/Misc/hspipy_hansen_solubility_parameters.tsv (Pa^0.5)',
  },
  'hansen-schrier': {
    citation:
      "J. Schrier, Hansen solubility parameters, Wolfram Data Repository, 2020 (derived from Hansen's tables)",
    via: 'CalebBell/chemicals: chemicals/Misc/schrier_hansen_solubility_parameters.tsv (Pa^0.5)',
  },
  'hansen-diaz-2022': {
    citation:
      'M. Díaz de los Ríos, E. Murcia Belmonte, SN Applied Sciences 2022, 4, 185 (data set derived from the published Hansen parameter tables)',
    via: 'CalebBell/chemicals: chemicals/Misc/ruben_manuel_hansen_solubility_parameters.tsv (Pa^0.5)',
  },
  'unifac-groups': {
    citation:
      'Original UNIFAC subgroup list, H. K. Hansen, P. Rasmussen, Aa. Fredenslund, M. Schiller, J. Gmehling, Ind. Eng. Chem. Res. 1991, 30, 2352 (DDBST numbering, as listed in reference-data.md §A.1 and shared/engine/data/unifac.ts)',
  },

  // --- Regulatory and guide documents -----------------------------------------
  'ich-q3c-r9': {
    citation:
      'ICH Harmonised Guideline Q3C(R9), Impurities: Guideline for Residual Solvents, Step 4, 24 January 2024, Tables 1–3 (Option 1 concentration limits; R9 changed only §3.4, not the limits)',
  },
  'jcr-2022-table1': {
    citation:
      'J. Cannabis Res. 2022, article s42238-022-00130-3, Table 1 "Residual solvent limits imposed by ICH and USP (ICH 2011; USP 2009)" — secondary source for ICH Q3C classes and limits, unchanged through Q3C(R9) for these solvents',
    url: 'https://jcannabisresearch.biomedcentral.com/articles/10.1186/s42238-022-00130-3/tables/1',
  },
  'wypych-2001-q3c-tables': {
    citation:
      'G. Wypych (ed.), Handbook of Solvents, ChemTec Publishing, Toronto–New York, 2001 (ISBN 1-895198-24-0; publisher and year read on the book’s title page), §16.2 "Residual solvents in pharmaceutical substances", Table 16.2.5 "Class 3 solvents which should be limited by GMP or other quality-based requirements" and Table 16.2.6 "Solvents for which no adequate toxicological data was found" — a reproduction of ICH Q3C (1997) Tables 3 and 4. Later revisions moved tetrahydrofuran (R1), cumene (R5) and methyl isobutyl ketone (R6) out of Class 3',
    url: 'https://www.yumpu.com/en/document/view/10607080/handbook-of-solvents-george-wypych-chemtech-ventech/1172',
  },
  'q3c-r8-draft-report': {
    citation:
      'ICH Q3C(R8) Step 2 draft, "PDE for 2-methyltetrahydrofuran, cyclopentyl methyl ether and tertiary-butyl alcohol": 2-MeTHF PDE 50 mg/day (Class 3), CPME PDE 15 mg/day (Class 2), tertiary-butyl alcohol PDE 35 mg/day (Class 2), as reported by GMP-Verlag news (2020; a trade publisher’s report, not the guideline). Its report of the Step 4 guideline (22 April 2021) states that these PDEs were adopted unchanged (2-MeTHF Class 3; CPME and tertiary-butyl alcohol Class 2); the numbers were not read in the guideline’s own text',
    url: 'https://www.gmp-verlag.de/content/en/gmp-news/news-about-gmp-cgmp/d/ich-publishes-ich-q3c-r8-with-three-new-pdes-for-comments',
  },
  'kelly-1996-peroxide-tables': {
    citation:
      'R. J. Kelly, "Review of safety guidelines for peroxidizable organic chemicals", Chem. Health Saf. 1996, 3(5), 28–36, Tables A–D (A: peroxides on storage without concentration; B: hazard on concentration; C: peroxide-initiated polymerisation; D: other peroxide formers) — read as reproduced in Cornell University EHS, "Appendix J – Peroxide Forming Chemicals" (Tables A–C complete, Table D in part); the attribution of those tables to Kelly 1996 is recalled',
    url: 'https://ehs.cornell.edu/book/export/html/1481',
  },
  'nfpa-77-2000-table-b2': {
    citation:
      'NFPA 77, Recommended Practice on Static Electricity, 2000 ed., Annex B, Table B.2 "Static Electric Characteristics of Liquids" (conductivity in pS/m), sheet 2 of 5 read (guaiacol to phenetole); in several rows of the copy read the mantissa is lost and only the power of ten remains',
    url: 'http://fayllar.org/static-electricity-2000-edition.html?page=95',
  },
  'static-accumulator-practice': {
    citation:
      'Common practice of electrostatic-hazard guidance (IEC TS 60079-32-1, NFPA 77): saturated and aromatic hydrocarbons and most ethers are low-conductivity static accumulators (below about 50 pS/m; threshold recalled); alcohols, ketones, nitriles, amides, sulfoxides, carboxylic acids and water are conductive. Applied by solvent family where no measured conductivity was read',
  },
  'flammability-practice': {
    citation:
      'Common practice: water, dichloromethane and chloroform show no flash point under the standard closed-cup test (dichloromethane vapour is nevertheless flammable in air at high concentration)',
  },
  'peroxide-practice': {
    citation:
      'Common practice: ethers with a hydrogen on the carbon next to the ether oxygen (as THF, Kelly Table B) form peroxides on storage; such solvents not named in the tables read are flagged by analogy and usually supplied stabilised',
  },
  'merck-index-mtbe': {
    citation:
      'The Merck Index, monograph "Methyl tert-Butyl Ether" (solubility 4.8 g/100 g water; dissolves 1.5 g water/100 g; d20/4 0.7404), read as reproduced on a public page that is not a publication (edition not identified)',
  },

  'chem21-guide-2016-table': {
    citation:
      'D. Prat et al., "CHEM21 selection guide of classical- and less classical-solvents", Green Chem. 2016, 18, 288–296 (open access), the table of classical solvents with the default ranking and the ranking after discussion',
    via: 'AI4Green/AI4Green: Webapp/sources/services/solvent_PCA/data/CHEM21_full.csv (commit 8cc45e3a55120268374c312280fef2b2b3e09784), columns "Solvent", "CAS", "Ranking Default", "Ranking Discussion"',
    url: 'https://pubs.rsc.org/en/content/articlehtml/2016/gc/c5gc01008j',
  },

  // --- Solubility and property pages read for reference-data.md ---------------
  'iupac-nist-srd106-butanol': {
    citation:
      'IUPAC-NIST Solubility Database, NIST SRD 106, data sheet "1-Butanol with Toluene and Water" (T. M. Letcher, P. M. Siswana, Fluid Phase Equilib. 1992, 74, 203), binary end points at 298.2 K',
    url: 'https://srdata.nist.gov/solubility/sol_detail.aspx?goBack=Y&sysID=69_233',
  },
  'iupac-nist-srd106-recommended': {
    citation:
      'IUPAC-NIST Solubility Database, NIST SRD 106: the recommended mutual solubilities of the binary hexane–water (293 K) and 1-octanol–water (298 K) systems, as quoted from the Solubility Data Series evaluations of those binaries in the critical evaluation of the ternary system 1-octanol–hexane–water (A. Skrzecz, 1996; IUPAC-NIST Solubility Data Series 69)',
    url: 'https://srdata.nist.gov/solubility/sol_detail.aspx?goBack=Y&sysID=69_268',
  },
  'iupac-nist-srd106-isobutanol-water': {
    citation:
      'IUPAC-NIST Solubility Database, NIST SRD 106: the recommended mutual solubility of the binary 2-methyl-1-propanol–water system at 298 K (from the Solubility Data Series evaluation of that binary), as quoted in the critical evaluation of the ternary system 2-methyl-1-propanol–benzene–water (A. Skrzecz, 1997; IUPAC-NIST Solubility Data Series 69)',
    url: 'https://srdata.nist.gov/solubility/sol_detail.aspx?sysID=69_198',
  },
  'iupac-nist-srd106-heptane-water': {
    citation:
      'IUPAC-NIST Solubility Database, NIST SRD 106: the recommended mutual solubilities of the binary heptane–water system at 298.2 K (from the Solubility Data Series evaluation of that binary), as quoted in the critical evaluation of the ternary system 1-propanol–heptane–water (A. Skrzecz, 1997; IUPAC-NIST Solubility Data Series 69)',
    url: 'https://srdata.nist.gov/solubility/sol_detail.aspx?goBack=Y&sysID=69_145',
  },
  'iupac-nist-srd106-2-butanol-water': {
    citation:
      'IUPAC-NIST Solubility Database, NIST SRD 106: the recommended mutual solubility of the binary 2-butanol–water system at 303 K (from the Solubility Data Series evaluation of that binary), as quoted in the critical evaluation of the ternary system 2-butanol–benzene–water (A. Skrzecz, 1997; IUPAC-NIST Solubility Data Series 69)',
    url: 'https://srdata.nist.gov/solubility/sol_detail.aspx?goBack=Y&sysID=69_239',
  },
  'nas-2016-appD': {
    citation:
      'National Academies of Sciences, Engineering, and Medicine, Chemical Laboratory Safety and Security: A Guide to Developing Standard Operating Procedures, 2016, Appendix D "Flammable List" (solubility in water, g/100 g; flash point) (doi:10.17226/21918)',
    url: 'https://www.nationalacademies.org/read/21918/chapter/12',
  },
  'encyclopedia-isopropyl-acetate': {
    citation:
      'Isopropyl acetate, encyclopedia infobox (solubility in water 2.9 wt %, water in solvent 1.8 wt %, 20 °C) — weak secondary source',
    url: 'https://en.wikipedia.org/wiki/Isopropyl_acetate',
  },
  'encyclopedia-2-methyltetrahydrofuran': {
    citation:
      '2-Methyltetrahydrofuran, encyclopedia infobox (mutual solubility with water vs temperature) — weak secondary source',
    url: 'https://en.m.wikipedia.org./wiki/Methyltetrahydrofuran',
  },
  'encyclopedia-mibk': {
    citation:
      'Methyl isobutyl ketone, encyclopedia infobox, stored copies (solubility in water 1.91 g/100 mL, 20 °C) — weak secondary source',
  },
  'etoac-solubility-page': {
    citation:
      'Ethyl acetate article ("dissolves up to 3 % water … solubility of 8 % in water at room temperature") — weak secondary source',
    url: 'http://www.fact-archive.com/encyclopedia/Ethyl_acetate',
  },

  'libretexts-e1-acid-dissociation': {
    citation:
      'LibreTexts Chemistry (open-access textbook library), Reference Tables, Equilibrium Constants, "E1: Acid Dissociation Constants at 25°C" (Ka and pKa by step) — a reproduced table; its own source was not read, so values read here are secondary',
    url: 'https://chem.libretexts.org/Ancillary_Materials/Reference/Reference_Tables/Equilibrium_Constants/E1%3A_Acid_Dissociation_Constants_at_25C',
  },

  // --- Derived values ----------------------------------------------------------
  'iupac-atomic-weights': {
    citation:
      'IUPAC Commission on Isotopic Abundances and Atomic Weights, conventional standard atomic weights (C 12.011, H 1.008, N 14.007, O 15.999, S 32.06, Cl 35.45, Na 22.990, K 39.098)',
  },
  'derived-quantity': {
    citation: 'Computed in this library from other tabulated values (the note says how)',
  },

  // --- Values recalled, not read (status 'unverified-memory') -----------------
  'tanaka-2001-water-density': {
    citation:
      'M. Tanaka, G. Girard, R. Davis, A. Peuto, N. Bignell, "Recommended table for the density of water between 0 °C and 40 °C based on recent experimental reports", Metrologia 2001, 38, 301–309 (doi:10.1088/0026-1394/38/4/3)',
    via: 'bjodah/chempy: chempy/properties/water_density_tanaka_2001.py (the equation and its five coefficients, with the full reference) and its test file (998.2071 kg/m³ at 20 °C within 0.0005; 997.047021671824 at 25 °C), read December 2026',
  },
  'crc-viscosity-liquids': {
    citation:
      'CRC Handbook of Chemistry and Physics, "Viscosity of Liquids" (25 °C) — values recalled, not read',
  },
  'crc-dissociation-constants': {
    citation:
      'CRC Handbook of Chemistry and Physics, "Dissociation Constants of Inorganic Acids and Bases" and "… of Organic Acids and Bases" (25 °C) — values recalled, not read',
  },
  'laliberte-2009-density': {
    citation:
      'M. Laliberté, "A Model for Calculating the Heat Capacity of Aqueous Solutions, with Updated Density and Viscosity Data", J. Chem. Eng. Data 2009, 54, 1725–1760 (doi:10.1021/je8008123): density model and per-solute coefficients c0–c4 with their fitted ranges',
    via: 'CalebBell/chemicals: chemicals/Electrolytes/Laliberte2009.tsv (coefficients c0–c4, Min T, Max T, Max w) and the model as written in chemicals/electrochem.py (Laliberte_density_w, Laliberte_density_i, Laliberte_density_mix); the documented example (1002.625 kg/m³ for 0.378 wt % NaCl at 0 °C) reproduced, read December 2026',
  },
  'crc-concentrative-properties': {
    citation:
      'CRC Handbook of Chemistry and Physics, "Concentrative Properties of Aqueous Solutions: Density, Refractive Index, Freezing Point Depression, and Viscosity" (20 °C) — values recalled, not read',
  },
  'crc-aqueous-solubility-inorganic': {
    citation:
      'CRC Handbook of Chemistry and Physics, "Aqueous Solubility of Inorganic Compounds at Various Temperatures" — values recalled, not read',
  },
  'setschenow-review-memory': {
    citation:
      'W.-H. Xie, W.-Y. Shiu, D. Mackay, "A review of the effect of salts on the solubility of organic compounds in seawater", Mar. Environ. Res. 1997, 44, 429–444 — typical magnitudes recalled, not read',
  },
  'melting-point-memory': {
    citation:
      'Melting point recalled by the data author from the usual handbooks (CRC Handbook, supplier data sheets); not read for this library — verify',
  },
  'boiling-point-memory': {
    citation:
      'Normal boiling point recalled by the data author from the usual handbooks; not read for this library — verify',
  },
  'density-memory': {
    citation:
      'Density recalled by the data author from the usual handbooks and supplier data sheets; not read for this library — verify',
  },
  'flash-point-memory': {
    citation:
      'Closed-cup flash point recalled by the data author from safety data sheets and handbooks; not read for this library — verify',
  },
  'mutual-solubility-memory': {
    citation:
      'Mutual solubility with water recalled by the data author from handbook compilations (CRC Handbook "Aqueous Solubility of Organic Compounds", IUPAC-NIST Solubility Data Series); not read for this library — verify',
  },
} as const satisfies Record<string, SourceEntry>;

export type SourceId = keyof typeof SOURCES;

/**
 * Whether a reference names an entry of the bibliography.
 *
 * Source: the bibliography (this file).
 *
 * @param ref  reference key
 * @returns true for a key of SOURCES
 *
 * Validity: any string.
 */
export function isSourceId(ref: string): ref is SourceId {
  return Object.prototype.hasOwnProperty.call(SOURCES, ref);
}
