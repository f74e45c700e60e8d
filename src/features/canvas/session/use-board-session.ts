/**
 * The live board of one user: a Y.Doc synced through y-websocket at `/collab/<boardId>`, a per-user
 * undo manager that tracks only this session's own origin (so undo never removes a collaborator's
 * edit), awareness for presence, and the board file derived from the document at most once per frame.
 */
import { useEffect, useMemo, useRef, useState } from 'react';
import * as Y from 'yjs';
import { WebsocketProvider } from 'y-websocket';
import type { BoardFile } from '../../../../shared/board';
import { docToBoard } from '../../../../shared/board';
import { createUndoManager } from './undo';
import { personColor } from '../../../lib/person-color';
import { stabilizeBoard } from '../flow/derive-flow';
import type { PresenceUser } from './awareness';

export type BoardRole = 'owner' | 'editor' | 'viewer';
export type ConnectionStatus = 'connecting' | 'live' | 'reconnecting' | 'offline' | 'refused';

/**
 * Close codes after which reconnecting cannot help (docs/guarantees.md): the server refused what this
 * screen sent, or the session behind it ended. Reconnecting would resend the same refused change in a
 * loop, so the session stops and says why.
 */
const REFUSALS: Record<number, string> = {
  4400: 'The server refused your last change (it would make the board invalid). Reload the board to continue.',
  4401: 'Your session has ended. Sign in again to keep editing.',
  4413: 'The board has reached its size limit; your last change was not kept. Reload the board to continue.',
  4414: 'Too many changes arrived out of order; reload the board to continue.',
  4415: 'Presence data too large; reload the board to continue.',
  4429: 'Too many presence updates from this screen; reload the board to continue.',
};

export interface BoardSession {
  boardId: string;
  doc: Y.Doc;
  provider: WebsocketProvider;
  /** the origin of this session's own edits (the undo manager tracks only it) */
  origin: object;
  role: BoardRole;
  readOnly: boolean;
  status: ConnectionStatus;
  /** why the server stopped this session ('refused' status), in words for the user */
  refusal: string | null;
  synced: boolean;
  /** derived from the doc, updated at most once per animation frame, same object until something changes */
  board: BoardFile;
  user: PresenceUser;
  undo(): void;
  redo(): void;
  canUndo: boolean;
  canRedo: boolean;
}

export interface BoardSessionOptions {
  /** who this is, for presence; read from `/api/auth/me` when left out */
  user?: { id: string | number; name: string };
  /** a share link's token (guests); read from `?share=` of the page when left out */
  shareToken?: string;
}

const EMPTY_BOARD: BoardFile = { format: 'gatefold-board', version: 1, title: '', family: 'ideal', parts: [], wires: [] };

function wsBase(): string {
  return `${location.protocol === 'https:' ? 'wss' : 'ws'}://${location.host}/collab`;
}

interface Live { doc: Y.Doc; provider: WebsocketProvider; undo: Y.UndoManager; origin: object }

/** Teardowns waiting to see whether a session is mounted again (React StrictMode remounts at once). */
const teardowns = new WeakMap<Live, ReturnType<typeof setTimeout>>();

function createLive(boardId: string, shareToken: string | undefined): Live {
  const doc = new Y.Doc();
  const params: Record<string, string> = shareToken ? { share: shareToken } : {};
  const provider = new WebsocketProvider(wsBase(), boardId, doc, { connect: false, params, maxBackoffTime: 4000 });
  // The provider sends every update of the document but what came from the provider itself; Yjs encodes
  // an update for any 'update' listener before calling it. So for a transaction of the provider (the whole
  // board on opening: a second pass over all of it) the provider's listener is off, for all others on.
  // 'afterTransactionCleanup' comes for each transaction just before Yjs looks for 'update' listeners.
  const send = (provider as unknown as { _updateHandler: (update: Uint8Array, origin: unknown) => void })._updateHandler;
  let sending = true;
  doc.on('afterTransactionCleanup', (tr: Y.Transaction) => {
    const want = tr.origin !== provider;
    if (want === sending || typeof send !== 'function') return;
    sending = want;
    if (want) doc.on('update', send);
    else doc.off('update', send);
  });
  const origin = { session: boardId, client: doc.clientID };
  const undo = createUndoManager(doc, origin);
  return { doc, provider, undo, origin };
}

