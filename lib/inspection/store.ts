// The walk's state on the device: where the driver is, what was recorded, what waits for a
// "yes". A vanilla zustand store, persisted in IndexedDB per inspection so a reload loses nothing.
import { createStore as createIdbStore, del, get, set } from 'idb-keyval';
import { createJSONStorage, persist, type StateStorage } from 'zustand/middleware';
import { createStore } from 'zustand/vanilla';
import type { PendingMatch, StepDraft, WalkZone } from '@/lib/walk';

export type { PendingMatch } from '@/lib/walk';

export type WalkStep = StepDraft & {
  id: string;
  seq: number;
  deviceAt: string;
  /** Set when the server's verdict on this reading differs from the one this phone worked out. */
  phoneVerdict?: { verdict: 'pass' | 'fail' | null; severity: 'minor' | 'major' | null } | null;
};

export type WalkPhoto = { id: string; stepId: string | null; zone: string; takenAt: string };

export type WalkPhase = 'walking' | 'reviewing' | 'signed';

export type WalkState = {
  inspectionId: string;
  zones: WalkZone[];
  zoneIndex: number;
  steps: WalkStep[];
  nextSeq: number;
  pending: PendingMatch | null;
  photos: WalkPhoto[];
  phase: WalkPhase;
  /** The last thing the app read back, shown large. */
  readback: string | null;
  signedName: string | null;
};

export type WalkActions = {
  /** Append a step (id, order and device time are filled in) and return it for sending. */
  record: (s: Omit<WalkStep, 'id' | 'seq' | 'deviceAt'>) => WalkStep;
  /** Merge steps the server already has (another tab, a reinstalled phone), by id. */
  adoptServerSteps: (steps: WalkStep[]) => void;
  moveToZone: (index: number) => void;
  holdForConfirmation: (p: PendingMatch | null) => void;
  declinePending: () => void;
  addPhoto: (p: WalkPhoto) => void;
  setPhase: (phase: WalkPhase, signedName?: string) => void;
  setReadback: (text: string | null) => void;
  /** The server's answer to a step: its verdict is the one of record. */
  adoptServerVerdict: (
    id: string,
    server: {
      verdict: 'pass' | 'fail' | null;
      severity: 'minor' | 'major' | null;
      limit?: string | null;
      source?: string | null;
    },
  ) => void;
};

export type WalkStore = ReturnType<typeof createWalkStore>;

const idbStore = typeof indexedDB === 'undefined' ? null : createIdbStore('rigcall-walks', 'walks');
const idbStorage: StateStorage = {
  getItem: async (name) => (idbStore ? ((await get<string>(name, idbStore)) ?? null) : null),
  setItem: async (name, value) => {
    if (idbStore) await set(name, value, idbStore);
  },
  removeItem: async (name) => {
    if (idbStore) await del(name, idbStore);
  },
};

export function createWalkStore(init: {
  inspectionId: string;
  zones: WalkZone[];
  newId?: () => string;
  now?: () => Date;
  persistOnDevice?: boolean;
}) {
  const newId = init.newId ?? (() => crypto.randomUUID());
  const now = init.now ?? (() => new Date());
  const initial: WalkState = {
    inspectionId: init.inspectionId,
    zones: init.zones,
    zoneIndex: 0,
    steps: [],
    nextSeq: 0,
    pending: null,
    photos: [],
    phase: 'walking',
    readback: null,
    signedName: null,
  };
  const body = (
    setState: (fn: (s: WalkState & WalkActions) => Partial<WalkState>) => void,
    getState: () => WalkState & WalkActions,
  ): WalkState & WalkActions => ({
    ...initial,
    record: (s) => {
      const step: WalkStep = { ...s, id: newId(), seq: getState().nextSeq, deviceAt: now().toISOString() };
      setState((st) => ({ steps: [...st.steps, step], nextSeq: st.nextSeq + 1 }));
      return step;
    },
    adoptServerSteps: (server) =>
      setState((st) => {
        const known = new Set(st.steps.map((x) => x.id));
        const merged = [...st.steps, ...server.filter((x) => !known.has(x.id))].sort((a, b) => a.seq - b.seq);
        return { steps: merged, nextSeq: Math.max(st.nextSeq, ...merged.map((x) => x.seq + 1)) };
      }),
    moveToZone: (index) =>
      setState((st) => ({ zoneIndex: Math.max(0, Math.min(st.zones.length - 1, index)), pending: null })),
    holdForConfirmation: (p) => setState(() => ({ pending: p })),
    declinePending: () => setState((st) => ({ pending: st.pending ? { ...st.pending, declined: true } : null })),
    addPhoto: (p) => setState((st) => ({ photos: [...st.photos, p] })),
    setPhase: (phase, signedName) => setState((st) => ({ phase, signedName: signedName ?? st.signedName })),
    setReadback: (text) => setState(() => ({ readback: text })),
    adoptServerVerdict: (id, server) =>
      setState((st) => ({
        steps: st.steps.map((x) =>
          x.id !== id || x.kind !== 'measurement' || (x.verdict === server.verdict && x.severity === server.severity)
            ? x
            : {
                ...x,
                phoneVerdict: x.phoneVerdict ?? { verdict: x.verdict ?? null, severity: x.severity ?? null },
                verdict: server.verdict,
                severity: server.severity,
                limit: server.limit ?? x.limit ?? null,
                source: server.source ?? x.source ?? null,
              },
        ),
      })),
  });
  const memory = new Map<string, string>();
  const memoryStorage: StateStorage = {
    getItem: (k) => memory.get(k) ?? null,
    setItem: (k, v) => void memory.set(k, v),
    removeItem: (k) => void memory.delete(k),
  };
  return createStore<WalkState & WalkActions>()(
    persist((set, get) => body(set, get), {
      name: `walk-${init.inspectionId}`,
      storage: createJSONStorage(() => (init.persistOnDevice === false ? memoryStorage : idbStorage)),
      // Zones come from the page (the grammar may have been updated); the walk's record persists.
      partialize: (s) => ({
        zoneIndex: s.zoneIndex,
        steps: s.steps,
        nextSeq: s.nextSeq,
        photos: s.photos,
        phase: s.phase,
        signedName: s.signedName,
      }),
    }),
  );
}

/** The request body of a step: what the server records, without the device-only display fields. */
export function toStepBody(s: WalkStep) {
  return {
    id: s.id,
    seq: s.seq,
    zone: s.zone,
    item: s.item,
    kind: s.kind,
    heard: s.heard,
    alternatives: s.alternatives,
    inputMode: s.inputMode,
    termKey: s.termKey,
    position: s.position,
    score: s.score,
    resolution: s.resolution,
    undoesStepId: s.undoesStepId,
    reading: s.reading,
    notCheckedReason: s.notCheckedReason,
    note: s.note,
    deviceAt: s.deviceAt,
  };
}
