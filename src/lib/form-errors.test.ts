import { describe, expect, it } from 'vitest';
import { ApiError } from './api-client';
import { applyServerErrors } from './form-errors';

type Form = { email: string; password: string };

function recorder() {
  const calls: Array<[string, { type?: string; message?: string }]> = [];
  const setError = (name: string, error: { type?: string; message?: string }) => void calls.push([name, error]);
  return { calls, setError };
}

describe('applyServerErrors', () => {
  it('puts each known field message on its field', () => {
    const { calls, setError } = recorder();
    const err = new ApiError(409, 'email_taken', 'That e-mail is taken', { email: 'An account with this e-mail exists' });
    expect(applyServerErrors<Form>(err, setError, ['email', 'password'])).toBe(true);
    expect(calls).toEqual([['email', { type: 'server', message: 'An account with this e-mail exists' }]]);
  });

  it('sends a message without a matching field to root.server', () => {
    const { calls, setError } = recorder();
    const err = new ApiError(401, 'bad_credentials', 'Wrong e-mail or password');
    expect(applyServerErrors<Form>(err, setError, ['email', 'password'])).toBe(true);
    expect(calls).toEqual([['root.server', { type: 'server', message: 'Wrong e-mail or password' }]]);
  });

  it('puts a known error code without fields on the field it names', () => {
    const { calls, setError } = recorder();
    const err = new ApiError(409, 'email_taken', 'An account with this e-mail already exists');
    expect(applyServerErrors<Form>(err, setError, ['email', 'password'], { email_taken: 'email' })).toBe(true);
    expect(calls).toEqual([['email', { type: 'server', message: 'An account with this e-mail already exists' }]]);
  });

  it('leaves other errors to the caller', () => {
    const { calls, setError } = recorder();
    expect(applyServerErrors<Form>(new TypeError('boom'), setError, ['email'])).toBe(false);
    expect(calls).toEqual([]);
  });
});
