/** GET /api/map: the tile server the maps draw, if the site configured one (TILE_URL). */
export interface MapTilesResponse {
  tiles: { url: string; attribution: string } | null;
}
