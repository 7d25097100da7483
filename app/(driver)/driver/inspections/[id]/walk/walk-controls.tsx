'use client';
// The walk's fixed controls and its connection alerts.
import { Button } from '@/components/ui/button';
import { panelClass } from '@/components/ui/panel';
import type { MicState } from '@/lib/inspection/speech';
import type { QueueStatus } from '@/lib/inspection/use-flush-queue';
import { HoldToTalk } from './walk-parts';

/** No connection, the server away, or entries it refused: said plainly, and the walk goes on. */
export function QueueAlerts({ queue }: { queue: QueueStatus }) {
  return (
    <>
      {(queue.offline || queue.serverAway) && (
        <p
          role="alert"
          className="rounded-lg border-slab border-edge bg-minor p-3 text-lg font-bold text-ground"
          data-testid="away-banner"
        >
          {queue.offline ? 'No connection.' : 'RigCall’s server is not answering.'} Keep going: everything is saved on
          this phone and will be sent.
        </p>
      )}
      {queue.failed.length > 0 && (
        <div role="alert" className={`${panelClass({ padding: 'sm', tone: 'major' })} text-lg`}>
          <p className="font-bold text-major">
            ▲ The server refused {queue.failed.length} entr{queue.failed.length > 1 ? 'ies' : 'y'}:
          </p>
          <ul className="list-disc pl-6">
            {queue.failed.map((f) => (
              <li key={f.key}>
                {f.label}: {f.error}
              </li>
            ))}
          </ul>
        </div>
      )}
    </>
  );
}

/** The bar at the bottom: listen, hold to talk (or a second "all good" without a microphone), all good here. */
export function TalkBar({
  listening,
  canListen,
  mic,
  onToggle,
  onHoldDown,
  onHoldUp,
  onAllGood,
}: {
  listening: boolean;
  canListen: boolean;
  mic: MicState;
  onToggle: () => void;
  onHoldDown: () => void;
  onHoldUp: () => void;
  onAllGood: () => void;
}) {
  return (
    <div className="fixed inset-x-0 bottom-0 z-10 grid grid-cols-2 gap-2 border-t-slab border-edge bg-ground p-2">
      <Button
        tone={listening ? 'plain' : 'primary'}
        onClick={onToggle}
        disabled={!canListen || mic === 'denied'}
        aria-pressed={listening}
      >
        {listening ? '■ Stop listening' : '● Listen'}
      </Button>
      {mic === 'unavailable' || mic === 'denied' ? (
        <Button tone="primary" onClick={onAllGood}>
          All good ▶
        </Button>
      ) : (
        <HoldToTalk disabled={!canListen} onDown={onHoldDown} onUp={onHoldUp} />
      )}
      <div className="col-span-2">
        <Button tone="primary" onClick={onAllGood}>
          All good here ▶ next zone
        </Button>
      </div>
    </div>
  );
}
