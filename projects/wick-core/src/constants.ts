/** Standard acceleration of gravity, m/s² (CGPM 1901, exact by definition). */
export const STANDARD_GRAVITY = 9.80665;
/** Molar gas constant, J/(mol·K) (CODATA 2018, exact). */
export const GAS_CONSTANT = 8.314462618;
/** Molar mass of water, kg/mol (IAPWS). */
export const MOLAR_MASS_WATER = 0.01801528;
/** 0 °C in kelvin. */
export const ZERO_CELSIUS = 273.15;
