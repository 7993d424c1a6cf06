// What the sync driver takes from the browser (Web Locks, BroadcastChannel, online events,
// storage), injected in tests; what it is given; and the status it shows to the screens.
import type { SyncDb } from "./db";
import type { FetchLike } from "./push";
import type { SyncTiming } from "./timing";

export type LockManagerLike = {
  request(name: string, options: { signal?: AbortSignal }, callback: (lock: unknown) => Promise<unknown>): Promise<unknown>;
};

export type StorageLike = {
  persist?: () => Promise<boolean>;
  persisted?: () => Promise<boolean>;
  estimate?: () => Promise<{ usage?: number; quota?: number }>;
};

export type EventTargetLike = {
  addEventListener(type: string, listener: () => void): void;
  removeEventListener(type: string, listener: () => void): void;
};

export type ChannelLike = {
  postMessage(message: unknown): void;
  close(): void;
  onmessage: ((event: { data: unknown }) => void) | null;
};

/** Everything the driver takes from the browser (injected in tests). */
export type SyncEnv = {
  window?: EventTargetLike;
  document?: EventTargetLike & { visibilityState: string };
  navigator?: { onLine?: boolean; locks?: LockManagerLike; storage?: StorageLike };
  createChannel?: (name: string) => ChannelLike;
  now: () => number;
  random: () => number;
  setTimeout: (fn: () => void, ms: number) => unknown;
  clearTimeout: (handle: unknown) => void;
};

export type DriverStatus = {
  /** This tab runs the loop. */
  leader: boolean;
  /** A cycle is running (in the leading tab, as it broadcasts). */
  syncing: boolean;
  online: boolean;
  /** The last cycle's problem in words (null after a success). */
  lastError: string | null;
  /** The server said 401: the person must sign in again for sync to resume. */
  needsSignIn: boolean;
  /** When the next run is due (ms since epoch), if one is scheduled. */
  nextRunAt: number | null;
  storageWarning: string | null;
  /** Whether the browser granted persistent storage (null: unknown). */
  persisted: boolean | null;
};

export type DriverOptions = {
  db: SyncDb;
  fetch?: FetchLike;
  env?: Partial<SyncEnv>;
  timing?: Partial<SyncTiming>;
  /**
   * Whether this database's user is still the device's current user; checked before each cycle so a
   * tab left open after another person signed in never sends the first person's changes under the
   * second person's session. Default: the device database's current user.
   */
  isCurrentUser?: () => Promise<boolean>;
};

export function browserEnv(): SyncEnv {
  const g = globalThis as typeof globalThis & { window?: Window; document?: Document; navigator?: Navigator };
  return {
    window: typeof window !== "undefined" ? g.window : undefined,
    document: typeof document !== "undefined" ? g.document : undefined,
    navigator: typeof navigator !== "undefined" ? browserNavigator(g.navigator) : undefined,
    createChannel: typeof BroadcastChannel !== "undefined" ? browserChannel : undefined,
    now: () => Date.now(),
    random: () => Math.random(),
    setTimeout: (fn, ms) => globalThis.setTimeout(fn, ms),
    clearTimeout: (handle) => globalThis.clearTimeout(handle as ReturnType<typeof setTimeout>),
  };
}

function browserNavigator(nav: Navigator | undefined): SyncEnv["navigator"] {
  if (!nav) return undefined;
  const locks: LockManagerLike | undefined = nav.locks
    ? { request: (name, options, callback) => nav.locks.request(name, options, callback) }
    : undefined;
  return {
    get onLine() {
      return nav.onLine;
    },
    locks,
    storage: nav.storage,
  };
}

/** A BroadcastChannel seen through the driver's narrow interface (a message's data only). */
function browserChannel(name: string): ChannelLike {
  const channel = new BroadcastChannel(name);
  let handler: ChannelLike["onmessage"] = null;
  return {
    postMessage: (message) => channel.postMessage(message),
    close: () => channel.close(),
    get onmessage() {
      return handler;
    },
    set onmessage(next) {
      handler = next;
      channel.onmessage = next ? (event: MessageEvent) => next({ data: event.data }) : null;
    },
  };
}

/** Adds an event listener; returns its removal. */
export function listen(target: EventTargetLike | undefined, type: string, fn: () => void): () => void {
  if (!target) return () => {};
  target.addEventListener(type, fn);
  return () => target.removeEventListener(type, fn);
}

/**
 * Queues for a Web Lock and holds it for as long as `onGranted` says it still wants it (true), until
 * release(); abort() stops waiting for it.
 */
export function holdLock(locks: LockManagerLike, name: string, onGranted: () => boolean): { abort: () => void; release: () => void } {
  const abort = new AbortController();
  let release = () => {};
  locks
    .request(name, { signal: abort.signal }, () => {
      if (!onGranted()) return Promise.resolve();
      return new Promise<void>((resolve) => {
        release = resolve;
      });
    })
    .catch(() => {
      // Aborted while waiting for the lock (this tab stopped first): nothing to do.
    });
  return { abort: () => abort.abort(), release: () => release() };
}

export function initialStatus(online: boolean): DriverStatus {
  return { leader: false, syncing: false, online, lastError: null, needsSignIn: false, nextRunAt: null, storageWarning: null, persisted: null };
}

/** The driver's status for React (useSyncExternalStore): a new object only when a field changes. */
export class StatusStore {
  private listeners = new Set<() => void>();

  constructor(private status: DriverStatus) {}

  get = (): DriverStatus => this.status;

  subscribe(listener: () => void): () => void {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  }

  set(patch: Partial<DriverStatus>): void {
    const next = { ...this.status, ...patch };
    if ((Object.keys(patch) as (keyof DriverStatus)[]).every((key) => next[key] === this.status[key])) return;
    this.status = next;
    for (const listener of [...this.listeners]) listener();
  }
}
