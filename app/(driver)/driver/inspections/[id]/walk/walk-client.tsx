'use client';
// The walk screen: a view over lib/walk. Every tap and every utterance becomes a WalkOutcome
// from the walk core (steps to record, what to say back, where to go), and this screen carries it
// out: the steps into the device outbox, the words spoken and shown.

import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { useStore } from 'zustand';
import { Button } from '@/components/ui/button';
import { panelClass } from '@/components/ui/panel';
import { enqueueRequest } from '@/lib/inspection/device-queue';
import type { StepAnswer } from '@/lib/inspection/flush-queue';
import { createListener, hasSpeechRecognition, speak, type Listener, type MicState } from '@/lib/inspection/speech';
import { createWalkStore, type WalkStep } from '@/lib/inspection/store';
import { useFlushQueue } from '@/lib/inspection/use-flush-queue';
import { cautionFooter, zoneCautions } from '@/lib/inspection/zone-cautions';
import { createMatcher } from '@/lib/matcher';
import type { Grammar, MeasureKind, ZoneItem } from '@/lib/schemas/grammar';
import {
  applyUtterance,
  blankStep,
  findFocusItem,
  isRequiredItem,
  listDefectSteps,
  listVisitedZones,
  mapItemAnswers,
  recordFinding,
  recordItemOk,
  recordNotChecked,
  recordReading,
  recordTakeBack,
  recordZoneOk,
  type CheckContext,
  type FindingInput,
  type InspectionKind,
  type WalkOutcome,
  type WalkZone,
} from '@/lib/walk';
import { enqueueStep } from './enqueue-step';
import { ChecklistRow, DefectPicker, NotCheckedPicker } from './walk-checklist';
import { QueueAlerts, TalkBar } from './walk-controls';
import { inputClass, PendingMatchPanel, SealCheckPanel, WalkStatusBar } from './walk-parts';
import { ReviewAndSign } from './walk-review';

type Props = {
  inspection: {
    id: string;
    kind: InspectionKind;
    status: 'draft' | 'submitted';
    startedAt: string;
    sealNumber: string | null;
    ruleProfile: string;
  };
  tractorNumber: string;
  trailerNumber: string | null;
  minimumMinutes: number;
  zones: WalkZone[];
  /** The readings this fleet requires on a pre-trip (a number, or not checked with a reason). */
  requiredReadings: MeasureKind[];
  context: CheckContext;
  serverSteps: WalkStep[];
  /** The grammar of the vocabulary version this inspection uses. */
  grammar: Grammar;
  driverName: string;
};

const profileKey = (p: string) => (p.startsWith('ca') ? 'ca' : 'us');

