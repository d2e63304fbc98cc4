import {
  PRESSURE_EXPONENT,
  altitudeAbovePadMetres,
  geometricFromGeopotential,
  geopotentialFromGeometric,
  pressureAbovePadPa,
  standardAltitudeMetres,
  standardPressurePa,
} from '../../server/flights/flight-log/pressure-altitude';

// US Standard Atmosphere 1976 (NOAA/NASA/USAF, 1976), table I (geopotential altitude) and the pressure at the same
// geometric altitude, as copied into reference-facts: H or z (m), P (Pa).
const BY_GEOPOTENTIAL: [number, number][] = [
  [0, 101_325.0],
  [500, 95_460.8],
  [1000, 89_874.6],
  [1500, 84_556.0],
  [2000, 79_495.2],
  [3000, 70_108.5],
];
const BY_GEOMETRIC: [number, number][] = [
  [0, 101_325.0],
  [500, 95_461.3],
  [1000, 89_876.3],
  [1500, 84_559.7],
  [2000, 79_501.4],
  [3000, 70_121.2],
];

describe('the US Standard Atmosphere 1976 troposphere', () => {
  it('should use the exponent 5.25588 (inverse 0.190263)', () => {
    // USSA 1976: P = P0 (1 - 2.25577e-5 H)^5.25588
    expect(PRESSURE_EXPONENT).toBeCloseTo(5.25588, 4);
    expect(1 / PRESSURE_EXPONENT).toBeCloseTo(0.190263, 5);
  });

  it.each(BY_GEOPOTENTIAL)('should give the table pressure at %d geopotential metres within 1 Pa', (h, p) => {
    expect(Math.abs(standardPressurePa(h) - p)).toBeLessThanOrEqual(1);
  });

  it.each(BY_GEOPOTENTIAL)('should give %d geopotential metres for the table pressure within 0.2 m', (h, p) => {
    expect(Math.abs(standardAltitudeMetres(p) - h)).toBeLessThanOrEqual(0.2);
  });

  it.each(BY_GEOMETRIC)('should give the table pressure at %d geometric metres within 1 Pa', (z, p) => {
    expect(Math.abs(standardPressurePa(geopotentialFromGeometric(z)) - p)).toBeLessThanOrEqual(1);
  });

  it.each(BY_GEOMETRIC)('should give %d geometric metres for the table pressure within 0.2 m', (z, p) => {
    expect(Math.abs(geometricFromGeopotential(standardAltitudeMetres(p)) - z)).toBeLessThanOrEqual(0.2);
  });
});

describe('altitudeAbovePadMetres', () => {
  it('should measure from the pad pressure, not from sea level', () => {
    // A pad at 500 m (95,460.8 Pa) and a reading at 1000 m (89,874.6 Pa): 500 m above the pad (USSA 1976, table I)
    expect(altitudeAbovePadMetres(89_874.6, 95_460.8)).toBeCloseTo(500, 0);
    expect(altitudeAbovePadMetres(95_460.8, 95_460.8)).toBe(0);
  });

  it('should round-trip through pressureAbovePadPa', () => {
    for (const h of [0, 1.5, 250, 1234.5])
      expect(altitudeAbovePadMetres(pressureAbovePadPa(h, 97_000), 97_000)).toBeCloseTo(h, 6);
  });

  it('should give about 8.3 m per hPa near sea level', () => {
    // from memory: the scale height R* T0 / (M g0), about 8,434 m, over 1,013.25 hPa: about 8.3 m per hPa at sea level
    const perHpa = altitudeAbovePadMetres(101_225, 101_325);
    expect(perHpa).toBeGreaterThan(8.2);
    expect(perHpa).toBeLessThan(8.5);
  });
});
