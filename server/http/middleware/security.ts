import helmet from 'helmet';
import type { IncomingMessage } from 'node:http';
import type { RequestHandler } from 'express';
import type { AppConfig } from '../../config';

/**
 * Security headers. The CSP allows only our own scripts, styles (inline style attributes too: the
 * canvas positions nodes with them), fonts, images from blob:/data: (image export), websockets to
 * this host, and workers from self/blob:. 'wasm-unsafe-eval' lets the analysis panel's Web Worker compile
 * the truth-table kernel it emits as WebAssembly (shared/analysis/wasm-kernel.ts, decision 007); it
 * allows WebAssembly compilation only, not eval() or new Function().
 */
export function securityHeaders(config: AppConfig): RequestHandler {
  const https = config.publicUrl?.startsWith('https:') ?? false;
  const wsSelf = (req: IncomingMessage) => `${https ? 'wss' : 'ws'}://${req.headers.host ?? 'localhost'}`;
  return helmet({
    contentSecurityPolicy: {
      useDefaults: false,
      directives: {
        defaultSrc: ["'self'"],
        scriptSrc: ["'self'", "'wasm-unsafe-eval'"],
        styleSrc: ["'self'", "'unsafe-inline'"],
        fontSrc: ["'self'", 'data:'],
        imgSrc: ["'self'", 'blob:', 'data:'],
        connectSrc: ["'self'", wsSelf],
        workerSrc: ["'self'", 'blob:'],
        objectSrc: ["'none'"],
        baseUri: ["'self'"],
        formAction: ["'self'"],
        frameAncestors: ["'self'"],
        ...(https ? { upgradeInsecureRequests: [] } : {}),
      },
    },
    strictTransportSecurity: https,
  });
}
