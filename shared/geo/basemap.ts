/**
 * The demo drive's basemap: the fictional town of Thimbleford, drawn for Kindloop as GeoJSON
 * (RFC 7946: [longitude, latitude], WGS 84). It sits in open sea on purpose, so no pin of the
 * demo can ever fall on a real street or building; the map draws it under the pins whenever no
 * tile server is configured.
 */
import thimbleford from './thimbleford.json';

export type BasemapKind = 'land' | 'park' | 'grounds' | 'river' | 'street' | 'label';

export interface BasemapProperties {
  kind: BasemapKind;
  name: string;
  /** Streets: main roads are drawn wider than lanes. */
  rank?: 'main' | 'minor';
  /** Labels: how large to write the name. */
  size?: 'town' | 'water' | 'park';
}

export type Position = [number, number];
export type BasemapGeometry =
  | { type: 'Point'; coordinates: Position }
  | { type: 'LineString'; coordinates: Position[] }
  | { type: 'Polygon'; coordinates: Position[][] };

export interface BasemapFeature {
  type: 'Feature';
  properties: BasemapProperties;
  geometry: BasemapGeometry;
}

export interface Basemap {
  type: 'FeatureCollection';
  features: BasemapFeature[];
}

export const THIMBLEFORD_BASEMAP = thimbleford as Basemap;

/** The middle of the demo town: where a map with no pins yet looks. */
export const THIMBLEFORD_CENTRE = { lat: 46.2, lng: -27.4 } as const;

/** South-west and north-east corners of everything the basemap draws, as [lat, lng]. */
export function basemapBounds(map: Basemap = THIMBLEFORD_BASEMAP): [[number, number], [number, number]] {
  let south = Infinity;
  let west = Infinity;
  let north = -Infinity;
  let east = -Infinity;
  const visit = ([lng, lat]: Position) => {
    south = Math.min(south, lat);
    north = Math.max(north, lat);
    west = Math.min(west, lng);
    east = Math.max(east, lng);
  };
  for (const f of map.features) {
    const g = f.geometry;
    if (g.type === 'Point') visit(g.coordinates);
    else if (g.type === 'LineString') g.coordinates.forEach(visit);
    else g.coordinates.forEach((ring) => ring.forEach(visit));
  }
  return [
    [south, west],
    [north, east],
  ];
}

/** The basemap's street of that name, if it has one. */
export function streetNamed(name: string, map: Basemap = THIMBLEFORD_BASEMAP): BasemapFeature | undefined {
  return map.features.find((f) => f.properties.kind === 'street' && f.properties.name.toLowerCase() === name.toLowerCase());
}
