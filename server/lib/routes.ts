// Lists the API's routes from the router itself (for the authorization matrix and for developers).
import type { Router } from 'express';

interface Layer {
  route?: { path: string; methods: Record<string, boolean> };
  handle?: { stack?: Layer[] };
}

export function listRoutes(router: Router, prefix = '/api'): { method: string; path: string }[] {
  const out: { method: string; path: string }[] = [];
  const walk = (stack: Layer[]) => {
    for (const layer of stack) {
      if (layer.route) {
        for (const [method, on] of Object.entries(layer.route.methods)) {
          if (on && method !== '_all') out.push({ method: method.toUpperCase(), path: prefix + layer.route.path });
        }
      } else if (layer.handle?.stack) {
        // Module routers are mounted without a path of their own.
        walk(layer.handle.stack);
      }
    }
  };
  walk((router as unknown as { stack: Layer[] }).stack);
  return out;
}
