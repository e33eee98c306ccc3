import 'leaflet/dist/leaflet.css';
import { useEffect, useMemo, useRef } from 'react';
import { GeoJSON, MapContainer, Marker, TileLayer, Tooltip, useMap, useMapEvents } from 'react-leaflet';
import { divIcon, type LatLngBoundsExpression, type PathOptions } from 'leaflet';
import { useQuery } from '@tanstack/react-query';
import { THIMBLEFORD_BASEMAP, basemapBounds, type BasemapFeature, type BasemapProperties } from '@shared/geo/basemap';
import { mapTilesQueryOptions } from '@/lib/map-tiles';
import { cn } from './cn';

export interface MapPin {
  id: string | number;
  lat: number;
  lng: number;
  label: string;
  /** Drawn larger and in the accent colour. */
  selected?: boolean;
  kind?: 'recipient' | 'site';
}

interface PinMapProps {
  pins: MapPin[];
  /** Where to look when there are no pins yet. */
  fallbackCentre: { lat: number; lng: number };
  /** When given, a click on the map places the pin there (for editors). */
  onPick?: (lat: number, lng: number) => void;
  label: string;
  className?: string;
  /** When given, a click on a pin chooses it (the booking page picks a site this way). */
  onSelect?: (id: string | number) => void;
}

function FitToPins({ pins, fallback }: { pins: MapPin[]; fallback: { lat: number; lng: number } }) {
  const map = useMap();
  const key = pins.map((p) => `${p.lat},${p.lng}`).join(';');
  const fit = useRef<() => void>(() => {});
  fit.current = () => {
    if (pins.length === 0) map.setView([fallback.lat, fallback.lng], 14, { animate: false });
    else if (pins.length === 1) map.setView([pins[0]!.lat, pins[0]!.lng], 15, { animate: false });
    else map.fitBounds(pins.map((p) => [p.lat, p.lng]) as LatLngBoundsExpression, { padding: [40, 40], maxZoom: 16, animate: false });
  };
  useEffect(() => {
    fit.current();
  }, [key, map]);
  useEffect(() => {
    // The stylesheet arrives with the page chunk, sometimes after the map measured its box:
    // measure again and re-fit whenever the box changes size.
    const observer = new ResizeObserver(() => {
      map.invalidateSize({ animate: false });
      fit.current();
    });
    observer.observe(map.getContainer());
    return () => observer.disconnect();
  }, [map]);
  return null;
}

/** Street names crowd the town when it is drawn small: write them only from zoom 15 in. */
function StreetNamesByZoom() {
  const map = useMap();
  useEffect(() => {
    const apply = () => map.getContainer().classList.toggle('kl-map-far', map.getZoom() < 15);
    apply();
    map.on('zoomend', apply);
    return () => {
      map.off('zoomend', apply);
    };
  }, [map]);
  return null;
}

function PickOnClick({ onPick }: { onPick: (lat: number, lng: number) => void }) {
  useMapEvents({ click: (e) => onPick(Math.round(e.latlng.lat * 1e5) / 1e5, Math.round(e.latlng.lng * 1e5) / 1e5) });
  return null;
}

/* The town drawn in the yarn palette: oat land, moss parks, sky water, white streets. */
function basemapStyle(p: BasemapProperties | undefined): PathOptions {
  switch (p?.kind) {
    case 'land':
      return { stroke: false, fillColor: '#f5efe3', fillOpacity: 1 };
    case 'park':
      return { color: '#5f7f45', weight: 1, opacity: 0.5, fillColor: '#cfe0bd', fillOpacity: 1 };
    case 'grounds':
      return { color: '#b5a3c4', weight: 1, dashArray: '4 3', fillColor: '#ebe1cd', fillOpacity: 1 };
    case 'river':
      return { color: '#8fb4d0', weight: 9, opacity: 1, lineCap: 'round', lineJoin: 'round' };
    case 'street':
      return { color: '#ffffff', weight: p.rank === 'main' ? 7 : 5, opacity: 1, lineCap: 'round', lineJoin: 'round' };
    default:
      return {};
  }
}

/**
 * A street's label goes at the middle of its longest stretch: pins sit on the corners of the
 * drawn streets (the addresses), so a label there would hide under them.
 */
function labelPoint(f: BasemapFeature): [number, number] | null {
  const g = f.geometry;
  if (g.type === 'Point') return [g.coordinates[1], g.coordinates[0]];
  if (g.type === 'LineString') {
    let best: [number, number] | null = null;
    let longest = -1;
    for (let i = 1; i < g.coordinates.length; i++) {
      const [aLng, aLat] = g.coordinates[i - 1]!;
      const [bLng, bLat] = g.coordinates[i]!;
      const length = Math.hypot(bLng - aLng, bLat - aLat);
      if (length > longest) {
        longest = length;
        best = [(aLat + bLat) / 2, (aLng + bLng) / 2];
      }
    }
    return best;
  }
  return null;
}

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

