import 'leaflet/dist/leaflet.css';
import { useEffect, useRef } from 'react';
import { CircleMarker, MapContainer, Tooltip, useMap, useMapEvents } from 'react-leaflet';
import type { LatLngBoundsExpression } from 'leaflet';
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
    else map.fitBounds(pins.map((p) => [p.lat, p.lng]) as LatLngBoundsExpression, { padding: [32, 32], animate: false });
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

function PickOnClick({ onPick }: { onPick: (lat: number, lng: number) => void }) {
  useMapEvents({ click: (e) => onPick(Math.round(e.latlng.lat * 1e5) / 1e5, Math.round(e.latlng.lng * 1e5) / 1e5) });
  return null;
}

const colours = {
  recipient: { stroke: '#54406a', fill: '#76618a' },
  site: { stroke: '#3f5a2c', fill: '#5f7f45' },
  selected: { stroke: '#8a5a00', fill: '#eab54a' },
};

/**
 * Pins on a plain background. The drive runs offline-first and no tile server is reachable, so
 * the map shows where places are relative to each other, not the streets between them.
 */
export function PinMap({ pins, fallbackCentre, onPick, label, className, onSelect }: PinMapProps) {
  return (
    <div className={cn('overflow-hidden rounded-2xl border-2 border-oat-300', className)} role="group" aria-label={label}>
      <MapContainer
        center={[fallbackCentre.lat, fallbackCentre.lng]}
        zoom={14}
        className={cn('h-72 w-full', onPick && 'cursor-crosshair')}
        style={{
          backgroundColor: '#eef3ea',
          backgroundImage: 'linear-gradient(#dfe7d8 1px, transparent 1px), linear-gradient(90deg, #dfe7d8 1px, transparent 1px)',
          backgroundSize: '48px 48px',
        }}
        attributionControl={false}
        scrollWheelZoom={false}
      >
        <FitToPins pins={pins} fallback={fallbackCentre} />
        {onPick && <PickOnClick onPick={onPick} />}
        {pins.map((p) => {
          const c = p.selected ? colours.selected : colours[p.kind ?? 'recipient'];
          return (
            <CircleMarker
              // A tooltip's permanence is fixed when it mounts, so a newly selected pin mounts anew.
              key={`${p.id}:${p.selected ? 'on' : 'off'}`}
              center={[p.lat, p.lng]}
              radius={p.selected ? 11 : 8}
              pathOptions={{ color: c.stroke, fillColor: c.fill, fillOpacity: 0.9, weight: 3 }}
              eventHandlers={onSelect ? { click: () => onSelect(p.id) } : undefined}
            >
              <Tooltip direction="top" offset={[0, -8]} permanent={p.selected}>
                {p.label}
              </Tooltip>
            </CircleMarker>
          );
        })}
      </MapContainer>
    </div>
  );
}
