/**
 * Physical constants and unit conversions, CODATA 2018 recommended values
 * (Tiesinga et al., Rev. Mod. Phys. 93 (2021) 025010; NIST CODATA 2018 tables).
 * The engine works in atomic units (bohr, hartree); conversion happens only at the edges.
 */
export const HARTREE_EV = 27.211386245988;
export const HARTREE_KJ_PER_MOL = 2625.4996394799;
export const HARTREE_KCAL_PER_MOL = 627.5094740631;
export const HARTREE_WAVENUMBER = 219474.6313632; // cm^-1
export const BOHR_ANGSTROM = 0.529177210903;
export const BOHR_PM = 52.9177210903;
/** proton mass in electron masses */
export const PROTON_MASS_ME = 1836.15267343;
/** unified atomic mass unit (dalton) in electron masses */
export const DALTON_ME = 1822.888486209;
/** fine-structure constant inverse; speed of light in atomic units */
export const SPEED_OF_LIGHT_AU = 137.035999084;