/** Sessions connected before the page mounted (preconnectBoard), by board and share token. */
const early = new Map<string, Live>();
const earlyKey = (boardId: string, shareToken: string | undefined) => `${boardId}|${shareToken ?? ''}`;
/** How long a session connected early waits for its page before it is closed. */
const EARLY_WAIT_MS = 20_000;

/**
 * Opens the socket of the board at `path` (`/boards/<id>`) at once, before the app has rendered, checked
 * the sign-in and asked for the board row: the document then arrives while those run instead of after
 * them. The board's session (useBoardSession) takes it up; if no page does (signed out, a refusal, another
 * page), it is closed. Nothing is shown or sent from it before that.
 */
export function preconnectBoard(path: string, search: string): void {
  const m = /^\/boards\/(\d+)\/?$/.exec(path);
  if (!m || typeof WebSocket === 'undefined') return;
  const shareToken = new URLSearchParams(search).get('share') || undefined;
  const key = earlyKey(m[1], shareToken);
  if (early.has(key)) return;
  const live = createLive(m[1], shareToken);
  early.set(key, live);
  const drop = () => {
    if (early.get(key) !== live || claimed.has(live)) return;
    early.delete(key);
    live.undo.destroy();
    live.provider.destroy();
    live.doc.destroy();
  };
  // refused before a page took it up (e.g. not signed in): the page's own session will say why
  live.provider.on('connection-close', (event: CloseEvent | null) => { if (event && REFUSALS[event.code]) drop(); });
  setTimeout(drop, EARLY_WAIT_MS);
  live.provider.connect();
}

const claimed = new WeakSet<Live>();
/** The session connected early for this board, if any (the same one until it is torn down). */
function takeEarly(boardId: string, shareToken: string | undefined): Live | undefined {
  const live = early.get(earlyKey(boardId, shareToken));
  if (live) claimed.add(live);
  return live;
}

function guestName(): string {
  return new URLSearchParams(location.search).get('name') || 'Guest';
}

