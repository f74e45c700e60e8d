import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiError, apiRequest } from './api-client';

// A real HTTP server answering in the contract's shapes; the client under test uses Node's fetch.
let server: Server;
let base = '';

beforeAll(async () => {
  server = createServer((req, res) => {
    let body = '';
    req.on('data', (c) => (body += c));
    req.on('end', () => {
      const send = (status: number, json?: unknown, type = 'application/json') => {
        res.writeHead(status, { 'Content-Type': type });
        res.end(json === undefined ? '' : typeof json === 'string' ? json : JSON.stringify(json));
      };
      switch (req.url) {
        case '/api/echo':
          return send(200, { method: req.method, contentType: req.headers['content-type'] ?? null, body: body ? JSON.parse(body) : null });
        case '/api/signup':
          return send(400, { error: { code: 'invalid_input', message: 'Check the marked fields', fields: { email: 'Enter a valid e-mail address', junk: 3 } } });
        case '/api/gone':
          return send(204);
        case '/api/html':
          return send(502, '<html>Bad gateway</html>', 'text/html');
        default:
          return send(404, { error: { code: 'not_found', message: 'No such route' } });
      }
    });
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});

afterAll(() => new Promise<void>((resolve) => server.close(() => resolve())));

describe('apiRequest', () => {
  it('sends JSON and returns the parsed answer', async () => {
    const res = await apiRequest<{ method: string; contentType: string; body: unknown }>('PATCH', `${base}/api/echo`, { title: 'Half adder' });
    expect(res).toEqual({ method: 'PATCH', contentType: 'application/json', body: { title: 'Half adder' } });
  });

  it('sends no body and no content type on GET', async () => {
    const res = await apiRequest<{ contentType: string | null; body: unknown }>('GET', `${base}/api/echo`);
    expect(res.contentType).toBeNull();
    expect(res.body).toBeNull();
  });

  it('resolves undefined for 204', async () => {
    await expect(apiRequest('DELETE', `${base}/api/gone`)).resolves.toBeUndefined();
  });

  it('throws ApiError with status, code, message and the string fields', async () => {
    const err = await apiRequest('POST', `${base}/api/signup`, {}).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(ApiError);
    expect(err).toMatchObject({ status: 400, code: 'invalid_input', message: 'Check the marked fields', fields: { email: 'Enter a valid e-mail address' } });
    expect((err as ApiError).fields).not.toHaveProperty('junk');
  });

  it('names the status when the error body is not JSON', async () => {
    const err = await apiRequest('GET', `${base}/api/html`).catch((e: unknown) => e);
    expect(err).toMatchObject({ status: 502, code: 'http_502' });
    expect((err as ApiError).message).toMatch(/502/);
  });

  it('reports an unreachable server as network_error', async () => {
    const err = await apiRequest('GET', 'http://127.0.0.1:1/api/health').catch((e: unknown) => e);
    expect(err).toMatchObject({ status: 0, code: 'network_error' });
  });
});
