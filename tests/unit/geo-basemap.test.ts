import { describe, expect, it } from 'vitest';
import distance from '@turf/distance';
import { THIMBLEFORD_BASEMAP, THIMBLEFORD_CENTRE, basemapBounds, streetNamed, type Position } from '@shared/geo/basemap';
import { RECIPIENTS, SITES } from '../../server/db/seed/recipients';

const places = [...RECIPIENTS, ...SITES].map((p) => ({ name: p.name, address: p.address, ...p.at }));

/** Metres from a point to a street's line, measured on the flat plane of a town this small. */
function metresToLine(at: { lat: number; lng: number }, line: Position[]): number {
  const mPerLat = distance([0, at.lat - 0.5], [0, at.lat + 0.5], { units: 'meters' });
  const mPerLng = distance([at.lng - 0.5, at.lat], [at.lng + 0.5, at.lat], { units: 'meters' });
  const xy = ([lng, lat]: Position) => [(lng - at.lng) * mPerLng, (lat - at.lat) * mPerLat] as const;
  let best = Infinity;
  for (let i = 1; i < line.length; i++) {
    const [ax, ay] = xy(line[i - 1]!);
    const [bx, by] = xy(line[i]!);
    const t = Math.max(0, Math.min(1, -(ax * (bx - ax) + ay * (by - ay)) / ((bx - ax) ** 2 + (by - ay) ** 2)));
    best = Math.min(best, Math.hypot(ax + t * (bx - ax), ay + t * (by - ay)));
  }
  return best;
}

describe("the demo town's basemap (GeoJSON, RFC 7946)", () => {
  it('is a FeatureCollection of named streets, a river, parks and labels with [lng, lat] positions', () => {
    expect(THIMBLEFORD_BASEMAP.type).toBe('FeatureCollection');
    const kinds = new Set(THIMBLEFORD_BASEMAP.features.map((f) => f.properties.kind));
    for (const k of ['street', 'river', 'park', 'label'] as const) expect(kinds).toContain(k);
    for (const f of THIMBLEFORD_BASEMAP.features) {
      expect(f.type).toBe('Feature');
      expect(f.properties.name.length).toBeGreaterThan(0);
      const positions =
        f.geometry.type === 'Point' ? [f.geometry.coordinates] : f.geometry.type === 'LineString' ? f.geometry.coordinates : f.geometry.coordinates.flat();
      for (const [lng, lat] of positions) {
        // Longitude first: the town lies near 27.4° W, 46.2° N.
        expect(Math.abs(lng! - THIMBLEFORD_CENTRE.lng)).toBeLessThan(0.1);
        expect(Math.abs(lat! - THIMBLEFORD_CENTRE.lat)).toBeLessThan(0.1);
      }
      if (f.geometry.type === 'Polygon') {
        for (const ring of f.geometry.coordinates) expect(ring[0]).toEqual(ring.at(-1));
      }
      if (f.geometry.type === 'LineString') expect(f.geometry.coordinates.length).toBeGreaterThanOrEqual(2);
    }
  });

  it('holds every demo pin, each within 60 m of the street its address names', () => {
    const [[south, west], [north, east]] = basemapBounds();
    expect(places.length).toBeGreaterThanOrEqual(9);
    for (const p of places) {
      expect(p.lat, p.name).toBeGreaterThan(south);
      expect(p.lat, p.name).toBeLessThan(north);
      expect(p.lng, p.name).toBeGreaterThan(west);
      expect(p.lng, p.name).toBeLessThan(east);
      const streetName = ['Larkspur Road', 'Millrace Street', 'Tansy Court', 'Fernhollow Lane', 'Kestrel Rise', 'Quill Lane', "Weaver's Yard"].find((s) =>
        p.address.includes(s),
      );
      expect(streetName, `${p.name}: its address names a street of the map`).toBeDefined();
      const street = streetNamed(streetName!);
      expect(street?.geometry.type).toBe('LineString');
      expect(metresToLine(p, street!.geometry.coordinates as Position[]), `${p.name} on ${streetName}`).toBeLessThan(60);
    }
  });
});