export function WalkClient(props: Props) {
  const { inspection, zones, context } = props;
  const [store] = useState(() => createWalkStore({ inspectionId: inspection.id, zones }));
  const [hydrated, setHydrated] = useState(false);
  const zoneIndex = useStore(store, (s) => s.zoneIndex);
  const steps = useStore(store, (s) => s.steps);
  const pending = useStore(store, (s) => s.pending);
  const phase = useStore(store, (s) => s.phase);
  const readback = useStore(store, (s) => s.readback);
  const photos = useStore(store, (s) => s.photos);
  const queue = useFlushQueue();
  const [interim, setInterim] = useState('');
  const [lastHeard, setLastHeard] = useState<string | null>(null);
  const [mic, setMic] = useState<{ state: MicState; detail?: string }>({ state: 'off' });
  const [muted, setMuted] = useState(false);
  const [typed, setTyped] = useState('');
  const [pickerFor, setPickerFor] = useState<{ item: ZoneItem; what: 'defect' | 'not_checked' } | null>(null);
  const [focusItem, setFocusItem] = useState<string | null>(null);
  const listener = useRef<Listener | null>(null);
  const photoInput = useRef<HTMLInputElement>(null);
  const zone = zones[zoneIndex]!;
  const matcher = useMemo(() => createMatcher(props.grammar), [props.grammar]);
  const vocabulary = props.grammar.vocabulary;
  // Words for taps and read-backs come from the same version the matcher uses.
  const conditionName = useMemo(() => new Map(vocabulary.conditions.map((c) => [c.id, c.name])), [vocabulary]);
  const componentById = useMemo(() => new Map(vocabulary.components.map((c) => [c.id, c])), [vocabulary]);
  const rules = useMemo(
    () => ({ kind: inspection.kind, requiredReadings: props.requiredReadings }),
    [inspection.kind, props.requiredReadings],
  );
  const isRequired = useCallback((item: ZoneItem) => isRequiredItem(item, rules), [rules]);

  const answers = useMemo(() => mapItemAnswers(zones, steps), [zones, steps]);
  const visited = useMemo(() => listVisitedZones(steps), [steps]);
  const say = useCallback((text: string) => speak(text, { muted }), [muted]);

  // ---- carrying out what the walk core decided
  const carryOut = useCallback(
    (out: WalkOutcome) => {
      const st = store.getState();
      for (const draft of out.record) void enqueueStep(inspection.id, st.record(draft));
      if (out.declinePending) st.declinePending();
      else if (out.pending !== undefined) st.holdForConfirmation(out.pending);
      const shown = out.show !== undefined ? out.show : out.say;
      if (shown) st.setReadback(shown);
      if (out.say) say(out.say);
      if (out.moveTo !== undefined) st.moveToZone(out.moveTo);
      if (out.action === 'photo') photoInput.current?.click();
      if (out.action === 'pause') listener.current?.stop();
      if (out.action === 'review') st.setPhase('reviewing');
    },
    [inspection.id, say, store],
  );
  const walkContext = useCallback(
    () => ({
      zones,
      zoneIndex: store.getState().zoneIndex,
      steps: store.getState().steps,
      pending: store.getState().pending,
      vocabulary,
      profile: inspection.ruleProfile,
      checkContext: context,
      isRequired,
    }),
    [zones, store, vocabulary, inspection.ruleProfile, context, isRequired],
  );
  const finding = useCallback(
    (f: FindingInput) => carryOut(recordFinding(walkContext(), zone.id, f)),
    [carryOut, walkContext, zone.id],
  );
  const markZoneGood = useCallback(
    () => carryOut(recordZoneOk(walkContext(), { inputMode: 'tap', heard: null })),
    [carryOut, walkContext],
  );
  const goTo = useCallback((index: number) => store.getState().moveToZone(index), [store]);

  useEffect(() => {
    const done = () => {
      store.getState().adoptServerSteps(props.serverSteps);
      if (inspection.status === 'submitted') store.getState().setPhase('signed');
      setHydrated(true);
    };
    const p = store.persist;
    if (p.hasHydrated()) done();
    return p.onFinishHydration(done);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);

  // The server's verdict on a reading is the one of record: show it when it differs.
  useEffect(() => {
    const onAnswer = (e: Event) => {
      const a = (e as CustomEvent<StepAnswer>).detail;
      store.getState().adoptServerVerdict(a.id, {
        verdict: a.verdict,
        severity: a.severity,
        limit: a.limitText,
        source: a.source,
      });
    };
    window.addEventListener('rigcall-step-answer', onAnswer);
    return () => window.removeEventListener('rigcall-step-answer', onAnswer);
  }, [store]);

  // Entering a zone: record the visit and say where we are.
  useEffect(() => {
    if (!hydrated || phase !== 'walking') return;
    const last = [...store.getState().steps].reverse().find((s) => s.kind === 'visit');
    if (last?.zone !== zone.id)
      void enqueueStep(
        inspection.id,
        store.getState().record({ ...blankStep(zone.id), kind: 'visit', inputMode: 'tap' }),
      );
    say(`${zone.name}. ${zone.items.length} items.`);
    listener.current?.setPhrases(zone.items.map((i) => i.label));
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [hydrated, zone.id, phase]);

  // Back from the sign screen to an open item: bring it into view.
  useEffect(() => {
    if (!focusItem || phase !== 'walking') return;
    document.getElementById(`item-${focusItem}`)?.scrollIntoView({ block: 'center' });
    setFocusItem(null);
  }, [focusItem, phase, zone.id]);

  const handleHeard = useCallback(
    (alternatives: string[], inputMode: 'voice' | 'typed') => {
      const heard = alternatives[0] ?? '';
      if (!heard.trim()) return;
      setLastHeard(heard);
      const focus = findFocusItem(zone, answers);
      const result = matcher.matchAlternatives(alternatives, {
        zone: zone.id,
        component: focus?.component ?? null,
        measure: focus?.measure ?? null,
        profile: profileKey(inspection.ruleProfile),
      });
      carryOut(applyUtterance(walkContext(), result, { alternatives, inputMode }));
    },
    [answers, carryOut, inspection.ruleProfile, matcher, walkContext, zone],
  );

  // The recogniser calls back into the newest handler.
  const heardRef = useRef(handleHeard);
  heardRef.current = handleHeard;
  useEffect(() => {
    if (!hasSpeechRecognition()) {
      setMic({ state: 'unavailable', detail: 'No voice in this browser: tap and type, everything works the same.' });
      return;
    }
    listener.current = createListener({
      onInterim: setInterim,
      onFinal: (alts) => heardRef.current(alts, 'voice'),
      onState: (state, detail) => setMic({ state, detail }),
    });
    return () => listener.current?.stop();
  }, []);

  const toggleListen = () => {
    if (!listener.current) return;
    if (listener.current.wantsToListen) listener.current.stop();
    else {
      speak(' ', { muted }); // iOS starts speech only from a tap
      listener.current.start();
    }
  };

  const onPhoto = async (file: File) => {
    const id = crypto.randomUUID();
    const lastDefect = listDefectSteps(store.getState().steps).at(-1);
    const stepId = lastDefect?.id ?? null;
    await enqueueRequest({
      label: 'photo',
      url: `/api/inspections/${inspection.id}/photos/${id}${stepId ? `?stepId=${stepId}` : ''}`,
      method: 'PUT',
      blob: file,
    });
    store.getState().addPhoto({ id, stepId, zone: zone.id, takenAt: new Date().toISOString() });
    store.getState().setReadback(lastDefect ? `Photo added to: ${lastDefect.label}.` : 'Photo added.');
  };

  if (!hydrated) return <p className="p-6 text-xl">Opening the walk…</p>;
  if (phase !== 'walking')
    return (
      <ReviewAndSign
        store={store}
        queue={queue}
        inspection={inspection}
        zones={zones}
        requiredReadings={props.requiredReadings}
        minimumMinutes={props.minimumMinutes}
        tractorNumber={props.tractorNumber}
        trailerNumber={props.trailerNumber}
        driverName={props.driverName}
        onGoTo={(index, itemId) => {
          store.getState().setPhase('walking');
          goTo(index);
          setFocusItem(itemId);
        }}
      />
    );

  const itemsLeft = zone.items.filter((i) => !answers.has(i.id) && isRequired(i)).length;
  const lastReading = (itemId: string) =>
    [...steps].reverse().find((s) => s.kind === 'measurement' && s.item === itemId);
  const listening = mic.state === 'listening' || mic.state === 'starting';
  return (
    <div className="-mx-4 -my-6 pb-40">
      <WalkStatusBar
        zoneName={zone.name}
        zoneNumber={zoneIndex + 1}
        zoneCount={zones.length}
        startedAt={inspection.startedAt}
        minimumMinutes={props.minimumMinutes}
        queue={queue}
        itemsLeft={itemsLeft}
      >
        <section aria-live="polite" className={`mt-2 ${panelClass({ padding: 'none' })} px-3 py-2`}>
          <p className="text-base text-muted">
            {mic.state === 'listening'
              ? '● Listening'
              : mic.state === 'starting'
                ? '… Starting the microphone'
                : (mic.detail ?? 'Microphone off')}
          </p>
          <p className="text-xl font-bold" data-testid="heard">
            {interim || lastHeard || 'Say a finding, a reading, or “all good here”.'}
          </p>
          {readback && (
            <p className="text-lg" data-testid="readback">
              {readback}
            </p>
          )}
        </section>
      </WalkStatusBar>
      <div className="flex flex-col gap-4 px-3 pt-3">
        <QueueAlerts queue={queue} />
        {pending && (
          <PendingMatchPanel
            pending={pending}
            onYes={() =>
              finding({
                ...pending.top,
                resolution: 'confirmed',
                heard: pending.heard,
                alternatives: pending.alternatives,
                inputMode: pending.inputMode,
              })
            }
            onNo={() => store.getState().declinePending()}
            onPick={(termKey) =>
              finding({
                termKey,
                position: pending.top.position,
                score: pending.others.find((o) => o.termId === termKey)?.score ?? null,
                resolution: 'corrected',
                heard: pending.heard,
                alternatives: pending.alternatives,
                inputMode: pending.inputMode,
                itemId: zone.items.find((i) => i.component === termKey.split(':')[0] && !i.measure)?.id ?? null,
              })
            }
            onNone={() =>
              carryOut({
                record: [
                  {
                    ...blankStep(zone.id),
                    kind: 'note',
                    heard: pending.heard,
                    alternatives: pending.alternatives,
                    inputMode: pending.inputMode,
                    label: `not matched: ${pending.heard}`,
                  },
                ],
                pending: null,
                say: null,
                show: 'Not recorded as a defect. Tap the item and pick the defect instead.',
              })
            }
          />
        )}
        {pickerFor?.what === 'defect' && (
          <DefectPicker
            item={pickerFor.item}
            component={componentById.get(pickerFor.item.component)}
            conditionName={conditionName}
            onCancel={() => setPickerFor(null)}
            onPick={(termKey) => {
              setPickerFor(null);
              finding({
                termKey,
                position: null,
                score: null,
                resolution: null,
                heard: null,
                alternatives: [],
                inputMode: 'tap',
                itemId: pickerFor.item.id,
              });
            }}
          />
        )}
        {pickerFor?.what === 'not_checked' && (
          <NotCheckedPicker
            item={pickerFor.item}
            onCancel={() => setPickerFor(null)}
            onPick={(reason, note) => {
              setPickerFor(null);
              carryOut(recordNotChecked(zone.id, pickerFor.item, reason, note));
            }}
          />
        )}
        {(zoneCautions[zone.id] ?? []).length > 0 && (
          <aside aria-label="Safety" className={`${panelClass({ padding: 'sm' })} text-lg`}>
            {zoneCautions[zone.id]!.map((c) => (
              <p key={c.text}>
                <span aria-hidden="true">⚠ </span>
                {c.text}
              </p>
            ))}
            <p className="text-base text-muted">{cautionFooter}</p>
          </aside>
        )}
        {zone.id === 'rear' && inspection.sealNumber && (
          <SealCheckPanel
            expected={inspection.sealNumber}
            lastHeard={lastHeard?.toLowerCase().startsWith('seal') ? lastHeard.slice(4) : null}
          />
        )}
        <ol className="flex flex-col gap-3" aria-label="Checklist">
          {zone.items.map((item) => (
            <ChecklistRow
              key={item.id}
              item={item}
              answer={answers.get(item.id)}
              reading={lastReading(item.id)}
              required={isRequired(item)}
              onOk={() => carryOut(recordItemOk(zone.id, item, { inputMode: 'tap', heard: null }))}
              onDefect={() => setPickerFor({ item, what: 'defect' })}
              onNotChecked={() => setPickerFor({ item, what: 'not_checked' })}
              onReading={(v) =>
                carryOut(recordReading(walkContext(), zone.id, item, v, { inputMode: 'typed', heard: null }))
              }
            />
          ))}
        </ol>
        <form
          className="flex gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            handleHeard([typed], 'typed');
            setTyped('');
          }}
        >
          <input
            className={`${inputClass} min-w-0 flex-1`}
            value={typed}
            onChange={(e) => setTyped(e.target.value)}
            placeholder="Type a finding or a reading"
            aria-label="Type a finding or a reading"
          />
          <Button type="submit" size="touch">
            Send
          </Button>
        </form>
        <div className="grid grid-cols-2 gap-2">
          <Button onClick={() => goTo(zoneIndex - 1)} disabled={zoneIndex === 0}>
            ◀ Back
          </Button>
          <Button onClick={() => goTo(zoneIndex + 1)} disabled={zoneIndex === zones.length - 1}>
            Next ▶
          </Button>
          <Button onClick={() => photoInput.current?.click()}>Photo{photos.length ? ` (${photos.length})` : ''}</Button>
          <Button onClick={() => carryOut(recordTakeBack(store.getState().steps, 'tap'))}>Undo</Button>
          <Button onClick={() => setMuted((m) => !m)} aria-pressed={muted}>
            {muted ? 'Voice prompts off' : 'Voice prompts on'}
          </Button>
          <Button onClick={() => store.getState().setPhase('reviewing')}>Review &amp; sign</Button>
        </div>
        <input
          ref={photoInput}
          type="file"
          accept="image/*"
          capture="environment"
          className="sr-only"
          tabIndex={-1}
          aria-label="Photo of the defect"
          onChange={(e) => (e.target.files?.[0] ? void onPhoto(e.target.files[0]) : undefined, (e.target.value = ''))}
        />
        <p className="text-base text-muted">
          {visited.size} of {zones.length} zones visited · unit {props.tractorNumber}
          {props.trailerNumber ? ` + ${props.trailerNumber}` : ''}
        </p>
      </div>
      <TalkBar
        listening={listening}
        canListen={!!listener.current}
        mic={mic.state}
        onToggle={toggleListen}
        onHoldDown={() => listener.current?.start()}
        onHoldUp={() => listener.current?.stop()}
        onAllGood={markZoneGood}
      />
    </div>
  );
}
