// The invented reference set of the demo: compounds, their bands, and where each band position comes from.
//
// Scenario (fictitious, synthetic): the "Alder Row biofluid group" builds a reference set for dried serum films and
// urine on three FTIR benches, a tunable-laser bench and a field-resolved laser bench. Every spectrum the generator makes
// from this table is synthetic: band positions follow the published assignment tables named in `source`, widths and
// relative heights are invented to look plausible, and noise and baselines are seeded.
import type { Band } from './bandProfile.js';

export type DemoClass =
  | 'protein'
  | 'lipid'
  | 'carbohydrate'
  | 'nucleic-acid'
  | 'metabolite'
  | 'drug'
  | 'solvent'
  | 'buffer'
  | 'mixture'
  | 'biofluid'
  | 'other';

export interface DemoCompound {
  id: string;
  name: string;
  class: DemoClass;
  synonyms?: string[];
  formula?: string;
  /** CAS registry numbers recalled from memory; the metadata schema verifies each check digit. */
  cas?: string;
  /** Where the band positions come from; "from memory" where they are recalled, not looked up. */
  source: string;
  bands: Band[];
}

const BARTH = 'Barth, Biochim. Biophys. Acta 1767:1073 (2007) — amide band positions';
const MOV = 'Movasaghi, Rehman & Rehman, Appl. Spectrosc. Rev. 43:134 (2008) — band assignments';
const MEMORY = 'band positions from memory (approximate group frequencies), not from a looked-up table';

/** Amide and side-chain bands shared by all proteins; amide I moves with the secondary structure (Barth 2007). */
function protein(amideI: number, betaShare: number, extra: Band[] = []): Band[] {
  return [
    { position: 3295, fwhm: 140, height: 0.55 },
    { position: 3070, fwhm: 60, height: 0.08 },
    { position: 2960, fwhm: 22, height: 0.12 },
    { position: 2872, fwhm: 20, height: 0.06 },
    { position: amideI, fwhm: 32, height: 1 - 0.5 * betaShare },
    ...(betaShare > 0 ? [{ position: 1632, fwhm: 22, height: 0.6 * betaShare }] : []),
    ...(betaShare > 0.3 ? [{ position: 1688, fwhm: 14, height: 0.12 * betaShare }] : []),
    { position: 1545, fwhm: 34, height: 0.62 },
    { position: 1515, fwhm: 8, height: 0.05 },
    { position: 1453, fwhm: 30, height: 0.14 },
    { position: 1398, fwhm: 32, height: 0.12 },
    { position: 1305, fwhm: 40, height: 0.07 },
    { position: 1245, fwhm: 45, height: 0.1 },
    { position: 1080, fwhm: 40, height: 0.04 },
    ...extra,
  ];
}

