import http from 'node:http';

export interface RawResponse {
  status: number;
  headers: http.IncomingHttpHeaders;
  text: string;
  /** the body parsed as JSON, or undefined */
  json: unknown;
}

/**
 * One request over node:http with exactly the headers given (a forged Host, a spoofed X-Forwarded-For,
 * a hand-made multipart body), for what supertest and fetch would correct or refuse to send.
 */
export function rawRequest(baseUrl: string, p: { method: string; path: string; headers?: Record<string, string>; body?: string | Buffer }): Promise<RawResponse> {
  const url = new URL(p.path, baseUrl);
  return new Promise((resolve, reject) => {
    const req = http.request(
      { host: url.hostname, port: url.port, method: p.method, path: url.pathname + url.search, headers: p.headers, setHost: !p.headers?.Host },
      (res) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => {
          const text = Buffer.concat(chunks).toString('utf8');
          let json: unknown;
          try {
            json = JSON.parse(text);
          } catch {
            json = undefined;
          }
          resolve({ status: res.statusCode ?? 0, headers: res.headers, text, json });
        });
      },
    );
    req.on('error', reject);
    req.end(p.body);
  });
}

/** The `name=value` pairs of a response's Set-Cookie headers, as a Cookie header. */
export function cookieOf(res: RawResponse): string {
  return (res.headers['set-cookie'] ?? []).map((c) => c.split(';')[0]).join('; ');
}
