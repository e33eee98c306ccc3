import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import turfDistance from '@turf/distance';
import { EARTH_RADIUS_KM, haversineKm } from '@shared/routing/distance';

const BNA = { lat: 36.12, lng: -86.67 };
const LAX = { lat: 33.94, lng: -118.4 };

describe('haversine distance', () => {
  it("Rosetta Code's haversine task: Nashville BNA → Los Angeles LAX = 2886.444442837983 km with R = 6371.0 km", () => {
    expect(EARTH_RADIUS_KM).toBe(6371.0);
    expect(haversineKm(BNA, LAX)).toBeCloseTo(2886.444442837983, 6);
  });

  it("Rosetta Code's haversine task: the same pair is 2887.259950607111 km with R = 6372.8 km", () => {
    expect(haversineKm(BNA, LAX, 6372.8)).toBeCloseTo(2887.259950607111, 6);
  });

  it('agrees with @turf/distance (registry library, R = 6371.0088 km) within the ratio of the radii', () => {
    const turfRadius = 6371.0088;
    expect(turfDistance([BNA.lng, BNA.lat], [LAX.lng, LAX.lat], { units: 'kilometers' })).toBeCloseTo(2886.4484, 3);
    const pin = fc.record({ lat: fc.double({ min: -85, max: 85, noNaN: true }), lng: fc.double({ min: -180, max: 180, noNaN: true }) });
    fc.assert(
      fc.property(pin, pin, (a, b) => {
        const turf = turfDistance([a.lng, a.lat], [b.lng, b.lat], { units: 'kilometers' });
        if (Number.isNaN(turf)) {
          // For two points a hair from antipodal, rounding can push @turf/distance's haversine term
          // past 1 and its answer is NaN (found by fast-check: -85°, 0° and 85°, 179.99999°). The
          // distance there is half the circumference, π·R, to within a metre.
          expect(Math.abs(haversineKm(a, b, turfRadius) - Math.PI * turfRadius)).toBeLessThan(1e-3);
          return;
        }
        expect(haversineKm(a, b, turfRadius)).toBeCloseTo(turf, 5);
        expect(Math.abs(haversineKm(a, b) - turf)).toBeLessThanOrEqual(turf * ((turfRadius - EARTH_RADIUS_KM) / EARTH_RADIUS_KM) + 1e-6);
      }),
      // The nearly antipodal pair fast-check once found is always tried first.
      { numRuns: 1000, examples: [[{ lat: -84.99999986513258, lng: 0 }, { lat: 84.99999999999899, lng: 179.9999915480721 }]] },
    );
  });
});