function Basemap() {
  const shapes = useMemo(
    () => ({ type: 'FeatureCollection' as const, features: THIMBLEFORD_BASEMAP.features.filter((f) => f.properties.kind !== 'label') }),
    [],
  );
  const labels = useMemo(
    () =>
      THIMBLEFORD_BASEMAP.features
        .filter((f) => f.properties.kind === 'label' || f.properties.kind === 'street')
        .map((f) => ({ f, at: labelPoint(f) }))
        .filter((x): x is { f: BasemapFeature; at: [number, number] } => x.at !== null),
    [],
  );
  return (
    <>
      {/* Shapes sit in the tile pane so every pin and label draws above them. */}
      <GeoJSON data={shapes as GeoJSON.FeatureCollection} style={(f) => basemapStyle(f?.properties as BasemapProperties)} interactive={false} pane="tilePane" />
      {labels.map(({ f, at }) => (
        <Marker
          key={`${f.properties.kind}-${f.properties.name}`}
          position={at}
          interactive={false}
          keyboard={false}
          pane="overlayPane"
          icon={divIcon({
            className: cn('kl-map-label', f.properties.kind === 'street' ? 'kl-map-label-street' : `kl-map-label-${f.properties.size ?? 'park'}`),
            html: `<span>${escapeHtml(f.properties.name)}</span>`,
            iconSize: [0, 0],
          })}
        />
      ))}
    </>
  );
}

/**
 * Pins on a map of the town. Where a tile server is configured (TILE_URL), its tiles and their
 * attribution are drawn; otherwise the demo town's own basemap (shared/geo), which needs no network.
 * Every pin carries its number, its name on hover or focus, and the list under the map names them all.
 */
export function PinMap({ pins, fallbackCentre, onPick, label, className, onSelect }: PinMapProps) {
  const { data } = useQuery(mapTilesQueryOptions());
  const tiles = data?.tiles ?? null;
  // The demo town is drawn only under pins that are in it: a drive elsewhere with no tile server
  // gets a plain background rather than streets that are not there.
  const [[south, west], [north, east]] = basemapBounds();
  const inTown = (p: { lat: number; lng: number }) => p.lat >= south && p.lat <= north && p.lng >= west && p.lng <= east;
  const town = !tiles && (pins.length === 0 ? inTown(fallbackCentre) : pins.every(inTown));
  const numbered = pins.map((p, i) => ({ ...p, n: i + 1 }));
  return (
    <figure className={cn('space-y-2', className)}>
      <div className="overflow-hidden rounded-2xl border-2 border-oat-300" role="group" aria-label={label}>
        <MapContainer
          center={[fallbackCentre.lat, fallbackCentre.lng]}
          zoom={14}
          className={cn('h-80 w-full sm:h-[28rem]', onPick && 'cursor-crosshair')}
          style={{ backgroundColor: town ? '#dfeaf2' : '#eef3ea' }}
          attributionControl={!!tiles}
          scrollWheelZoom={false}
        >
          {tiles ? <TileLayer url={tiles.url} attribution={tiles.attribution} /> : town && <Basemap />}
          <StreetNamesByZoom />
          <FitToPins pins={pins} fallback={fallbackCentre} />
          {onPick && <PickOnClick onPick={onPick} />}
          {numbered.map((p) => (
            // Pins are labels, not buttons, unless the map selects by pin: two places in one building
            // would otherwise be two targets on top of each other (WCAG 2.5.8). The name shows on
            // hover and in the list below.
            <Marker
              // A tooltip's permanence is fixed when it mounts, so a newly selected pin mounts anew.
              key={`${p.id}:${p.selected ? 'on' : 'off'}`}
              position={[p.lat, p.lng]}
              // Only a map that selects by pin makes its pins buttons; elsewhere they are labels.
              interactive={!!onSelect}
              keyboard={!!onSelect}
              eventHandlers={onSelect ? { click: () => onSelect(p.id) } : undefined}
              title={onSelect ? p.label : undefined}
              alt={`${p.n}: ${p.label}`}
              zIndexOffset={p.selected ? 1000 : 0}
              icon={divIcon({
                className: cn('kl-pin', `kl-pin-${p.selected ? 'selected' : (p.kind ?? 'recipient')}`),
                html: `<span data-testid="map-pin" data-label="${escapeHtml(p.label)}" title="${escapeHtml(`${p.n}: ${p.label}`)}">${p.n}</span>`,
                iconSize: p.selected ? [34, 34] : [28, 28],
                iconAnchor: p.selected ? [17, 17] : [14, 14],
              })}
            >
              {p.selected && (
                <Tooltip direction="top" offset={[0, -14]} permanent>
                  {p.label}
                </Tooltip>
              )}
            </Marker>
          ))}
        </MapContainer>
      </div>
      {numbered.length > 0 && (
        <figcaption>
          <ol className="flex flex-wrap gap-x-5 gap-y-1 text-base" data-testid="map-legend">
            {numbered.map((p) => (
              <li key={p.id} className="flex items-center gap-2">
                <span className={cn('kl-pin-key', `kl-pin-${p.selected ? 'selected' : (p.kind ?? 'recipient')}`)} aria-hidden>
                  {p.n}
                </span>
                <span>
                  <span className="sr-only">Pin {p.n}: </span>
                  {p.label}
                </span>
              </li>
            ))}
          </ol>
          {town && <p className="mt-1 text-sm text-ink-soft">Map of the demo town of Thimbleford, drawn for Kindloop.</p>}
        </figcaption>
      )}
    </figure>
  );
}
