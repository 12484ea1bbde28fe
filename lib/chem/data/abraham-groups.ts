/**
 * Fragment values for estimating Abraham solute descriptors E, S, A, B and L by group contribution (Platts, Butina,
 * Abraham & Hersey, J. Chem. Inf. Comput. Sci. 1999, 39, 835–845), as published with RMG-database
 * (input/solvation/groups/abraham.py for the atom-centred fragments, nonacentered.py for the corrections; the
 * intercepts as used by RMG-Py's estimator). V is not estimated: it is computed exactly (mcgowan.ts).
 *
 * The RMG groups are adjacency-list trees; here each is written as a SMARTS whose first atom is the group's centre.
 * Every heavy atom takes the first atom-centred fragment (in this order, most specific first) whose centre it is;
 * then it takes at most one correction, again the first that matches. A molecule with a heavy atom no fragment
 * covers (halogens, P, Si, B, charged N other than nitro) gets no estimate: RMG-database's halogen groups belong
 * to a different scheme (Chung et al. 2022) and are not mixed in.
 * Aromaticity is RDKit's (five-membered heteroaromatics included), where RMG's trees use benzene-type rings.
 */
export interface FragmentValue { E: number; S: number; A: number; B: number; L: number }

export interface AbrahamFragment extends FragmentValue {
  /** RMG-database label. */
  label: string;
  smarts: string;
}

const f = (label: string, smarts: string, S: number, B: number, E: number, L: number, A = 0): AbrahamFragment => ({ label, smarts, S, B, E, L, A });

/** Intercepts of the Platts equations (S, B, E, L, A). */
export const PLATTS_INTERCEPT: FragmentValue = { S: 0.277, B: 0.071, E: 0.248, L: 0.13, A: 0.003 };

/** Atom-centred fragments (abraham.py), in matching order. */
export const ATOM_FRAGMENTS: readonly AbrahamFragment[] = [
  // Carbon
  f("Cdd", "[CX2;$(C(=*)=*)]", 0.101, 0, 0.18, 0.624),
  f("Ct", "[CX2;$(C#*)]", 0.034, 0.028, 0.04, 0.332),
  f("Cb-H", "[c;H1]", 0.05, 0.011, 0.068, 0.469),
  f("Cb-noH / Cbf-noH", "[c;H0]", 0.101, 0, 0.18, 0.624),
  f("CdsH2", "[CX3;H2]", -0.085, 0.019, -0.045, 0.244),
  f("CdsH", "[CX3;H1]", 0.05, 0.011, 0.068, 0.469),
  f("Cds-noH", "[CX3;H0]", 0.101, 0, 0.18, 0.624),
  f("CssH3", "[CX4;H3;D1]", -0.075, 0.007, -0.104, 0.321),
  f("CssH2", "[CX4;H2;D2]", 0, 0, 0, 0.499),
  f("CssH", "[CX4;H1;D3]", 0.036, 0.011, 0.089, 0.499),
  f("Css-noH", "[CX4;H0;D4]", 0.071, 0.037, 0.187, 0.443),
  // Nitrogen. The oxygens of nitro and nitrate groups are terminal oxygens (O2d) of their own: with them, the
  // nitro fragments reproduce nitrobenzene's measured S, B and E within 0.03.
  f("NO2-aromatic", "[$([NX3+](=O)[O-]),$([NX3](=O)=O)](~[OX1])(~[OX1])-a", -0.231, -0.525, 0.21, 0.347),
  f("ONO2", "[$([NX3+](=O)[O-]),$([NX3](=O)=O)](~[OX1])(~[OX1])-[OX2]", -0.476, -0.204, 0, 0),
  f("NO2", "[$([NX3+](=O)[O-]),$([NX3](=O)=O)](~[OX1])~[OX1]", 0, -0.476, 0.2, 0.278),
  f("N3sH2-aromatic", "[NX3;H2]-a", 0.383, 0.275, 0.163, 0.949),
  f("N3sH2", "[NX3;H2]", 0.175, 0.481, 0.085, 0.781),
  f("N3sH-pyrrole", "[nX3;H1]", 0.221, 0.316, -0.03, 1.25, 0.371),
  f("N3sH-aromatic", "[NX3;H1](-a)-a", 0.311, 0.415, 0.192, 0.912),
  f("N3sH", "[NX3;H1]", 0.265, 0.541, 0.138, 0.568, 0.087),
  f("N3s-noH-pyrrole", "[nX3;H0;+0]", 0.265, 0.392, 0.083, 0.794),
  f("N3s-noH-aromatic", "[NX3;H0;+0](-a)-a", 0.295, 0.321, 0.346, 0.869),
  f("N3s-noH", "[NX3;H0;+0]", 0.323, 0.653, 0.22, 0.4),
  f("N3t-aromatic", "[NX1]#C-a", 0.39, 0.103, 0, 0.732),
  f("N3t", "[NX1]#*", 0.694, 0.242, 0, 0.757),
  f("N3bpyr", "[nX2;$(n1ccccc1)]", 0.223, 0.321, 0.046, 0.574),
  f("N3b", "[nX2]", 0.254, 0.596, 0.121, -0.24),
  f("N3d", "[NX2]=*", 0.125, 0.2, 0.117, -0.235),
  // Oxygen
  f("OssH", "[OX2;H1]", 0.247, 0.307, 0.061, 0.672),
  f("Oss", "[#8X2;H0]", 0.185, 0.211, 0.014, 0.36),
  f("O2d", "[OX1]", 0.37, 0.334, -0.041, 0.495),
  // Sulfur
  f("S6dd-OdOdOR", "[SX4](=O)(=O)-[OX2]", -0.505, -0.188, 0, 0),
  f("S4d", "[SX3;$(S=O)](-*)-*", 1.065, 0.448, 0.413, 2.196),
  f("S2d", "[SX1]=*", 0.618, 0.071, 0.364, 0.954),
  f("S2s-aromatic", "[sX2]", 0, 0.043, 0.116, 0.848),
  f("S2s", "[SX2]", 0.189, 0.168, 0.33, 1.258),
  f("S", "[#16]", 0.643, 0, 0.465, 0.554),
];

