/**
 * Demo route: isolation of an amide made by coupling a carboxylic acid with
 * an amine. ALL COMPOUNDS AND ALL THEIR NUMBERS ARE INVENTED for the demo
 * (plausible values for drug-like molecules, not measurements of any real
 * substance). The solvents and aqueous media are from the library.
 *
 * Crude in 2-MeTHF (10 vol) → 1 M HCl wash (removes the amine) → 8 % NaHCO3
 * wash (removes the acid; CO2) → 20 % brine wash → put-and-take swap to
 * 2-propanol at 600 mbar (pot near 69 °C), 4 × 10 vol, held at 14 vol so the
 * product stays dissolved at the distillation temperature (invented
 * solubility ~90 g/L at 70 °C) → 6 vol heptane antisolvent at 60 °C, seeded →
 * cooling to 5 °C (product ~12 g/L in cold 2-propanol: about a tenth stays in
 * the mother liquor) → filtration with two cold heptane cake washes → vacuum
 * drying. Specification limits (0.15 % each, 0.10 % for the urea) are
 * invented for the demo. The structure fingerprints are openchemlib's, as the
 * compound service computes them (a unit test keeps them equal). The solubility points of each invented compound follow
 * ln c ≈ a + b/T (van 't Hoff); the impurities are more soluble than the
 * product in every solvent.
 *
 * tests/fixtures/routes/demo-amide-isolation.json is this document written
 * out (a unit test keeps the two identical).
 */
import type { RouteDocumentInput } from '../../shared/schemas/route';

const invented = 'invented demo value';

