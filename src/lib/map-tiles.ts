import { queryOptions } from '@tanstack/react-query';
import type { MapTilesResponse } from '@shared/schemas/map';
import { api } from './api-client';

/** Whether the site has a tile server (TILE_URL) and the attribution its tiles require. */
export const mapKeys = { tiles: ['map', 'tiles'] as const };

export const getMapTiles = () => api.get<MapTilesResponse>('/api/map');
export const mapTilesQueryOptions = () => queryOptions({ queryKey: mapKeys.tiles, queryFn: getMapTiles, staleTime: Infinity });
