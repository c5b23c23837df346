/**
 * Measured octanol–water log P of simple compounds, for the reference check
 * of the UNIFAC log P estimate.
 *
 * Source: CRC Handbook of Chemistry and Physics, table "Octanol–Water
 * Partition Coefficients" (values at a nominal 25 °C, compiled from Hansch,
 * Leo & Hoekman, *Exploring QSAR: Hydrophobic, Electronic and Steric
 * Constants*, ACS 1995, and Sangster, J. Phys. Chem. Ref. Data 1989, 18,
 * 1111), as carried by the public data file `CalebBell/chemicals`
 * chemicals/Environment/"CRC logP table.tsv". Every value below was read in
 * that file (status confirmed); CAS numbers are the file's keys.
 *
 * The set is every compound of that table that is also a library solvent or a
 * common textbook solute and whose UNIFAC groups are covered by the original
 * parameter table — chosen before the estimate was run, not after.
 */
import type { Source } from './types';

export const LOGP_REFERENCE_SOURCE: Source = {
  ref: 'CRC Handbook of Chemistry and Physics, Octanol-Water Partition Coefficients (via CalebBell/chemicals "CRC logP table.tsv")',
  status: 'confirmed',
};

export interface LogPReference {
  name: string;
  cas: string;
  smiles: string;
  logP: number;
}

export const LOGP_REFERENCE: readonly LogPReference[] = [
  { name: 'benzene', cas: '71-43-2', smiles: 'c1ccccc1', logP: 2.13 },
  { name: 'toluene', cas: '108-88-3', smiles: 'Cc1ccccc1', logP: 2.73 },
  { name: 'ethylbenzene', cas: '100-41-4', smiles: 'CCc1ccccc1', logP: 3.15 },
  { name: 'p-xylene', cas: '106-42-3', smiles: 'Cc1ccc(C)cc1', logP: 3.15 },
  { name: 'naphthalene', cas: '91-20-3', smiles: 'c1ccc2ccccc2c1', logP: 3.34 },
  { name: 'n-hexane', cas: '110-54-3', smiles: 'CCCCCC', logP: 4.0 },
  { name: 'n-heptane', cas: '142-82-5', smiles: 'CCCCCCC', logP: 4.5 },
  { name: 'cyclohexane', cas: '110-82-7', smiles: 'C1CCCCC1', logP: 3.44 },
  { name: 'methanol', cas: '67-56-1', smiles: 'CO', logP: -0.74 },
  { name: 'ethanol', cas: '64-17-5', smiles: 'CCO', logP: -0.3 },
  { name: '1-propanol', cas: '71-23-8', smiles: 'CCCO', logP: 0.25 },
  { name: '2-propanol', cas: '67-63-0', smiles: 'CC(C)O', logP: 0.05 },
  { name: '1-butanol', cas: '71-36-3', smiles: 'CCCCO', logP: 0.84 },
  { name: '1-hexanol', cas: '111-27-3', smiles: 'CCCCCCO', logP: 2.03 },
  { name: '1-octanol', cas: '111-87-5', smiles: 'CCCCCCCCO', logP: 3.07 },
  { name: 'benzyl alcohol', cas: '100-51-6', smiles: 'OCc1ccccc1', logP: 1.05 },
  { name: 'phenol', cas: '108-95-2', smiles: 'Oc1ccccc1', logP: 1.48 },
  { name: 'p-cresol', cas: '106-44-5', smiles: 'Cc1ccc(O)cc1', logP: 1.97 },
  { name: 'methyl acetate', cas: '79-20-9', smiles: 'CC(=O)OC', logP: 0.18 },
  { name: 'ethyl acetate', cas: '141-78-6', smiles: 'CC(=O)OCC', logP: 0.73 },
  { name: 'butyl acetate', cas: '123-86-4', smiles: 'CC(=O)OCCCC', logP: 1.82 },
  { name: 'acetone', cas: '67-64-1', smiles: 'CC(C)=O', logP: -0.24 },
  { name: '2-butanone', cas: '78-93-3', smiles: 'CCC(C)=O', logP: 0.29 },
  { name: '4-methyl-2-pentanone', cas: '108-10-1', smiles: 'CC(C)CC(C)=O', logP: 1.31 },
  { name: 'cyclohexanone', cas: '108-94-1', smiles: 'O=C1CCCCC1', logP: 0.81 },
  { name: 'acetophenone', cas: '98-86-2', smiles: 'CC(=O)c1ccccc1', logP: 1.63 },
  { name: 'diethyl ether', cas: '60-29-7', smiles: 'CCOCC', logP: 0.89 },
  { name: 'methyl tert-butyl ether', cas: '1634-04-4', smiles: 'COC(C)(C)C', logP: 0.94 },
  { name: 'tetrahydrofuran', cas: '109-99-9', smiles: 'C1CCOC1', logP: 0.46 },
  { name: 'anisole', cas: '100-66-3', smiles: 'COc1ccccc1', logP: 2.11 },
  { name: 'dichloromethane', cas: '75-09-2', smiles: 'ClCCl', logP: 1.25 },
  { name: 'trichloromethane', cas: '67-66-3', smiles: 'ClC(Cl)Cl', logP: 1.97 },
  { name: 'tetrachloromethane', cas: '56-23-5', smiles: 'ClC(Cl)(Cl)Cl', logP: 2.64 },
  { name: 'chlorobenzene', cas: '108-90-7', smiles: 'Clc1ccccc1', logP: 2.84 },
  { name: 'acetic acid', cas: '64-19-7', smiles: 'CC(=O)O', logP: -0.17 },
  { name: 'propanoic acid', cas: '79-09-4', smiles: 'CCC(=O)O', logP: 0.33 },
  { name: 'benzoic acid', cas: '65-85-0', smiles: 'OC(=O)c1ccccc1', logP: 1.88 },
  { name: 'aniline', cas: '62-53-3', smiles: 'Nc1ccccc1', logP: 0.9 },
  { name: 'butylamine', cas: '109-73-9', smiles: 'CCCCN', logP: 0.86 },
  { name: 'triethylamine', cas: '121-44-8', smiles: 'CCN(CC)CC', logP: 1.45 },
  { name: 'pyridine', cas: '110-86-1', smiles: 'c1ccncc1', logP: 0.65 },
  { name: 'acetonitrile', cas: '75-05-8', smiles: 'CC#N', logP: -0.34 },
  { name: 'nitromethane', cas: '75-52-5', smiles: 'C[N+](=O)[O-]', logP: -0.33 },
  { name: 'nitrobenzene', cas: '98-95-3', smiles: '[O-][N+](=O)c1ccccc1', logP: 1.85 },
  { name: 'N,N-dimethylformamide', cas: '68-12-2', smiles: 'CN(C)C=O', logP: -1.01 },
  { name: 'dimethyl sulfoxide', cas: '67-68-5', smiles: 'CS(C)=O', logP: -1.35 },
];
