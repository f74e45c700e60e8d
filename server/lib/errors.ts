/**
 * Errors with a status and a stable snake_case code, thrown by services and routes alike. They carry
 * no Express or HTTP machinery: `server/http/errors.ts` maps them to the contract's error shape.
 */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
  ) {
    super(message);
    this.name = 'HttpError';
  }
}

export const badRequest = (code: string, message: string, fields?: Record<string, string>) =>
  new HttpError(400, code, message, fields);
export const notSignedIn = () => new HttpError(401, 'not_signed_in', 'Sign in first');
export const forbidden = (code: string, message: string) => new HttpError(403, code, message);
export const notFound = (code: string, message: string) => new HttpError(404, code, message);
export const conflict = (code: string, message: string) => new HttpError(409, code, message);