/** Corrections that are not atom-centred (nonacentered.py), in matching order; at most one per centre atom. */
export const CORRECTION_FRAGMENTS: readonly AbrahamFragment[] = [
  f("Lac", "[CX3;r3,r4,r5,r6](=O)@[OX2]", 0.36, -0.214, 0, 0.406),
  f("Oss(CdsOd)", "[CX3;!$(C(=O)(O)[!#6])](=O)-[OX2]-[#6]", -0.225, -0.206, -0.113, -0.39),
  f("Oss(CdsOd)Oss", "[CX3](=O)(-[OX2]-[#6])-[OX2]-[#6]", -0.19, -0.267, 0, 0),
  f("OssH(CdsOd)", "[CX3;!$(C(=O)([OX2H1])[!#6])](=O)-[OX2;H1]", -0.412, -0.308, -0.192, -0.369, 0.243),
  f("Cd(O2d)Cd=CdCd(O2d)", "[CX3](=O)-[#6]=[#6]-[CX3]=O", -0.2055, -0.0255, 0, 0),
  f("Lactam", "[CX3;r4,r5,r6,r7](=O)@[NX3]", -0.1, -0.231, 0.061, 0.583),
  f("NCd(O2d)N", "[CX3](=O)(-[NX3])-[NX3]", -0.553, -0.076, -0.11, 0),
  f("OsCd(O2d)N", "[CX3](=O)(-[OX2])-[NX3]", -0.588, -0.252, 0, 0, -0.105),
  f("Cd(O2d)NCd(O2d)", "[CX3](=O)-[NX3]-[CX3]=O", -0.255, -0.074, 0, 0),
  f("Cd(O2d)N", "[CX3](=O)-[NX3,NX2]", 0.175, -0.287, 0, 0.603),
  f("Cs(OssH)Cs(OssH)", "[CX4](-[OX2H1])-[CX4]-[OX2H1]", 0.026, 0, -0.0215, 0.05),
  f("CbCsOssH", "c-[CX4]-[OX2H1]", 0, 0.131, 0, -0.145),
  f("OssH (A)", "[OX2;H1]-[C,O]", 0, 0, 0, 0, 0.345),
  f("phenol (A)", "[OX2;H1]-c", 0, 0, 0, 0, 0.543),
  f("OxRing", "[#8X2;H0;r3,r4,r5,r6,r7]", 0, 0.12, -0.001, -0.001),
  f("N3sH2-benz (A)", "[NX3;H2]-[c;$(c1ccccc1)]", 0, 0, 0, 0, 0.247),
  f("N3sHCd(O2d)N3sH (A)", "[NX3;!H0]-[CX3](=O)-[NX3;!H0]", 0, 0, 0, 0, -0.0825),
  f("Cd(O2d)NH2 (A)", "[NX3;H2]-[CX3]=O", 0, 0, 0, 0, 0.275),
  f("Cd(O2d)NH-arom (A)", "[NX3;H1](-a)-[CX3]=O", 0, 0, 0, 0, -0.091),
  f("Cd(O2d)NHR (A)", "[NX3;H1]-[CX3]=O", 0, 0, 0, 0, 0.281),
  f("N3sCd(O2d)N3sH (A)", "[NX3;H0]-[CX3](=O)-[NX3;!H0]", 0, 0, 0, 0, -0.119),
  f("CdsNdNsNs (A)", "[CX3](=[NX2;H1])(-[NX3;H2])-[NX3;H2]", 0, 0, 0, 0, 0.17),
  f("SdOdOdN", "[SX4](=O)(=O)-[NX3]", -0.569, -0.446, -0.111, 0, 0.356),
];
