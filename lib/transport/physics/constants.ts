// CODATA 2018 / SI 2019 exact defining constants (BIPM, SI Brochure 9th ed.).
/** Elementary charge e in C (exact). */
export const ELEMENTARY_CHARGE_C = 1.602176634e-19;
/** Boltzmann constant k_B in J/K (exact). */
export const BOLTZMANN_J_PER_K = 1.380649e-23;
/** Planck constant h in J·s (exact). */
export const PLANCK_J_S = 6.62607015e-34;
/** Avogadro constant N_A in mol⁻¹ (exact). */
export const AVOGADRO_PER_MOL = 6.02214076e23;
/** von Klitzing constant R_K = h/e² in Ω (exact in the SI since 2019; 25 812.807 45… Ω). */
export const VON_KLITZING_OHM = PLANCK_J_S / (ELEMENTARY_CHARGE_C * ELEMENTARY_CHARGE_C);
/** Vacuum permeability μ0 in N/A², CODATA 2018 recommended value (measured, no longer exactly 4π·1e-7). */
export const VACUUM_PERMEABILITY_N_PER_A2 = 1.25663706212e-6;
/** 0 °C in kelvin (exact, definition of the Celsius scale). */
export const ZERO_CELSIUS_K = 273.15;
