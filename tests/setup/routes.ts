import type { Express } from 'express';

interface Layer {
  route?: { path: string | RegExp; methods: Record<string, boolean> };
  handle?: { stack?: Layer[] };
}

/**
 * Every route the app answers, as "METHOD /path", read from Express's own routing table, so a
 * test can notice a route that nobody has thought about yet.
 */
export function listRoutes(app: Express): string[] {
  const routes: string[] = [];
  const visit = (stack: Layer[]) => {
    for (const layer of stack) {
      if (layer.route) {
        for (const method of Object.keys(layer.route.methods)) {
          if (method === '_all') continue;
          routes.push(`${method.toUpperCase()} ${String(layer.route.path)}`);
        }
      } else if (layer.handle?.stack) {
        visit(layer.handle.stack);
      }
    }
  };
  visit((app as unknown as { router: { stack: Layer[] } }).router.stack);
  return routes;
}