export const demoCompounds: DemoCompound[] = [
  // Proteins: amide I at 1648–1657 for α-helix, 1623–1641 with 1674–1695 for β-sheet (Barth 2007).
  { id: 'albumin-human', name: 'Serum albumin (human)', class: 'protein', synonyms: ['HSA'], source: BARTH, bands: protein(1654, 0) },
  { id: 'igg-human', name: 'Immunoglobulin G (human)', class: 'protein', synonyms: ['IgG'], source: BARTH, bands: protein(1640, 0.8) },
  { id: 'fibrinogen', name: 'Fibrinogen', class: 'protein', source: BARTH, bands: protein(1652, 0.35) },
  { id: 'haemoglobin', name: 'Haemoglobin', class: 'protein', synonyms: ['hemoglobin', 'Hb'], source: BARTH, bands: protein(1656, 0.05) },
  { id: 'lysozyme', name: 'Lysozyme (hen egg white)', class: 'protein', source: BARTH, bands: protein(1655, 0.2) },
  { id: 'transferrin', name: 'Transferrin', class: 'protein', source: BARTH, bands: protein(1650, 0.45, [{ position: 1515, fwhm: 9, height: 0.09 }]) },
  { id: 'collagen-i', name: 'Collagen type I', class: 'protein', source: BARTH, bands: protein(1660, 0.1, [{ position: 1338, fwhm: 14, height: 0.08 }, { position: 1204, fwhm: 18, height: 0.06 }]) },
  // Lipids: CH₂ stretches 2922/2852, ester C=O 1740, CH₂ scissoring 1467, PO₂⁻ 1230–1240 and 1080 (Movasaghi 2008).
  {
    id: 'triolein', name: 'Glyceryl trioleate', class: 'lipid', synonyms: ['triolein'], formula: 'C57H104O6', cas: '122-32-7', source: MOV,
    bands: [
      { position: 3006, fwhm: 12, height: 0.1 }, { position: 2955, fwhm: 14, height: 0.25 }, { position: 2924, fwhm: 18, height: 1 },
      { position: 2853, fwhm: 14, height: 0.62 }, { position: 1745, fwhm: 18, height: 0.85 }, { position: 1465, fwhm: 16, height: 0.22 },
      { position: 1377, fwhm: 12, height: 0.08 }, { position: 1160, fwhm: 24, height: 0.35 }, { position: 1098, fwhm: 22, height: 0.12 },
      { position: 722, fwhm: 10, height: 0.1 },
    ],
  },
  {
    id: 'cholesterol', name: 'Cholesterol', class: 'lipid', formula: 'C27H46O', cas: '57-88-5', source: `${MOV}; ${MEMORY}`,
    bands: [
      { position: 3400, fwhm: 120, height: 0.25 }, { position: 2933, fwhm: 24, height: 1 }, { position: 2867, fwhm: 20, height: 0.62 },
      { position: 1466, fwhm: 14, height: 0.3 }, { position: 1376, fwhm: 10, height: 0.18 }, { position: 1055, fwhm: 16, height: 0.3 },
      { position: 956, fwhm: 10, height: 0.08 }, { position: 800, fwhm: 10, height: 0.06 },
    ],
  },
  {
    id: 'cholesteryl-oleate', name: 'Cholesteryl oleate', class: 'lipid', formula: 'C45H78O2', source: `${MOV}; ${MEMORY}`,
    bands: [
      { position: 2930, fwhm: 22, height: 1 }, { position: 2853, fwhm: 16, height: 0.6 }, { position: 1736, fwhm: 16, height: 0.55 },
      { position: 1467, fwhm: 14, height: 0.25 }, { position: 1377, fwhm: 10, height: 0.12 }, { position: 1174, fwhm: 22, height: 0.35 },
      { position: 1010, fwhm: 14, height: 0.08 },
    ],
  },
  {
    id: 'phosphatidylcholine', name: 'Phosphatidylcholine (egg)', class: 'lipid', synonyms: ['lecithin'], source: MOV,
    bands: [
      { position: 2922, fwhm: 18, height: 1 }, { position: 2852, fwhm: 13, height: 0.65 }, { position: 1738, fwhm: 18, height: 0.6 },
      { position: 1467, fwhm: 14, height: 0.2 }, { position: 1236, fwhm: 30, height: 0.45 }, { position: 1088, fwhm: 26, height: 0.4 },
      { position: 1060, fwhm: 20, height: 0.2 }, { position: 970, fwhm: 14, height: 0.2 }, { position: 720, fwhm: 8, height: 0.06 },
    ],
  },
  {
    id: 'palmitic-acid', name: 'Palmitic acid', class: 'lipid', synonyms: ['hexadecanoic acid'], formula: 'C16H32O2', cas: '57-10-3', source: `${MOV}; ${MEMORY}`,
    bands: [
      { position: 2955, fwhm: 10, height: 0.3 }, { position: 2916, fwhm: 14, height: 1 }, { position: 2849, fwhm: 10, height: 0.75 },
      { position: 1700, fwhm: 18, height: 0.85 }, { position: 1465, fwhm: 10, height: 0.3 }, { position: 1430, fwhm: 12, height: 0.2 },
      { position: 1295, fwhm: 14, height: 0.2 }, { position: 940, fwhm: 30, height: 0.2 }, { position: 720, fwhm: 6, height: 0.15 },
    ],
  },
  // Carbohydrates: C–O stretches near 1150, 1080, 1050, 1025 (Movasaghi 2008); glucose 1152/1107/1080/1035 (from memory).
  {
    id: 'glucose', name: 'D-Glucose', class: 'carbohydrate', synonyms: ['dextrose'], formula: 'C6H12O6', cas: '50-99-7', source: `${MOV}; glucose positions from memory`,
    bands: [
      { position: 3350, fwhm: 200, height: 0.45 }, { position: 2930, fwhm: 40, height: 0.1 }, { position: 1460, fwhm: 20, height: 0.08 },
      { position: 1365, fwhm: 24, height: 0.1 }, { position: 1152, fwhm: 18, height: 0.45 }, { position: 1107, fwhm: 18, height: 0.6 },
      { position: 1080, fwhm: 16, height: 0.7 }, { position: 1035, fwhm: 20, height: 1 }, { position: 995, fwhm: 14, height: 0.3 },
      { position: 915, fwhm: 14, height: 0.12 },
    ],
  },
  {
    id: 'fructose', name: 'D-Fructose', class: 'carbohydrate', formula: 'C6H12O6', cas: '57-48-7', source: `${MOV}; ${MEMORY}`,
    bands: [
      { position: 3380, fwhm: 200, height: 0.4 }, { position: 1420, fwhm: 20, height: 0.1 }, { position: 1340, fwhm: 20, height: 0.12 },
      { position: 1150, fwhm: 18, height: 0.4 }, { position: 1080, fwhm: 18, height: 0.65 }, { position: 1062, fwhm: 16, height: 1 },
      { position: 980, fwhm: 16, height: 0.45 }, { position: 870, fwhm: 14, height: 0.15 },
    ],
  },
  {
    id: 'lactose', name: 'Lactose', class: 'carbohydrate', formula: 'C12H22O11', cas: '63-42-3', source: `${MOV}; ${MEMORY}`,
    bands: [
      { position: 3370, fwhm: 200, height: 0.45 }, { position: 1425, fwhm: 24, height: 0.1 }, { position: 1160, fwhm: 20, height: 0.5 },
      { position: 1115, fwhm: 18, height: 0.55 }, { position: 1072, fwhm: 20, height: 0.8 }, { position: 1032, fwhm: 20, height: 1 },
      { position: 895, fwhm: 12, height: 0.15 },
    ],
  },
  {
    id: 'sucrose', name: 'Sucrose', class: 'carbohydrate', formula: 'C12H22O11', cas: '57-50-1', source: `${MOV}; ${MEMORY}`,
    bands: [
      { position: 3380, fwhm: 180, height: 0.4 }, { position: 1430, fwhm: 20, height: 0.12 }, { position: 1130, fwhm: 16, height: 0.5 },
      { position: 1055, fwhm: 20, height: 1 }, { position: 990, fwhm: 16, height: 0.8 }, { position: 925, fwhm: 12, height: 0.2 },
    ],
  },
  {
    id: 'glycogen', name: 'Glycogen', class: 'carbohydrate', source: MOV,
    bands: [
      { position: 3330, fwhm: 240, height: 0.5 }, { position: 2930, fwhm: 40, height: 0.1 }, { position: 1150, fwhm: 22, height: 0.5 },
      { position: 1078, fwhm: 22, height: 0.65 }, { position: 1025, fwhm: 26, height: 1 }, { position: 930, fwhm: 16, height: 0.15 },
    ],
  },
  // Nucleic acids: base C=O 1715, PO₂⁻ 1230–1240 and 1080, ribose C–O 1120, backbone 970 (Movasaghi 2008).
  {
    id: 'dna-calf-thymus', name: 'DNA (calf thymus)', class: 'nucleic-acid', synonyms: ['DNA'], source: MOV,
    bands: [
      { position: 3200, fwhm: 260, height: 0.35 }, { position: 1712, fwhm: 26, height: 0.6 }, { position: 1660, fwhm: 30, height: 0.45 },
      { position: 1605, fwhm: 22, height: 0.25 }, { position: 1490, fwhm: 18, height: 0.15 }, { position: 1237, fwhm: 32, height: 0.75 },
      { position: 1088, fwhm: 24, height: 1 }, { position: 1055, fwhm: 20, height: 0.45 }, { position: 968, fwhm: 16, height: 0.3 },
    ],
  },
  {
    id: 'rna-yeast', name: 'RNA (yeast)', class: 'nucleic-acid', synonyms: ['RNA'], source: MOV,
    bands: [
      { position: 3200, fwhm: 260, height: 0.35 }, { position: 1696, fwhm: 26, height: 0.6 }, { position: 1652, fwhm: 30, height: 0.45 },
      { position: 1240, fwhm: 32, height: 0.8 }, { position: 1121, fwhm: 20, height: 0.45 }, { position: 1082, fwhm: 24, height: 1 },
      { position: 995, fwhm: 16, height: 0.4 }, { position: 970, fwhm: 14, height: 0.25 },
    ],
  },
  // Metabolites of serum and urine.
  {
    id: 'urea', name: 'Urea', class: 'metabolite', synonyms: ['carbamide'], formula: 'CH4N2O', cas: '57-13-6',
    source: 'C–N asymmetric stretch 1468 (looked-up value); NH₂ bend ~1620 and rock ~1160, C=O ~1680 and N–H stretches from memory',
    bands: [
      { position: 3440, fwhm: 60, height: 0.45 }, { position: 3340, fwhm: 60, height: 0.5 }, { position: 1680, fwhm: 24, height: 0.8 },
      { position: 1620, fwhm: 22, height: 1 }, { position: 1468, fwhm: 20, height: 0.7 }, { position: 1160, fwhm: 18, height: 0.25 },
      { position: 1003, fwhm: 10, height: 0.05 },
    ],
  },
  {
    id: 'sodium-lactate', name: 'Sodium L-lactate', class: 'metabolite', synonyms: ['lactate'], source: 'lactate COO⁻ and C–O stretches from memory',
    bands: [
      { position: 2980, fwhm: 24, height: 0.15 }, { position: 1577, fwhm: 26, height: 1 }, { position: 1455, fwhm: 16, height: 0.25 },
      { position: 1417, fwhm: 18, height: 0.6 }, { position: 1362, fwhm: 14, height: 0.25 }, { position: 1124, fwhm: 16, height: 0.4 },
      { position: 1043, fwhm: 16, height: 0.35 }, { position: 858, fwhm: 10, height: 0.12 },
    ],
  },
  {
    id: 'sodium-citrate', name: 'Trisodium citrate', class: 'metabolite', synonyms: ['citrate'], source: 'citrate COO⁻ ~1390 (looked-up value); other positions from memory',
    bands: [
      { position: 1590, fwhm: 30, height: 1 }, { position: 1395, fwhm: 24, height: 0.7 }, { position: 1280, fwhm: 16, height: 0.15 },
      { position: 1080, fwhm: 16, height: 0.2 }, { position: 910, fwhm: 12, height: 0.12 },
    ],
  },
  {
    id: 'creatinine', name: 'Creatinine', class: 'metabolite', formula: 'C4H7N3O', cas: '60-27-5', source: MEMORY,
    bands: [
      { position: 3260, fwhm: 60, height: 0.4 }, { position: 3040, fwhm: 50, height: 0.3 }, { position: 1665, fwhm: 20, height: 1 },
      { position: 1490, fwhm: 16, height: 0.3 }, { position: 1420, fwhm: 16, height: 0.35 }, { position: 1330, fwhm: 14, height: 0.3 },
      { position: 1240, fwhm: 14, height: 0.25 }, { position: 1080, fwhm: 12, height: 0.15 }, { position: 810, fwhm: 10, height: 0.2 },
    ],
  },
  {
    id: 'uric-acid', name: 'Uric acid', class: 'metabolite', formula: 'C5H4N4O3', cas: '69-93-2', source: MEMORY,
    bands: [
      { position: 3000, fwhm: 120, height: 0.45 }, { position: 1670, fwhm: 30, height: 1 }, { position: 1590, fwhm: 20, height: 0.45 },
      { position: 1435, fwhm: 16, height: 0.35 }, { position: 1405, fwhm: 16, height: 0.3 }, { position: 1305, fwhm: 14, height: 0.35 },
      { position: 1120, fwhm: 14, height: 0.25 }, { position: 990, fwhm: 12, height: 0.25 }, { position: 783, fwhm: 10, height: 0.3 },
    ],
  },
  {
    id: 'sodium-pyruvate', name: 'Sodium pyruvate', class: 'metabolite', synonyms: ['pyruvate'], source: MEMORY,
    bands: [
      { position: 1710, fwhm: 18, height: 0.8 }, { position: 1630, fwhm: 24, height: 1 }, { position: 1400, fwhm: 20, height: 0.6 },
      { position: 1355, fwhm: 14, height: 0.35 }, { position: 1180, fwhm: 16, height: 0.2 }, { position: 1020, fwhm: 14, height: 0.15 },
    ],
  },
  {
    id: 'l-alanine', name: 'L-Alanine', class: 'metabolite', formula: 'C3H7NO2', cas: '56-41-7', source: MEMORY,
    bands: [
      { position: 3080, fwhm: 90, height: 0.4 }, { position: 1590, fwhm: 24, height: 1 }, { position: 1520, fwhm: 18, height: 0.55 },
      { position: 1410, fwhm: 16, height: 0.6 }, { position: 1360, fwhm: 12, height: 0.35 }, { position: 1305, fwhm: 12, height: 0.2 },
      { position: 1150, fwhm: 12, height: 0.2 }, { position: 1115, fwhm: 10, height: 0.15 }, { position: 850, fwhm: 10, height: 0.2 },
    ],
  },
  {
    id: 'glycine', name: 'Glycine', class: 'metabolite', formula: 'C2H5NO2', cas: '56-40-6', source: MEMORY,
    bands: [
      { position: 3100, fwhm: 100, height: 0.4 }, { position: 1610, fwhm: 24, height: 1 }, { position: 1500, fwhm: 18, height: 0.6 },
      { position: 1412, fwhm: 16, height: 0.65 }, { position: 1333, fwhm: 12, height: 0.4 }, { position: 1112, fwhm: 12, height: 0.2 },
      { position: 1033, fwhm: 12, height: 0.25 }, { position: 910, fwhm: 12, height: 0.3 },
    ],
  },
  {
    id: 'beta-hydroxybutyrate', name: 'Sodium 3-hydroxybutyrate', class: 'metabolite', synonyms: ['β-hydroxybutyrate', 'BHB'], source: MEMORY,
    bands: [
      { position: 2970, fwhm: 22, height: 0.2 }, { position: 1560, fwhm: 26, height: 1 }, { position: 1410, fwhm: 20, height: 0.55 },
      { position: 1300, fwhm: 14, height: 0.2 }, { position: 1120, fwhm: 14, height: 0.3 }, { position: 950, fwhm: 12, height: 0.2 },
    ],
  },
  // Drugs that turn up in serum and urine studies; positions are recalled group frequencies.
  {
    id: 'paracetamol', name: 'Paracetamol', class: 'drug', synonyms: ['acetaminophen'], formula: 'C8H9NO2', cas: '103-90-2', source: MEMORY,
    bands: [
      { position: 3325, fwhm: 40, height: 0.35 }, { position: 3160, fwhm: 80, height: 0.25 }, { position: 1654, fwhm: 14, height: 0.55 },
      { position: 1610, fwhm: 12, height: 0.4 }, { position: 1565, fwhm: 14, height: 0.5 }, { position: 1507, fwhm: 12, height: 1 },
      { position: 1440, fwhm: 12, height: 0.3 }, { position: 1370, fwhm: 12, height: 0.3 }, { position: 1260, fwhm: 14, height: 0.35 },
      { position: 1227, fwhm: 12, height: 0.45 }, { position: 1171, fwhm: 10, height: 0.2 }, { position: 837, fwhm: 10, height: 0.35 },
    ],
  },
  {
    id: 'ibuprofen', name: 'Ibuprofen', class: 'drug', formula: 'C13H18O2', cas: '15687-27-1', source: MEMORY,
    bands: [
      { position: 2955, fwhm: 16, height: 0.6 }, { position: 2922, fwhm: 16, height: 0.4 }, { position: 2868, fwhm: 14, height: 0.3 },
      { position: 1721, fwhm: 18, height: 1 }, { position: 1507, fwhm: 10, height: 0.3 }, { position: 1462, fwhm: 12, height: 0.25 },
      { position: 1420, fwhm: 14, height: 0.3 }, { position: 1322, fwhm: 12, height: 0.2 }, { position: 1231, fwhm: 14, height: 0.45 },
      { position: 1184, fwhm: 10, height: 0.2 }, { position: 866, fwhm: 10, height: 0.15 }, { position: 779, fwhm: 10, height: 0.3 },
    ],
  },
  {
    id: 'caffeine', name: 'Caffeine', class: 'drug', formula: 'C8H10N4O2', cas: '58-08-2', source: MEMORY,
    bands: [
      { position: 3112, fwhm: 20, height: 0.15 }, { position: 2955, fwhm: 20, height: 0.12 }, { position: 1700, fwhm: 14, height: 0.9 },
      { position: 1659, fwhm: 16, height: 1 }, { position: 1548, fwhm: 12, height: 0.5 }, { position: 1487, fwhm: 12, height: 0.4 },
      { position: 1455, fwhm: 10, height: 0.3 }, { position: 1359, fwhm: 10, height: 0.3 }, { position: 1240, fwhm: 12, height: 0.35 },
      { position: 1026, fwhm: 10, height: 0.15 }, { position: 974, fwhm: 8, height: 0.15 }, { position: 745, fwhm: 8, height: 0.3 },
    ],
  },
  {
    id: 'aspirin', name: 'Acetylsalicylic acid', class: 'drug', synonyms: ['aspirin'], formula: 'C9H8O4', cas: '50-78-2', source: MEMORY,
    bands: [
      { position: 1754, fwhm: 14, height: 0.85 }, { position: 1690, fwhm: 16, height: 1 }, { position: 1605, fwhm: 12, height: 0.45 },
      { position: 1483, fwhm: 10, height: 0.3 }, { position: 1455, fwhm: 10, height: 0.3 }, { position: 1306, fwhm: 12, height: 0.35 },
      { position: 1218, fwhm: 14, height: 0.45 }, { position: 1185, fwhm: 12, height: 0.75 }, { position: 917, fwhm: 10, height: 0.25 },
      { position: 754, fwhm: 10, height: 0.4 },
    ],
  },
  {
    id: 'metformin-hcl', name: 'Metformin hydrochloride', class: 'drug', synonyms: ['metformin'], source: MEMORY,
    bands: [
      { position: 3370, fwhm: 40, height: 0.55 }, { position: 3295, fwhm: 40, height: 0.5 }, { position: 3160, fwhm: 60, height: 0.45 },
      { position: 1625, fwhm: 18, height: 1 }, { position: 1568, fwhm: 18, height: 0.8 }, { position: 1450, fwhm: 14, height: 0.3 },
      { position: 1060, fwhm: 14, height: 0.3 }, { position: 935, fwhm: 10, height: 0.2 }, { position: 800, fwhm: 10, height: 0.2 },
    ],
  },
  // Solvents and buffers the lab dilutes or dries its samples from.
  {
    id: 'water-liquid', name: 'Water (liquid)', class: 'solvent', synonyms: ['H2O'], formula: 'H2O', cas: '7732-18-5',
    source: 'Bertie & Lan, Appl. Spectrosc. 50:1047 (1996) — band positions (from memory)',
    bands: [
      { position: 3404, fwhm: 380, height: 1 }, { position: 3250, fwhm: 240, height: 0.55 }, { position: 2125, fwhm: 180, height: 0.03 },
      { position: 1643, fwhm: 75, height: 0.3 }, { position: 690, fwhm: 300, height: 0.35 },
    ],
  },
  {
    id: 'dmso', name: 'Dimethyl sulfoxide', class: 'solvent', synonyms: ['DMSO'], formula: 'C2H6OS', cas: '67-68-5', source: 'S=O stretch ~1050 neat, CH₃ rock ~950 (from memory)',
    bands: [
      { position: 2995, fwhm: 12, height: 0.15 }, { position: 2912, fwhm: 12, height: 0.18 }, { position: 1437, fwhm: 14, height: 0.2 },
      { position: 1407, fwhm: 12, height: 0.2 }, { position: 1310, fwhm: 10, height: 0.15 }, { position: 1050, fwhm: 22, height: 1 },
      { position: 1018, fwhm: 14, height: 0.5 }, { position: 952, fwhm: 12, height: 0.4 }, { position: 698, fwhm: 10, height: 0.2 },
    ],
  },
  {
    id: 'ethanol', name: 'Ethanol', class: 'solvent', formula: 'C2H6O', cas: '64-17-5', source: MEMORY,
    bands: [
      { position: 3340, fwhm: 220, height: 0.8 }, { position: 2974, fwhm: 18, height: 0.6 }, { position: 2928, fwhm: 18, height: 0.3 },
      { position: 2884, fwhm: 16, height: 0.25 }, { position: 1450, fwhm: 16, height: 0.25 }, { position: 1380, fwhm: 14, height: 0.2 },
      { position: 1088, fwhm: 16, height: 0.55 }, { position: 1046, fwhm: 14, height: 1 }, { position: 880, fwhm: 12, height: 0.45 },
    ],
  },
  {
    id: 'phosphate-buffer', name: 'Phosphate buffer salts (pH 7.4, dried)', class: 'buffer', synonyms: ['PBS'], source: 'HPO₄²⁻/H₂PO₄⁻ stretches (from memory)',
    bands: [
      { position: 1155, fwhm: 30, height: 0.5 }, { position: 1077, fwhm: 30, height: 1 }, { position: 989, fwhm: 22, height: 0.7 },
      { position: 940, fwhm: 20, height: 0.35 }, { position: 850, fwhm: 16, height: 0.25 },
    ],
  },
  {
    id: 'hepes', name: 'HEPES', class: 'buffer', formula: 'C8H18N2O4S', cas: '7365-45-9', source: MEMORY,
    bands: [
      { position: 2950, fwhm: 30, height: 0.2 }, { position: 1460, fwhm: 16, height: 0.25 }, { position: 1190, fwhm: 20, height: 0.8 },
      { position: 1160, fwhm: 18, height: 0.6 }, { position: 1040, fwhm: 16, height: 1 }, { position: 950, fwhm: 12, height: 0.25 },
    ],
  },
  {
    id: 'tris', name: 'Tris(hydroxymethyl)aminomethane', class: 'buffer', synonyms: ['Tris', 'THAM'], formula: 'C4H11NO3', cas: '77-86-1', source: MEMORY,
    bands: [
      { position: 3350, fwhm: 160, height: 0.6 }, { position: 2940, fwhm: 30, height: 0.2 }, { position: 1590, fwhm: 20, height: 0.35 },
      { position: 1465, fwhm: 14, height: 0.25 }, { position: 1065, fwhm: 18, height: 0.8 }, { position: 1040, fwhm: 16, height: 1 },
      { position: 900, fwhm: 12, height: 0.25 },
    ],
  },
];
