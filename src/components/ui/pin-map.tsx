import { Suspense, lazy } from 'react';
import { useQuery } from '@tanstack/react-query';
import { basemapBounds } from '@shared/geo/basemap';
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

/** Where a map with no pins yet looks first: the middle of the demo town. */
export const DEMO_TOWN_CENTRE = { lat: 46.2, lng: -27.4 };

// Leaflet is most of a map page's JavaScript: it loads on its own, after the page's text has painted.
const PinMapCanvas = lazy(() => import('./pin-map-canvas'));

/** Holds the map's place at its final size while leaflet loads, so nothing below it moves. */
function MapPlaceholder() {
  return (
    <div className="flex h-80 w-full items-center justify-center bg-oat-100 text-ink-soft sm:h-[28rem]" role="status">
      Loading the map…
    </div>
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
        <Suspense fallback={<MapPlaceholder />}>
          <PinMapCanvas pins={numbered} fallbackCentre={fallbackCentre} onPick={onPick} onSelect={onSelect} tiles={tiles} town={town} />
        </Suspense>
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
