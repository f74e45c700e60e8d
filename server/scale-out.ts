import type { Store } from 'express-rate-limit';
import { RedisStore, type RedisReply } from 'rate-limit-redis';
import type { AppConfig } from './config';
import type { BoardStore } from './boards-live';
import { RedisBoardFanout, type OpenRooms } from './boards-live/fanout-redis';
import { relayAppEvents } from './services/events-relay';
import type { AppEvents } from './services/events';

/**
 * What REDIS_URL turns on (docs/decisions/006-several-servers.md): the board fan-out, the app events
 * that close sockets relayed to every server, and rate-limit counters shared by every server. Absent
 * without REDIS_URL: a single server works as before.
 */
export interface ScaleOut {
  fanout: RedisBoardFanout;
  /** A rate-limit store in Redis; `name` keeps each limiter's counters apart. */
  rateLimitStore(name: string): Store;
  /** Whether Redis answers (the ready route). */
  ping(): Promise<boolean>;
  close(): Promise<void>;
}

/** Connects to Redis (failing the start when it does not answer within `timeoutMs`). */
export async function openScaleOut(config: AppConfig, events: AppEvents, timeoutMs = 10_000): Promise<ScaleOut | undefined> {
  if (!config.redisUrl) return undefined;
  const fanout = new RedisBoardFanout(config.redisUrl, { logErrors: config.logErrors });
  let stopRelay: () => void = () => undefined;
  try {
    let timer: ReturnType<typeof setTimeout> | undefined;
    const timeout = new Promise<never>((_, reject) => {
      timer = setTimeout(() => reject(new Error(`REDIS_URL: no answer from Redis within ${timeoutMs / 1000} s`)), timeoutMs);
    });
    await Promise.race([fanout.ready(), timeout]).finally(() => clearTimeout(timer));
    stopRelay = await relayAppEvents(events, fanout);
  } catch (err) {
    await fanout.close().catch(() => undefined);
    throw err;
  }
  const sendCommand = (...args: string[]) => fanout.pub.call(args[0], ...args.slice(1)) as Promise<RedisReply>;
  return {
    fanout,
    rateLimitStore: (name) => new RedisStore({ sendCommand, prefix: `gatefold:rl:${name}:` }),
    async ping() {
      try {
        return (await fanout.pub.ping()) === 'PONG';
      } catch {
        return false;
      }
    },
    async close() {
      stopRelay();
      await fanout.close();
    },
  };
}

/** The store rooms write through: the database's, wrapped by the fan-out when there is one. */
export function boardStoreFor(store: BoardStore, scaleOut: ScaleOut | undefined): BoardStore {
  return scaleOut ? scaleOut.fanout.wrapStore(store) : store;
}

/** After the registry exists: the fan-out reaches its rooms. */
export function attachRooms(scaleOut: ScaleOut | undefined, rooms: OpenRooms): void {
  scaleOut?.fanout.attach(rooms);
}
