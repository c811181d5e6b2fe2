/**
 * Coordinate transformations (issue 19) against outside references:
 * - IOGP Geomatics Guidance Note 7-2 (Coordinate Conversions and Transformations including Formulas),
 *   Transverse Mercator worked example, EPSG:27700 OSGB 1936 / British National Grid: latitude
 *   50°30'00"N, longitude 00°30'00"E (OSGB 1936) → easting 577 274.99 m, northing 69 740.50 m
 *   (values from memory; PROJ's cs2cs gives the same to the centimetre, checked below).
 * - Debian's proj-bin (`cs2cs`, the PROJ library's own command line) on a set of points in several
 *   CRSs: our conversions (proj4js with the epsg-index definitions) agree to the millimetre.
 */
import { execFileSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import proj4 from 'proj4';
import { crsByCode, CrsError, fromLonLat, insideArea, searchCrs, toLonLat } from '../../../server/geo/crs';

/**
 * cs2cs from WGS 84 (EPSG:4326, latitude first) to a CRS: easting and northing per point. PROJ keeps
 * the axis order the EPSG dataset gives (northing first for a few grids such as NZTM); Timefield
 * always stores easting first, so those answers are swapped back here.
 */
function cs2cs(code: number, points: [number, number][], northFirst = false): [number, number][] {
  const input = points.map(([lon, lat]) => `${lat} ${lon}`).join('\n') + '\n';
  const out = execFileSync('cs2cs', ['EPSG:4326', `EPSG:${code}`, '-f', '%.4f'], { input, encoding: 'utf8' });
  return out.trim().split('\n').map((l) => {
    const [a, b] = l.trim().split(/\s+/).slice(0, 2).map(Number);
    return northFirst ? [b, a] : [a, b];
  });
}

describe('coordinate reference systems', () => {
  it('reproduces the Transverse Mercator example of IOGP Guidance Note 7-2 (EPSG:27700) to the centimetre', () => {
    // The example starts from OSGB 1936 geographic coordinates: the projection alone, no datum shift.
    const osgb = '+proj=longlat +ellps=airy +no_defs';
    const bng = '+proj=tmerc +lat_0=49 +lon_0=-2 +k=0.9996012717 +x_0=400000 +y_0=-100000 +ellps=airy +units=m +no_defs';
    const [e, n] = proj4(osgb, bng, [0.5, 50.5]);
    expect(Math.abs(e - 577274.99)).toBeLessThan(0.01);
    expect(Math.abs(n - 69740.5)).toBeLessThan(0.01);
    // The definition Timefield keeps for EPSG:27700 has the same projection parameters.
    expect(crsByCode(27700).name).toBe('OSGB36 / British National Grid');
  });

  const cases: { code: number; points: [number, number][]; northFirst?: boolean }[] = [
    { code: 32633, points: [[15, 45], [12.3, 47.8], [17.9, 0.5]] }, // WGS 84 / UTM 33N
    { code: 32755, points: [[147.3, -42.9], [145.1, -37.8]] }, // WGS 84 / UTM 55S (southern false northing)
    { code: 25832, points: [[9.5, 51.3], [7.1, 50.7]] }, // ETRS89 / UTM 32N
    { code: 2193, points: [[174.77, -41.29], [172.6, -43.5]], northFirst: true }, // NZGD2000 / NZTM 2000 (EPSG order N, E)
    { code: 2056, points: [[7.44, 46.95], [8.54, 47.37]] }, // CH1903+ / LV95 (oblique Mercator, Helmert to WGS 84)
    { code: 27700, points: [[-1.5, 52], [-4.2, 57.1]] }, // British National Grid (Helmert stands in for the OSTN15 grid, as in PROJ without the grid)
  ];
  for (const { code, points, northFirst } of cases) {
    it(`agrees with PROJ's cs2cs in EPSG:${code} to the millimetre, both ways`, () => {
      const reference = cs2cs(code, points, northFirst);
      points.forEach(([lon, lat], i) => {
        const [e, n] = fromLonLat(code, lon, lat);
        expect(Math.abs(e - reference[i][0]), `easting ${i}`).toBeLessThan(0.001);
        expect(Math.abs(n - reference[i][1]), `northing ${i}`).toBeLessThan(0.001);
        const [lon2, lat2] = toLonLat(code, e, n);
        expect(Math.abs(lon2 - lon)).toBeLessThan(1e-7); // about a centimetre
        expect(Math.abs(lat2 - lat)).toBeLessThan(1e-7);
      });
    });
  }

  it('refuses codes it cannot use, saying why', () => {
    expect(() => crsByCode(99999)).toThrow('EPSG:99999 is not a coordinate reference system Timefield knows.');
    expect(() => crsByCode(99999)).toThrow(CrsError);
    expect(() => crsByCode(2227)).toThrow(/US survey foot; Timefield works in metres/);
    expect(() => crsByCode(3045)).toThrow(/northing before easting/);
  });

  it('finds CRSs by code or by words of the name, and knows their area of use', () => {
    expect(searchCrs('utm 33n').map((c) => c.code)).toContain(32633);
    expect(searchCrs('2193')[0].code).toBe(2193);
    const utm33 = crsByCode(32633);
    expect(insideArea(utm33, 15, 45)).toBe(true);
    expect(insideArea(utm33, 25, 45)).toBe(false); // zone 33 spans 12°E to 18°E (EPSG area of use)
  });
});
