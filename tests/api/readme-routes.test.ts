import fs from 'node:fs';
import { describe, expect, it } from 'vitest';
import { makeRouteList } from '../../scripts/route-list';

describe('README API table', () => {
  it('lists exactly the routes the app mounts (regenerate with `npx tsx scripts/print-routes.ts`)', async () => {
    const readme = fs.readFileSync('README.md', 'utf8');
    const documented = [...readme.matchAll(/^\| (GET|POST|PUT|PATCH|DELETE) \| `([^`]+)` \|/gm)].map((m) => `${m[1]} ${m[2]}`);
    const mounted = (await makeRouteList()).map((r) => `${r.method} ${r.path}`);
    expect(documented.sort()).toEqual(mounted.sort());
  });
});
