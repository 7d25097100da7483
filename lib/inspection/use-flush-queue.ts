'use client';
import { useCallback, useEffect, useRef, useState } from 'react';
import { deviceQueue } from './device-queue';
import { flushQueue, sendQueued, type QueuedRequest } from './flush-queue';

export type QueueStatus = {
  pending: number;
  failed: QueuedRequest[];
  offline: boolean;
  serverAway: boolean;
  lastError: string | null;
  lastSentAt: number | null;
};

/** Keeps sending the device's outbox: at once, when the network comes back, and every few seconds. */
export function useFlushQueue(): QueueStatus & { flushNow: () => void } {
  const [status, setStatus] = useState<QueueStatus>({
    pending: 0,
    failed: [],
    offline: false,
    serverAway: false,
    lastError: null,
    lastSentAt: null,
  });
  const running = useRef(false);
  const again = useRef(false);

  const flush = useCallback(async () => {
    if (running.current) {
      again.current = true;
      return;
    }
    running.current = true;
    try {
      do {
        again.current = false;
        const out = await flushQueue(deviceQueue, sendQueued);
        const items = await deviceQueue.list();
        setStatus((s) => ({
          pending: items.filter((i) => i.state === 'pending').length,
          failed: items.filter((i) => i.state === 'failed'),
          // No answer while the phone has a network means the server is away, not the signal.
          offline: typeof navigator !== 'undefined' && navigator.onLine === false,
          serverAway: !!out.lastError && (out.offline ? navigator.onLine !== false : true),
          lastError: out.lastError,
          lastSentAt: out.sent > 0 ? Date.now() : s.lastSentAt,
        }));
      } while (again.current);
    } finally {
      running.current = false;
    }
  }, []);

  useEffect(() => {
    void flush();
    const kick = () => void flush();
    window.addEventListener('online', kick);
    window.addEventListener('offline', kick);
    window.addEventListener('rigcall-queue', kick);
    const timer = window.setInterval(kick, 4000);
    return () => {
      window.removeEventListener('online', kick);
      window.removeEventListener('offline', kick);
      window.removeEventListener('rigcall-queue', kick);
      window.clearInterval(timer);
    };
  }, [flush]);

  return { ...status, flushNow: () => void flush() };
}
