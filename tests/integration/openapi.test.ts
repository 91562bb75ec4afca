// The route list is the API: every route file under app/api serves exactly the methods the list
// gives for its path, and the OpenAPI document describes each of them.
import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { ROUTES } from '@/lib/api/routes';
import { baseUrl } from '../support/http';

const apiDir = path.resolve(__dirname, '../../app/api');
// next-auth's own handler and the document itself are the two routes outside the list.
const OUTSIDE_THE_LIST = new Set(['/api/auth/{...nextauth}', '/api/openapi.json']);

function routeFiles(dir: string): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((e) =>
    e.isDirectory() ? routeFiles(path.join(dir, e.name)) : e.name === 'route.ts' ? [path.join(dir, e.name)] : []);
}

describe('route list', () => {
  it('matches the route files, method by method', () => {
    const served = new Set<string>();
    for (const file of routeFiles(apiDir)) {
      const urlPath = '/api/' + path.relative(apiDir, path.dirname(file)).split(path.sep).map((s) => s.replace(/^\[(.+)\]$/, '{$1}')).join('/');
      if (OUTSIDE_THE_LIST.has(urlPath)) continue;
      const source = fs.readFileSync(file, 'utf8');
      for (const [, method, name] of source.matchAll(/export const (GET|POST|PATCH|PUT|DELETE) = apiRoute\(ROUTES\.(\w+)/g)) {
        const spec = ROUTES[name as keyof typeof ROUTES];
        expect(spec, `${file} uses unknown route ${name}`).toBeDefined();
        expect([spec.method, spec.path]).toEqual([method, urlPath]);
        served.add(name);
      }
      expect(source, `${file} exports a handler that bypasses apiRoute`).not.toMatch(/export (async )?function (GET|POST|PATCH|PUT|DELETE)/);
    }
    expect([...served].sort()).toEqual(Object.keys(ROUTES).sort());
  });

  it('is published as an OpenAPI document with every operation', async () => {
    const res = await fetch(`${baseUrl()}/api/openapi.json`);
    const doc = await res.json();
    expect(doc.openapi).toBe('3.1.0');
    const operations = Object.values(doc.paths as Record<string, Record<string, { operationId: string }>>).flatMap((p) => Object.values(p).map((o) => o.operationId));
    expect(operations.sort()).toEqual(Object.keys(ROUTES).sort());
    const createTrap = doc.paths['/api/sites/{siteId}/traps'].post;
    expect(createTrap.requestBody.content['application/json'].schema.required).toEqual(expect.arrayContaining(['tag', 'trapType', 'pressureBarg']));
  });
});
