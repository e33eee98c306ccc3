/**
 * Great-circle distance between two pins by the haversine formula. Good to a fraction of a percent
 * over a town's roads' worth of distance, which is all a suggested stop order needs: a driver follows
 * roads, and the order matters more than the kilometres.
 */

export interface LatLng {
  lat: number;
  lng: number;
}

/**
 * Mean Earth radius in km, as in Rosetta Code's haversine task (R = 6371.0 km, which reproduces its
 * worked example Nashville BNA → Los Angeles LAX = 2886.444442837983 km).
 */
export const EARTH_RADIUS_KM = 6371.0;

const rad = (deg: number) => (deg * Math.PI) / 180;

export function haversineKm(a: LatLng, b: LatLng, radiusKm = EARTH_RADIUS_KM): number {
  const dLat = rad(b.lat - a.lat);
  const dLng = rad(b.lng - a.lng);
  const h = Math.sin(dLat / 2) ** 2 + Math.cos(rad(a.lat)) * Math.cos(rad(b.lat)) * Math.sin(dLng / 2) ** 2;
  // atan2 rather than asin: asin(√h) loses precision as h nears 1 (nearly antipodal pins).
  return 2 * radiusKm * Math.atan2(Math.sqrt(h), Math.sqrt(Math.max(0, 1 - h)));
}
