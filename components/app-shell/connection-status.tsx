'use client';

import { useEffect, useState } from 'react';
import { deviceQueue } from '@/lib/inspection/device-queue';
import { keepDriverDataOnDevice } from '@/lib/offline/keep-driver-data';

type Status = { online: boolean; waiting: number };

/**
 * The driver's connection in words and a shape (never colour alone): "Online" or "No signal",
 * and how many steps, photos or signatures wait on the phone to be sent. While online it also
 * asks the service worker to keep the units and their reviews for a dead spot.
 */
export function ConnectionStatus() {
  const [status, setStatus] = useState<Status | null>(null);

  useEffect(() => {
    let live = true;
    const read = () =>
      void deviceQueue.list().then((items) => {
        if (live) setStatus({ online: navigator.onLine, waiting: items.length });
      });
    const online = () => {
      read();
      void keepDriverDataOnDevice();
    };
    read();
    if (navigator.onLine) void keepDriverDataOnDevice();
    window.addEventListener('online', online);
    window.addEventListener('offline', read);
    window.addEventListener('rigcall-queue', read);
    const timer = window.setInterval(read, 3000);
    return () => {
      live = false;
      window.removeEventListener('online', online);
      window.removeEventListener('offline', read);
      window.removeEventListener('rigcall-queue', read);
      window.clearInterval(timer);
    };
  }, []);

  if (!status) return null;
  const { online, waiting } = status;
  return (
    <p
      role="status"
      data-testid="connection-status"
      data-online={online ? 'yes' : 'no'}
      className={`flex min-h-target items-center gap-2 rounded-lg border-slab px-3 text-lg font-bold ${
        online ? 'border-edge bg-panel text-ink' : 'border-edge bg-ink text-ground'
      }`}
    >
      <span aria-hidden="true">{online ? '●' : '○'}</span>
      <span>{online ? 'Online' : 'No signal'}</span>
      {waiting > 0 && (
        <span data-testid="outbox-waiting" className="font-normal">
          · {waiting} waiting to send
        </span>
      )}
    </p>
  );
}
