import { describe, expect, it } from 'vitest';
import { ApiError } from './api-client';
import { createQueryClient } from './query-client';

async function runQuery(err: unknown): Promise<{ failures: number; unauthorized: number }> {
  let unauthorized = 0;
  let failures = 0;
  const client = createQueryClient(() => unauthorized++);
  client.setDefaultOptions({ queries: { ...client.getDefaultOptions().queries, retryDelay: 0 } });
  await client
    .fetchQuery({
      queryKey: ['x'],
      queryFn: () => {
        failures++;
        throw err;
      },
    })
    .catch(() => undefined);
  client.clear();
  return { failures, unauthorized };
}

describe('createQueryClient', () => {
  it('does not retry a 4xx answer and reports a lost session once', async () => {
    expect(await runQuery(new ApiError(401, 'not_signed_in', 'Sign in first'))).toEqual({ failures: 1, unauthorized: 1 });
    expect(await runQuery(new ApiError(403, 'forbidden', 'Not a member'))).toEqual({ failures: 1, unauthorized: 0 });
  });

  it('treats a wrong password as a form error, not a lost session', async () => {
    expect(await runQuery(new ApiError(401, 'bad_credentials', 'Wrong e-mail or password'))).toEqual({ failures: 1, unauthorized: 0 });
  });

  it('retries network failures and 5xx twice', async () => {
    expect((await runQuery(new ApiError(0, 'network_error', 'offline'))).failures).toBe(3);
    expect((await runQuery(new ApiError(503, 'unavailable', 'busy'))).failures).toBe(3);
  });
});
