/**
 * Altitude from barometric pressure by the US Standard Atmosphere 1976, lowest layer (troposphere, up to 11 km
 * geopotential). Heights are geopotential metres, which differ from geometric metres by under 0.1% at rocket
 * altitudes. Pure: no I/O.
 */

/** Sea-level standard pressure, Pa (USSA 1976). */
export const P0_PA = 101_325;
/** Sea-level standard temperature, K. */
export const T0_K = 288.15;
/** Temperature lapse rate in the troposphere, K/m. */
export const LAPSE_K_PER_M = 0.0065;
/** Standard gravity, m/s^2. */
export const G0 = 9.80665;
/** Mean molar mass of air, kg/mol. */
export const MOLAR_MASS_AIR = 0.0289644;
/** Universal gas constant as the 1976 standard fixes it, J/(mol K) (the 2018 CODATA value is 8.314462618). */
export const R_STAR = 8.31432;
/** g0 M / (R* L) = 5.25588, the exponent of the pressure formula; its inverse is 0.190263. */
export const PRESSURE_EXPONENT = (G0 * MOLAR_MASS_AIR) / (R_STAR * LAPSE_K_PER_M);
/** Effective Earth radius used by the standard to relate geopotential and geometric height, m. */
export const EARTH_RADIUS_M = 6_356_766;

/** Geopotential height above standard sea level at which the standard atmosphere has this pressure. */
export function standardAltitudeMetres(pressurePa: number): number {
  return (T0_K / LAPSE_K_PER_M) * (1 - (pressurePa / P0_PA) ** (1 / PRESSURE_EXPONENT));
}

/** Pressure of the standard atmosphere at a geopotential height above standard sea level. */
export function standardPressurePa(altitudeMetres: number): number {
  return P0_PA * (1 - (LAPSE_K_PER_M * altitudeMetres) / T0_K) ** PRESSURE_EXPONENT;
}

/** Height above the pad, m: the standard-atmosphere height of the reading less that of the pad pressure. */
export function altitudeAbovePadMetres(pressurePa: number, padPressurePa: number): number {
  return standardAltitudeMetres(pressurePa) - standardAltitudeMetres(padPressurePa);
}

/** The pressure reading at a height above a pad whose pressure is known (the inverse of altitudeAbovePadMetres). */
export function pressureAbovePadPa(altitudeMetres: number, padPressurePa: number): number {
  return standardPressurePa(standardAltitudeMetres(padPressurePa) + altitudeMetres);
}

/** Geometric height for a geopotential one (USSA 1976: z = r0 H / (r0 - H)). */
export function geometricFromGeopotential(geopotentialMetres: number): number {
  return (EARTH_RADIUS_M * geopotentialMetres) / (EARTH_RADIUS_M - geopotentialMetres);
}

/** Geopotential height for a geometric one (USSA 1976: H = r0 z / (r0 + z)). */
export function geopotentialFromGeometric(geometricMetres: number): number {
  return (EARTH_RADIUS_M * geometricMetres) / (EARTH_RADIUS_M + geometricMetres);
}
