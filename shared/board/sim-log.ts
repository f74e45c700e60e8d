/**
 * The room's simulation record: a Y.Array `simlog` in the board document, appended by editors, that
 * every screen replays in order on its own deterministic engine (decision 005). Entries are plain
 * JSON objects; each epoch starts with a `reset` holding every input value at power-on, so a screen
 * replays only from the last reset. The board file never holds it (export and import ignore it).
 */
import * as Y from 'yjs';
import { z } from 'zod';
import { partsMap } from './ydoc';

export const SIMLOG_ROOT = 'simlog';
/** More entries than this are refused by the server (an editor's Reset compacts the record). */
export const MAX_SIMLOG_ENTRIES = 20_000;
/** Most full clock cycles one `cycles` entry may hold. */
export const MAX_CYCLES_PER_ENTRY = 100_000;

const Id = z.string().min(1).max(40);
const PartId = z.string().min(1).max(200);

/** One entry of the record, keyed on `kind`. */
export const SimLogEntrySchema = z.discriminatedUnion('kind', [
  /** power-on again with these input values (switch `on` / button `pressed` by part id) */
  z.object({ id: Id, kind: z.literal('reset'), inputs: z.record(PartId, z.boolean()) }).strict(),
  /** an editor set an input: `was` is its value before (so a late screen knows the value up to here) */
  z.object({ id: Id, kind: z.literal('input'), part: PartId, value: z.boolean(), was: z.boolean() }).strict(),
  /** one clock cycle by hand */
  z.object({ id: Id, kind: z.literal('step') }).strict(),
  /** `n` full cycles of a running clock, appended by the screen that drives it */
  z.object({ id: Id, kind: z.literal('cycles'), n: z.number().int().min(1).max(MAX_CYCLES_PER_ENTRY) }).strict(),
  /** the clock runs at `rate` Hz, driven by the screen whose document client id is `by` */
  z.object({ id: Id, kind: z.literal('run'), rate: z.number().min(0.01).max(10_000), by: z.number().int().nonnegative() }).strict(),
  z.object({ id: Id, kind: z.literal('pause') }).strict(),
  z.object({ id: Id, kind: z.literal('rate'), hz: z.number().min(0.01).max(10_000) }).strict(),
]);
export type SimLogEntry = z.infer<typeof SimLogEntrySchema>;
/** An entry before the record gives it its id. */
export type NewSimLogEntry = SimLogEntry extends infer E ? (E extends SimLogEntry ? Omit<E, 'id'> : never) : never;

/** The document's record (created empty when absent). */
export function simLogArray(doc: Y.Doc): Y.Array<SimLogEntry> {
  return doc.getArray<SimLogEntry>(SIMLOG_ROOT);
}

/** The record as a plain list, in the room's order. */
export function readSimLog(doc: Y.Doc): SimLogEntry[] {
  return simLogArray(doc).toArray();
}

function nextId(doc: Y.Doc, k: number): string {
  // unique in the room: this client's id and its own clock (a client's clock only grows)
  return `${doc.clientID.toString(36)}.${Y.getState(doc.store, doc.clientID).toString(36)}.${k}`;
}

/**
 * Appends entries in one transaction with `origin`. When the record is empty it first gets a `reset`
 * with `inputs` (the board's input values now), so that every screen starts the room's run from the
 * same power-on. A `reset` entry drops everything before it (nothing before a reset is replayed).
 */
export function appendSimLog(doc: Y.Doc, entries: NewSimLogEntry[], origin: unknown, inputs: () => Record<string, boolean>): void {
  const log = simLogArray(doc);
  doc.transact(() => {
    const out: SimLogEntry[] = [];
    const lastReset = entries.map((e) => e.kind).lastIndexOf('reset');
    if (lastReset >= 0) {
      if (log.length) log.delete(0, log.length);
      entries = entries.slice(lastReset);
    } else if (!log.length) out.push({ id: nextId(doc, 0), kind: 'reset', inputs: inputs() });
    entries.forEach((e, i) => out.push({ ...e, id: nextId(doc, i + 1) } as SimLogEntry));
    log.push(out);
  }, origin);
}

/** The document's input values now (switch `on`, button `pressed`), for the record's first `reset`. */
export function inputValuesOf(doc: Y.Doc): Record<string, boolean> {
  const out: Record<string, boolean> = {};
  partsMap(doc).forEach((value, id) => {
    if (!(value instanceof Y.Map)) return;
    const kind = value.get('kind');
    if (kind === 'switch') out[id] = value.get('on') === true;
    else if (kind === 'button') out[id] = value.get('pressed') === true;
  });
  return out;
}

const checked = new WeakSet<object>();

/**
 * Problems of the document's record: an entry that is not one of SimLogEntrySchema's, or too many.
 * Entries already found good are remembered (Yjs hands out the same objects), so an append costs
 * only its new entries.
 */
export function checkSimLog(doc: Y.Doc): string[] {
  let log: Y.Array<SimLogEntry>;
  try {
    log = simLogArray(doc);
  } catch {
    return ['the simulation record is not a list'];
  }
  if (log._map.size > 0) return ['the simulation record holds keyed content'];
  if (log.length > MAX_SIMLOG_ENTRIES) return [`the simulation record holds ${log.length} entries (limit ${MAX_SIMLOG_ENTRIES})`];
  const problems: string[] = [];
  log.forEach((entry, i) => {
    if (typeof entry === 'object' && entry !== null && checked.has(entry)) return;
    const parsed = SimLogEntrySchema.safeParse(entry);
    if (parsed.success) checked.add(entry);
    else if (problems.length < 3) problems.push(`simulation record entry ${i}: ${parsed.error.issues[0]?.message ?? 'not an entry'}`);
  });
  return problems;
}