/** The live board session of `boardId` for a user of `role`. */
export function useBoardSession(boardId: string, role: BoardRole, options: BoardSessionOptions = {}): BoardSession {
  const shareToken = options.shareToken ?? (new URLSearchParams(location.search).get('share') || undefined);
  const live = useMemo(() => takeEarly(boardId, shareToken) ?? createLive(boardId, shareToken), [boardId, shareToken]);
  // a session connected early may have the board already
  const [board, setBoard] = useState<BoardFile>(() => (live.provider.synced ? docToBoard(live.doc) : EMPTY_BOARD));
  const [status, setStatus] = useState<ConnectionStatus>(() => (live.provider.wsconnected ? 'live' : 'connecting'));
  const [synced, setSynced] = useState(() => live.provider.synced);
  const [refusal, setRefusal] = useState<string | null>(null);
  const [stacks, setStacks] = useState({ canUndo: false, canRedo: false });
  const [me, setMe] = useState<{ id: string | number; name: string } | null>(options.user ?? null);
  const everConnected = useRef(false);

  const user = useMemo<PresenceUser>(() => {
    const id = String(me?.id ?? `guest-${live.doc.clientID}`);
    return { id, name: me?.name ?? guestName(), color: personColor(id) };
  }, [me, live]);

  // Who am I (for presence): the caller may say; otherwise ask the API (a guest gets 401 and stays "Guest").
  useEffect(() => {
    if (options.user) { setMe(options.user); return; }
    let stop = false;
    fetch('/api/auth/me', { credentials: 'same-origin' })
      .then((r) => (r.ok ? r.json() : null))
      .then((body: { user?: { id: number; name: string } } | null) => { if (!stop && body?.user) setMe(body.user); })
      .catch(() => undefined);
    return () => { stop = true; };
  }, [options.user?.id, options.user?.name]);

  useEffect(() => {
    const aw = live.provider.awareness;
    const prev = (aw.getLocalState() ?? {}) as Record<string, unknown>;
    aw.setLocalState({ ...prev, user, cursor: prev.cursor ?? null, selection: prev.selection ?? [] });
  }, [live, user]);

  // Connect on mount; StrictMode's unmount/remount of the same session only disconnects and reconnects,
  // the real teardown waits a moment to see whether the session is mounted again.
  useEffect(() => {
    const { doc, provider, undo } = live;
    let alive = true;
    let raf = 0;
    everConnected.current = false;
    const publish = () => {
      raf = 0;
      if (alive) setBoard((prev) => stabilizeBoard(prev === EMPTY_BOARD ? null : prev, docToBoard(doc)));
    };
    const onUpdate = () => { if (!raf) raf = requestAnimationFrame(publish); };
    // a transaction that changed something (not an 'update' listener: that would have Yjs encode each one)
    const onTransaction = (tr: Y.Transaction) => { if (tr.changed.size > 0 || tr.deleteSet.clients.size > 0) onUpdate(); };
    const onStatus = ({ status: s }: { status: 'connected' | 'disconnected' | 'connecting' }) => {
      if (!provider.shouldConnect) return; // stopped after a refusal: keep saying why
      if (s === 'connected') { everConnected.current = true; setStatus('live'); }
      else if (!navigator.onLine) setStatus('offline');
      else setStatus(everConnected.current ? 'reconnecting' : 'connecting');
    };
    const onClose = (event: CloseEvent | null) => {
      const why = event ? REFUSALS[event.code] : undefined;
      if (!why) return;
      provider.disconnect(); // no automatic reconnect: it would resend what was refused
      setRefusal(event?.reason ? `${why} (${event.reason})` : why);
      setStatus('refused');
    };
    const onSync = (isSynced: boolean) => { setSynced(isSynced); if (isSynced) onUpdate(); };
    const onStacks = () => setStacks({ canUndo: undo.canUndo(), canRedo: undo.canRedo() });
    const onOffline = () => provider.shouldConnect && setStatus('offline');
    const onOnline = () => provider.shouldConnect && setStatus(provider.wsconnected ? 'live' : 'reconnecting');
    doc.on('afterTransaction', onTransaction);
    provider.on('status', onStatus);
    provider.on('sync', onSync);
    provider.on('connection-close', onClose);
    undo.on('stack-item-added', onStacks);
    undo.on('stack-item-popped', onStacks);
    undo.on('stack-cleared', onStacks);
    window.addEventListener('offline', onOffline);
    window.addEventListener('online', onOnline);
    provider.connect();
    // connected (and maybe synced) before this page mounted: the events have passed
    if (provider.wsconnected) { everConnected.current = true; setStatus('live'); }
    if (provider.synced) setSynced(true);
    publish();
    clearTimeout(teardowns.get(live));
    return () => {
      alive = false;
      if (raf) cancelAnimationFrame(raf);
      doc.off('afterTransaction', onTransaction);
      provider.off('status', onStatus);
      provider.off('sync', onSync);
      provider.off('connection-close', onClose);
      undo.off('stack-item-added', onStacks);
      undo.off('stack-item-popped', onStacks);
      undo.off('stack-cleared', onStacks);
      window.removeEventListener('offline', onOffline);
      window.removeEventListener('online', onOnline);
      provider.disconnect();
      teardowns.set(live, setTimeout(() => {
        for (const [key, l] of early) if (l === live) early.delete(key);
        undo.destroy();
        provider.destroy();
        doc.destroy();
      }, 1000));
    };
  }, [live]);

  const readOnly = role === 'viewer';
  return useMemo<BoardSession>(() => ({
    boardId,
    doc: live.doc,
    provider: live.provider,
    origin: live.origin,
    role,
    readOnly,
    status,
    refusal,
    synced,
    board,
    user,
    undo: () => { if (!readOnly) live.undo.undo(); },
    redo: () => { if (!readOnly) live.undo.redo(); },
    canUndo: !readOnly && stacks.canUndo,
    canRedo: !readOnly && stacks.canRedo,
  }), [boardId, live, role, readOnly, status, refusal, synced, board, user, stacks]);
}
