import { existsSync } from 'node:fs';
import { resolve } from 'node:path';
import express, { type Router } from 'express';

/**
 * Serves the built client from `distDir` when it holds index.html, with the client-side routing fallback:
 * any GET outside /api and /collab that is not a file gets index.html. Returns undefined when not built.
 */
export function clientRouter(distDir: string): Router | undefined {
  const dir = resolve(distDir);
  const index = resolve(dir, 'index.html');
  if (!existsSync(index)) return undefined;
  const router = express.Router();
  // Vite puts content-hashed files under assets/, so they may be cached for good.
  router.use('/assets', express.static(resolve(dir, 'assets'), { immutable: true, maxAge: '365d', fallthrough: true }));
  router.use(express.static(dir, { index: false, maxAge: 0 }));
  router.get(/^(?!\/(?:api|collab)(?:\/|$)).*/, (_req, res) => {
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(index);
  });
  return router;
}
