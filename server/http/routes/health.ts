import { Router } from 'express';
import type { HealthResponse } from '../../../shared/api';

export function healthRouter(version: string): Router {
  const r = Router();
  r.get('/health', (_req, res) => {
    const body: HealthResponse = { ok: true, version };
    res.json(body);
  });
  return r;
}
