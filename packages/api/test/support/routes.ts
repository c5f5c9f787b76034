import type { NestExpressApplication } from '@nestjs/platform-express';

interface Layer {
  route?: { path: string; methods: Record<string, boolean> };
}

/** `GET /api/students/:id`-style keys of every route the Nest app serves under /api. */
export function listApiRoutes(app: NestExpressApplication): string[] {
  const router = (app.getHttpAdapter().getInstance() as { router: { stack: Layer[] } }).router;
  const keys = new Set<string>();
  for (const layer of router.stack) {
    if (!layer.route || !layer.route.path.startsWith('/api')) continue;
    // Nest's catch-all for unmatched /api paths (answers 404) is not a route of ours.
    if (layer.route.path.includes('*')) continue;
    for (const [method, on] of Object.entries(layer.route.methods)) {
      if (on && method !== '_all') keys.add(`${method.toUpperCase()} ${layer.route.path}`);
    }
  }
  return [...keys].sort();
}
