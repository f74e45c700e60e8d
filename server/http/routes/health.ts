import { Router } from 'express';
import type { HealthResponse } from '../../../shared/api';

/** What the ready route asks: each part answers whether it works now. */
export interface ReadinessProbes {
  /** `sqlite` or `postgres` */
  database: { dialect: string; ping(): Promise<boolean> };
  /** absent without REDIS_URL */
  redis?: { ping(): Promise<boolean> };
  /** true once SIGTERM started the drain: the load balancer stops sending new clients here */
  draining(): boolean;
}

/** Answers false when `p` does not settle within `ms` (a hung connection is not ready). */
async function within(p: Promise<boolean>, ms: number): Promise<boolean> {
  let timer: ReturnType<typeof setTimeout> | undefined;
  const late = new Promise<boolean>((resolve) => (timer = setTimeout(() => resolve(false), ms)));
  try {
    return await Promise.race([p.catch(() => false), late]);
  } finally {
    clearTimeout(timer);
  }
}

/**
 * `GET /api/health`: the process answers (liveness; the contract's shape). `GET /api/ready`: 200 when the database (and Redis, when configured)
 * answer and the server is not draining, else 503 with the same body: what a load balancer checks.
 */
export function healthRouter(version: string, probes?: ReadinessProbes): Router {
  const r = Router();
  r.get('/health', (_req, res) => {
    const body: HealthResponse = { ok: true, version };
    res.json(body);
  });
  r.get('/ready', async (_req, res) => {
    const [database, redis] = await Promise.all([
      probes ? within(probes.database.ping(), 2000) : Promise.resolve(true),
      probes?.redis ? within(probes.redis.ping(), 2000) : Promise.resolve(null),
    ]);
    const draining = probes?.draining() ?? false;
    const ok = database && redis !== false && !draining;
    res.status(ok ? 200 : 503).json({
      ok, version, draining,
      database: { ok: database, dialect: probes?.database.dialect ?? 'sqlite' },
      redis: redis === null ? null : { ok: redis },
    });
  });
  return r;
}
