import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MAX_IMPORT_BYTES } from '../../server/http/routes/board-file';
import { contractHalfAdder } from '../helpers/boards';
import { startTestServer, type TestServer } from '../helpers/test-app';
import { cookieOf, rawRequest } from './raw-http';

// Hand-made multipart/form-data bodies (RFC 7578 over the RFC 2046 §5.1 boundary syntax), sent byte for
// byte over node:http so nothing corrects them on the way.
const B = 'gatefoldBoundary7MA4YWxk';
const board = JSON.stringify(contractHalfAdder());
const part = (headers: string[], body: string) => `--${B}\r\n${headers.join('\r\n')}\r\n\r\n${body}\r\n`;
const fileHeaders = (name = 'half-adder.gatefold.json', field = 'file') => [
  `Content-Disposition: form-data; name="${field}"; filename="${name}"`,
  'Content-Type: application/json',
];
const end = `--${B}--\r\n`;

interface Case { name: string; contentType: string; body: string | Buffer; status: number; code: string }

const cases: Case[] = [
  { name: 'a well-formed upload (control)', contentType: `multipart/form-data; boundary=${B}`, body: part(fileHeaders(), board) + end, status: 201, code: '' },
  // a raw NUL byte makes the part header malformed (RFC 7230 field values have no control characters)
  { name: 'a NUL in the file name', contentType: `multipart/form-data; boundary=${B}`, body: part(fileHeaders('half\u0000adder.gatefold.json'), board) + end, status: 400, code: 'bad_upload' },
  // percent-encoded (RFC 5987 filename*) it is a well-formed header; the name is never used, the board is imported
  {
    name: 'a percent-encoded NUL in filename*', contentType: `multipart/form-data; boundary=${B}`, status: 201, code: '',
    body: part(['Content-Disposition: form-data; name="file"; filename*=UTF-8\'\'half%00adder.json', 'Content-Type: application/json'], board) + end,
  },
  { name: 'a truncated body (no closing boundary)', contentType: `multipart/form-data; boundary=${B}`, body: part(fileHeaders(), board).slice(0, 200), status: 400, code: 'bad_upload' },
  { name: 'a wrong boundary', contentType: 'multipart/form-data; boundary=somethingElse', body: part(fileHeaders(), board) + end, status: 400, code: 'bad_upload' },
  { name: 'a missing boundary', contentType: 'multipart/form-data', body: part(fileHeaders(), board) + end, status: 400, code: 'bad_upload' },
  { name: 'a garbage part header', contentType: `multipart/form-data; boundary=${B}`, body: part(['\u0001\u0002 not a header at all'], board) + end, status: 400, code: 'bad_upload' },
  { name: 'no file, only a text field', contentType: `multipart/form-data; boundary=${B}`, body: part(['Content-Disposition: form-data; name="title"'], 'Half adder') + end, status: 400, code: 'invalid_input' },
  { name: 'two files', contentType: `multipart/form-data; boundary=${B}`, body: part(fileHeaders(), board) + part(fileHeaders('b.json'), board) + end, status: 400, code: 'invalid_input' },
  { name: 'the file in another field', contentType: `multipart/form-data; boundary=${B}`, body: part(fileHeaders('a.json', 'upload'), board) + end, status: 400, code: 'invalid_input' },
  { name: 'not multipart at all', contentType: 'text/plain', body: board, status: 400, code: 'invalid_input' },
  { name: 'a file that is not JSON', contentType: `multipart/form-data; boundary=${B}`, body: part(fileHeaders(), '{"format": ') + end, status: 400, code: 'invalid_board' },
  { name: 'a file over the size limit', contentType: `multipart/form-data; boundary=${B}`, body: part(fileHeaders(), ' '.repeat(MAX_IMPORT_BYTES + 1)) + end, status: 413, code: 'too_large' },
];

describe('POST /api/boards/import with broken multipart bodies', () => {
  let s: TestServer;
  let cookie: string;
  beforeAll(async () => {
    s = await startTestServer();
    const res = await rawRequest(s.url, {
      method: 'POST', path: '/api/auth/signup', headers: { 'Content-Type': 'application/json', Origin: s.url },
      body: JSON.stringify({ name: 'Sam Ortiz', email: 'sam@room14.example', password: 'correct horse battery' }),
    });
    expect(res.status).toBe(201);
    cookie = cookieOf(res);
  });
  afterAll(() => s.close());

  it.each(cases)('answers $status $code to $name, never 500', async (c) => {
    const res = await rawRequest(s.url, {
      method: 'POST', path: '/api/boards/import',
      headers: { 'Content-Type': c.contentType, Origin: s.url, Cookie: cookie, 'Content-Length': String(Buffer.byteLength(c.body)) },
      body: c.body,
    });
    expect(res.status, res.text).toBe(c.status);
    const body = res.json as { board?: { title: string }; error?: { code: string; message: string } };
    if (c.status === 201) {
      expect(body.board?.title).toBe('Half adder');
    } else {
      expect(body.error?.code, JSON.stringify(body)).toBe(c.code);
      expect(typeof body.error?.message).toBe('string');
      expect(res.text).not.toMatch(/\bat .*\.ts:\d+/); // no stack trace
    }
    // the server is still up for the next case
    expect((await rawRequest(s.url, { method: 'GET', path: '/api/health' })).status).toBe(200);
  });
});
