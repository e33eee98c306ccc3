import { describe, expect, it } from 'vitest';
import { loadConfig } from '../../server/config/env';

describe('configuration', () => {
  it('has an embedded default for every setting', () => {
    const c = loadConfig({});
    expect(c).toMatchObject({
      port: 3000,
      host: '127.0.0.1',
      databasePath: 'data/kindloop.sqlite',
      uploadDir: 'data/uploads',
      exportDir: 'exports',
      smtpUrl: undefined,
      seedDemo: true,
      cookieSecure: false,
      publicUrl: 'http://127.0.0.1:3000',
    });
  });
  it('marks cookies Secure in production', () => {
    expect(loadConfig({ NODE_ENV: 'production' }).cookieSecure).toBe(true);
  });
  it('refuses a bad value with a message naming it', () => {
    expect(() => loadConfig({ PORT: 'seventy' })).toThrow(/PORT/);
    expect(() => loadConfig({ SESSION_SECRET: 'short' })).toThrow(/SESSION_SECRET/);
  });
  it('reads booleans the way people write them', () => {
    expect(loadConfig({ SEED_DEMO: 'no' }).seedDemo).toBe(false);
    expect(loadConfig({ SEED_DEMO: '1' }).seedDemo).toBe(true);
  });
  it('draws the demo basemap unless a tile server is set, and a tile server needs its attribution', () => {
    expect(loadConfig({}).tiles).toBeNull();
    const url = 'https://tiles.example.org/{z}/{x}/{y}.png';
    expect(loadConfig({ TILE_URL: url, TILE_ATTRIBUTION: 'Map data: Example Tiles' }).tiles).toEqual({ url, attribution: 'Map data: Example Tiles' });
    expect(() => loadConfig({ TILE_URL: url })).toThrow(/TILE_ATTRIBUTION/);
    expect(() => loadConfig({ TILE_URL: 'https://tiles.example.org/tile.png', TILE_ATTRIBUTION: 'x' })).toThrow(/TILE_URL/);
  });
});