export const demoAmideIsolation: RouteDocumentInput = {
  schemaVersion: 1,
  name: 'PW-417 amide isolation (demo, invented compounds)',
  referenceInput: { componentId: 'pw417-amide', massKg: 1 },
  components: [
    { kind: 'solvent', id: 'water', solventId: 'water' },
    { kind: 'solvent', id: '2-methyltetrahydrofuran', solventId: '2-methyltetrahydrofuran' },
    { kind: 'solvent', id: '2-propanol', solventId: '2-propanol' },
    { kind: 'solvent', id: 'n-heptane', solventId: 'n-heptane' },
    { kind: 'aqueous-solute', soluteId: 'hcl' },
    { kind: 'aqueous-solute', soluteId: 'nahco3' },
    { kind: 'aqueous-solute', soluteId: 'nacl' },
    {
      kind: 'compound',
      id: 'pw417-amide',
      name: 'PW-417 amide (invented)',
      role: 'product',
      smiles: 'O=C(NCCC1CCOCC1)c1ccc(Cl)c(OCC2CC2)c1',
      molarMassGmol: 337.85,
      fingerprint:
        'fffffffebfdbffff1375609ec1bc112d90924a0020f492e2208ce24400000710200008421020601065f220ad00208000a0200008400000028010005008481040',
      meltingPointC: 168,
      enthalpyFusionKJmol: 32,
      densityGmL: 1.28,
      logP: 3.1,
      note: 'Invented demo compound: every value is invented.',
      solubility: [
        { solventId: '2-propanol', temperatureC: 5, value: 12, unit: 'g/L', source: invented },
        { solventId: '2-propanol', temperatureC: 25, value: 24, unit: 'g/L', source: invented },
        { solventId: '2-propanol', temperatureC: 50, value: 53, unit: 'g/L', source: invented },
        { solventId: '2-propanol', temperatureC: 70, value: 90, unit: 'g/L', source: invented },
        { solventId: 'n-heptane', temperatureC: 5, value: 0.6, unit: 'g/L', source: invented },
        { solventId: 'n-heptane', temperatureC: 50, value: 3, unit: 'g/L', source: invented },
        {
          solventId: '2-methyltetrahydrofuran',
          temperatureC: 5,
          value: 44,
          unit: 'g/L',
          source: invented,
        },
        {
          solventId: '2-methyltetrahydrofuran',
          temperatureC: 20,
          value: 70,
          unit: 'g/L',
          source: invented,
        },
        {
          solventId: '2-methyltetrahydrofuran',
          temperatureC: 50,
          value: 160,
          unit: 'g/L',
          source: invented,
        },
        {
          solventId: '2-methyltetrahydrofuran',
          temperatureC: 70,
          value: 250,
          unit: 'g/L',
          source: invented,
        },
        { solventId: 'water', temperatureC: 20, value: 0.04, unit: 'g/L', source: invented },
        { solventId: 'water', temperatureC: 50, value: 0.1, unit: 'g/L', source: invented },
      ],
      partition: [
        { organicSolventId: '2-methyltetrahydrofuran', temperatureC: 20, D: 900, source: invented },
      ],
    },
    {
      kind: 'compound',
      id: 'pw417-acid',
      name: 'PW-417 acid (invented)',
      role: 'reagent',
      smiles: 'OC(=O)c1ccc(Cl)c(OCC2CC2)c1',
      molarMassGmol: 226.66,
      fingerprint:
        'ffff5f146e1326a11010308ec18c010990120200206410c20004a0040000060000000840102060106442200840208000a020000840001002801000400041900c',
      specLimitPct: 0.15,
      meltingPointC: 142,
      enthalpyFusionKJmol: 27,
      logP: 2.4,
      pKa: [{ value: 4.2, type: 'acid' }],
      ionisableGroups: [{ group: 'aromatic carboxylic acid', type: 'acid' }],
      note: 'Invented demo compound (carboxylic acid coupling partner).',
      solubility: [
        { solventId: '2-propanol', temperatureC: 5, value: 80, unit: 'g/L', source: invented },
        { solventId: '2-propanol', temperatureC: 70, value: 300, unit: 'g/L', source: invented },
        { solventId: 'n-heptane', temperatureC: 5, value: 1.5, unit: 'g/L', source: invented },
        { solventId: 'n-heptane', temperatureC: 50, value: 6, unit: 'g/L', source: invented },
      ],
    },
    {
      kind: 'compound',
      id: 'pw417-amine',
      name: 'PW-417 amine (invented)',
      role: 'reagent',
      smiles: 'NCCC1CCOCC1',
      molarMassGmol: 129.2,
      fingerprint:
        'fef9cee4b98852fe03504010002c0004000042002080802000800040000002000000000000000000000000240000000000000000000000000000000008100080',
      specLimitPct: 0.15,
      meltingPointC: -12,
      enthalpyFusionKJmol: 14,
      logP: 1.6,
      pKa: [{ value: 9.6, type: 'base' }],
      ionisableGroups: [{ group: 'primary aliphatic amine', type: 'base' }],
      note: 'Invented demo compound (amine coupling partner, a liquid).',
    },
    {
      kind: 'compound',
      id: 'deschloro-amide',
      name: 'Des-chloro amide (invented)',
      role: 'impurity',
      smiles: 'O=C(NCCC1CCOCC1)c1cccc(OCC2CC2)c1',
      molarMassGmol: 303.4,
      fingerprint:
        'fffffffebfdbffff1375609a813c112c90924a0020d48022208c424000000700200008421000200045b020a500200000a0000008400000008000004008081040',
      specLimitPct: 0.15,
      meltingPointC: 151,
      enthalpyFusionKJmol: 29,
      logP: 2.7,
      note: 'Invented demo impurity carried from the acid.',
      solubility: [
        { solventId: '2-propanol', temperatureC: 5, value: 25, unit: 'g/L', source: invented },
        { solventId: '2-propanol', temperatureC: 70, value: 160, unit: 'g/L', source: invented },
        { solventId: 'n-heptane', temperatureC: 5, value: 1.5, unit: 'g/L', source: invented },
        { solventId: 'n-heptane', temperatureC: 50, value: 6, unit: 'g/L', source: invented },
      ],
    },
    {
      kind: 'compound',
      id: 'coupling-urea',
      name: 'Coupling-agent urea (invented)',
      role: 'by-product',
      smiles: 'CCNC(=O)NCCCN(C)C',
      molarMassGmol: 173.26,
      fingerprint:
        'fff7e9de97cccd154d4cc409304200080009a0308000000008090000200000000080000000000008000000800000000000000000000000000000000002080040',
      specLimitPct: 0.1,
      meltingPointC: 98,
      enthalpyFusionKJmol: 20,
      logP: -0.6,
      // Estimated from the structure (dimethylamino group; Perrin, Dempsey &
      // Serjeant group method, ±1): a unit test keeps it equal to the estimate.
      pKa: [{ value: 10, type: 'base', source: 'estimated' }],
      ionisableGroups: [{ group: 'tertiary aliphatic amine', type: 'base' }],
      note: 'Invented demo by-product of the coupling agent, water-soluble.',
    },
  ],
  steps: [
    {
      id: 'crude',
      kind: 'charge',
      name: 'Crude reaction mixture in 2-MeTHF',
      position: { x: 0, y: 0 },
      params: {
        temperatureC: 20,
        contents: [
          { kind: 'component', componentId: '2-methyltetrahydrofuran', amount: 10, unit: 'vol' },
          { kind: 'component', componentId: 'pw417-amide', amount: 1.0, unit: 'kg' },
          { kind: 'component', componentId: 'pw417-acid', amount: 0.05, unit: 'equiv' },
          { kind: 'component', componentId: 'pw417-amine', amount: 0.08, unit: 'equiv' },
          {
            kind: 'component',
            componentId: 'deschloro-amide',
            amount: { value: 0.015, plusMinus: 0.005 },
            unit: 'kg',
          },
          { kind: 'component', componentId: 'coupling-urea', amount: 0.12, unit: 'kg' },
        ],
      },
    },
    {
      id: 'acid-wash',
      kind: 'wash',
      name: '1 M HCl wash (removes the amine)',
      position: { x: 400, y: 0 },
      params: {
        addedLiquid: {
          kind: 'aqueous',
          soluteId: 'hcl',
          wtPct: 3.6,
          volume: { value: { value: 3, plusMinus: 0.3 }, unit: 'vol' },
        },
        stages: 1,
        mode: 'cross-current',
        temperatureC: 20,
        keep: 'organic',
      },
    },
    {
      id: 'base-wash',
      kind: 'wash',
      name: '8 % NaHCO3 wash (removes the acid)',
      position: { x: 800, y: 0 },
      params: {
        addedLiquid: {
          kind: 'aqueous',
          soluteId: 'nahco3',
          wtPct: 8,
          volume: { value: 3, unit: 'vol' },
        },
        stages: 1,
        mode: 'cross-current',
        temperatureC: 20,
        keep: 'organic',
      },
    },
    {
      id: 'brine-wash',
      kind: 'wash',
      name: '20 % brine wash',
      position: { x: 0, y: 320 },
      params: {
        addedLiquid: {
          kind: 'aqueous',
          soluteId: 'nacl',
          wtPct: 20,
          volume: { value: 2, unit: 'vol' },
        },
        stages: 1,
        mode: 'cross-current',
        temperatureC: 20,
        keep: 'organic',
      },
    },
    {
      id: 'swap',
      kind: 'distillation',
      name: 'Solvent swap to 2-propanol',
      position: { x: 400, y: 320 },
      params: {
        mode: {
          kind: 'put-and-take',
          cycles: 4,
          targetVolume: { value: 14, unit: 'vol' },
          addSolventId: '2-propanol',
          addVolume: { value: 10, unit: 'vol' },
        },
        condition: { kind: 'pressure', pressureMbar: { value: 600, plusMinus: 20 } },
      },
    },
    {
      id: 'antisolvent',
      kind: 'crystallisation',
      name: 'Heptane antisolvent at 60 °C, seeded',
      position: { x: 800, y: 320 },
      params: {
        mode: {
          kind: 'antisolvent',
          antisolventId: 'n-heptane',
          volume: { value: { value: 6, plusMinus: 0.5 }, unit: 'vol' },
          temperatureC: 60,
        },
        seeded: true,
        seedWtPct: 1,
      },
    },
    {
      id: 'cool',
      kind: 'crystallisation',
      name: 'Cool to 5 °C and age',
      position: { x: 0, y: 640 },
      params: {
        mode: { kind: 'cooling', startC: 60, endC: { value: 5, plusMinus: 2 } },
        seeded: true,
      },
    },
    {
      id: 'filter',
      kind: 'filtration',
      name: 'Filter, wash with cold heptane',
      position: { x: 400, y: 640 },
      params: {
        retainedLiquorLPerKg: 0.5,
        cakeWash: {
          solventId: 'n-heptane',
          volume: { value: 2, unit: 'vol' },
          washes: 2,
          temperatureC: 5,
          displacementEfficiency: 0.8,
        },
        specificCakeResistanceMPerKg: 1e10,
        mediumResistancePerM: 1e10,
        filterAreaM2: 0.1,
        pressureDropBar: 0.8,
      },
    },
    {
      id: 'dry',
      kind: 'drying',
      name: 'Vacuum dry at 50 °C',
      position: { x: 800, y: 640 },
      params: { target: { kind: 'lod', lodWtPct: 0.5 }, temperatureC: 50, pressureMbar: 50 },
    },
  ],
  connections: [
    { id: 'c1', from: { stepId: 'crude', port: 'out' }, to: { stepId: 'acid-wash', port: 'feed' } },
    {
      id: 'c2',
      from: { stepId: 'acid-wash', port: 'organic' },
      to: { stepId: 'base-wash', port: 'feed' },
    },
    {
      id: 'c3',
      from: { stepId: 'base-wash', port: 'organic' },
      to: { stepId: 'brine-wash', port: 'feed' },
    },
    {
      id: 'c4',
      from: { stepId: 'brine-wash', port: 'organic' },
      to: { stepId: 'swap', port: 'feed' },
    },
    {
      id: 'c5',
      from: { stepId: 'swap', port: 'pot' },
      to: { stepId: 'antisolvent', port: 'feed' },
    },
    {
      id: 'c6',
      from: { stepId: 'antisolvent', port: 'slurry' },
      to: { stepId: 'cool', port: 'feed' },
    },
    {
      id: 'c7',
      from: { stepId: 'cool', port: 'slurry' },
      to: { stepId: 'filter', port: 'slurry' },
    },
    { id: 'c8', from: { stepId: 'filter', port: 'cake' }, to: { stepId: 'dry', port: 'wet' } },
  ],
};
