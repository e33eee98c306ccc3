import 'leaflet/dist/leaflet.css';
import { useEffect, useMemo, useRef } from 'react';
import { GeoJSON, MapContainer, Marker, TileLayer, Tooltip, useMap, useMapEvents } from 'react-leaflet';
import { divIcon, type LatLngBoundsExpression, type PathOptions } from 'leaflet';
import { THIMBLEFORD_BASEMAP, type BasemapFeature, type BasemapProperties } from '@shared/geo/basemap';
import { cn } from './cn';

import type { MapPin } from './pin-map';

export interface PinMapCanvasProps {
  pins: (MapPin & { n: number })[];
  fallbackCentre: { lat: number; lng: number };
  onPick?: (lat: number, lng: number) => void;
  onSelect?: (id: string | number) => void;
  /** The configured tile server, or null to draw the demo town (when `town`) or a plain background. */
  tiles: { url: string; attribution: string } | null;
  town: boolean;
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
 * The leaflet part of the pin map: tiles or the demo town's basemap, and the numbered pins. Loaded on
 * its own (see pin-map.tsx) so a page's text paints before leaflet arrives.
 */
export default function PinMapCanvas({ pins, fallbackCentre, onPick, onSelect, tiles, town }: PinMapCanvasProps) {
  return (
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
      {pins.map((p) => (
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
  );
}
