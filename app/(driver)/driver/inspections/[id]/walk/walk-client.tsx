'use client';

import Link from 'next/link';
import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { useStore } from 'zustand';
import { Button, buttonClass } from '@/components/ui/button';
import { panelClass } from '@/components/ui/panel';
import { SeverityMark } from '@/components/ui/severity-mark';
import { buildCheckInput, measureUnit, type CheckContext } from '@/lib/inspection/build-check';
import { deviceQueue, dropFailedRequest, enqueueRequest } from '@/lib/inspection/device-queue';
import { planResend } from '@/lib/inspection/resend-missing';
import { decideFromMatch, findFocusItem, readBackFinding } from '@/lib/inspection/interpret';
import { createListener, hasSpeechRecognition, speak, type Listener, type MicState } from '@/lib/inspection/speech';
import { createWalkStore, toStepBody, type WalkStep } from '@/lib/inspection/store';
import { useFlushQueue } from '@/lib/inspection/use-flush-queue';
import { findUndoableStep, listDefectSteps, listVisitedZones, mapItemAnswers } from '@/lib/inspection/walk-progress';
import { cautionFooter, zoneCautions } from '@/lib/inspection/zone-cautions';
import { createMatcher, type WalkZone } from '@/lib/matcher';
import { checkInspectionDuration, evaluateMeasurement } from '@/lib/rules';
import type { Grammar, Vocabulary, ZoneItem } from '@/lib/schemas/grammar';
import {
  AirTimer,
  AnswerMark,
  capitalize,
  formatReading,
  HoldToTalk,
  inputClass,
  PendingMatchPanel,
  ReadingResult,
  SealCheckPanel,
  SignaturePad,
  WalkStatusBar,
} from './walk-parts';

/** One step into the device outbox, on its way to the server. */
const enqueueStep = (inspectionId: string, step: WalkStep) =>
  enqueueRequest({
    label: step.label ?? step.kind,
    url: `/api/inspections/${inspectionId}/steps`,
    method: 'POST',
    json: toStepBody(step),
  });

type Props = {
  inspection: {
    id: string;
    kind: 'pre_trip' | 'post_trip';
    status: 'draft' | 'submitted';
    startedAt: string;
    sealNumber: string | null;
    ruleProfile: string;
  };
  tractorNumber: string;
  trailerNumber: string | null;
  minimumMinutes: number;
  zones: WalkZone[];
  context: CheckContext;
  serverSteps: WalkStep[];
  /** The grammar of the vocabulary version this inspection uses. */
  grammar: Grammar;
  driverName: string;
};

const profileKey = (p: string) => (p.startsWith('ca') ? 'ca' : 'us');
const certification =
  'I performed this inspection and the report lists every defect I found or that was reported to me.';

function namesOf(vocab: Vocabulary) {
  return {
    conditionName: new Map(vocab.conditions.map((c) => [c.id, c.name])),
    componentById: new Map(vocab.components.map((c) => [c.id, c])),
  };
}

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
  const [pickerFor, setPickerFor] = useState<ZoneItem | null>(null);
  const listener = useRef<Listener | null>(null);
  const photoInput = useRef<HTMLInputElement>(null);
  const zone = zones[zoneIndex]!;
  const matcher = useMemo(() => createMatcher(props.grammar), [props.grammar]);
  // Words for taps and read-backs come from the same version the matcher uses.
  const { conditionName, componentById } = useMemo(() => namesOf(props.grammar.vocabulary), [props.grammar]);

  const answers = useMemo(() => mapItemAnswers(zones, steps), [zones, steps]);
  const visited = useMemo(() => listVisitedZones(steps), [steps]);
  const say = useCallback((text: string) => speak(text, { muted }), [muted]);

  // ---- recording: every step goes to the device outbox at once, then to the server
  const record = useCallback(
    (s: Omit<WalkStep, 'id' | 'seq' | 'deviceAt'>) => {
      const step = store.getState().record(s);
      void enqueueStep(inspection.id, step);
      return step;
    },
    [store, inspection.id],
  );
  const base = (zoneId: string) => ({
    zone: zoneId,
    item: null,
    heard: null,
    alternatives: [],
    termKey: null,
    position: null,
    score: null,
    resolution: null,
    undoesStepId: null,
    reading: null,
  });

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

  // Entering a zone: record the visit and say where we are.
  useEffect(() => {
    if (!hydrated || phase !== 'walking') return;
    const last = [...store.getState().steps].reverse().find((s) => s.kind === 'visit');
    if (last?.zone !== zone.id) record({ ...base(zone.id), kind: 'visit', inputMode: 'tap' });
    say(`${zone.name}. ${zone.items.length} items.`);
    listener.current?.setPhrases(zone.items.map((i) => i.label));
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [hydrated, zone.id, phase]);

  // ---- what each kind of input does
  const logReading = useCallback(
    (item: ZoneItem, value: number, inputMode: WalkStep['inputMode'], heard: string | null) => {
      const input = buildCheckInput(item, { value }, context);
      const outcome = input ? evaluateMeasurement(input, { profile: inspection.ruleProfile }) : null;
      const judged = outcome && !('error' in outcome) ? outcome : null;
      if (outcome && 'error' in outcome) {
        store.getState().setReadback(`▲ ${outcome.error}`);
        return;
      }
      record({
        ...base(zone.id),
        item: item.id,
        kind: 'measurement',
        heard,
        inputMode,
        reading: { value },
        label: `${item.label}: ${formatReading(value, measureUnit[item.measure!])}`,
        verdict: judged?.verdict ?? null,
        severity: judged?.severity ?? null,
        limit: judged?.limit != null ? `${judged.limit} ${judged.unit}` : null,
        source: judged?.source ?? null,
        message: judged?.message ?? null,
      });
      const text = `${capitalize(item.label)}, ${formatReading(value, measureUnit[item.measure!])}. ${judged ? (judged.verdict === 'pass' ? 'Pass.' : judged.severity === 'major' ? 'Major defect.' : 'Minor defect.') : 'Recorded.'}`;
      store.getState().setReadback(text);
      say(text);
    },
    [context, inspection.ruleProfile, record, say, store, zone.id],
  );

  const logFinding = useCallback(
    (f: {
      termKey: string;
      position: string | null;
      score: number | null;
      resolution: WalkStep['resolution'];
      heard: string | null;
      alternatives: string[];
      inputMode: WalkStep['inputMode'];
      itemId: string | null;
    }) => {
      const [componentId, conditionId] = f.termKey.split(':');
      const component = componentById.get(componentId ?? '');
      const pair = component?.defects.find((d) => d.condition === conditionId);
      const severity = pair ? pair.severity[profileKey(inspection.ruleProfile)] : 'major';
      const words = {
        component: component?.name ?? componentId ?? '',
        condition: conditionName.get(conditionId ?? '') ?? conditionId ?? '',
        position: f.position,
        severity,
      };
      record({
        ...base(zone.id),
        item: f.itemId,
        kind: 'defect',
        termKey: f.termKey,
        position: f.position,
        score: f.score,
        resolution: f.resolution,
        heard: f.heard,
        alternatives: f.alternatives,
        inputMode: f.inputMode,
        label: `${words.component}, ${words.condition}`,
        severity,
      });
      const text = readBackFinding(words);
      store.getState().setReadback(text);
      say(text);
    },
    [inspection.ruleProfile, record, say, store, zone.id],
  );

  const markZoneGood = useCallback(
    (inputMode: WalkStep['inputMode'], heard: string | null) => {
      record({
        ...base(zone.id),
        kind: 'zone_ok',
        heard,
        inputMode,
        score: heard ? 1 : null,
        resolution: heard ? 'auto' : null,
        label: `${zone.name}: all good`,
      });
      store.getState().setReadback(`${zone.name}: all good.`);
      if (zoneIndex < zones.length - 1) store.getState().moveToZone(zoneIndex + 1);
      else say('Last zone done. Review and sign.');
    },
    [record, say, store, zone.id, zone.name, zoneIndex, zones.length],
  );

  const takeBack = useCallback(
    (inputMode: WalkStep['inputMode']) => {
      const target = findUndoableStep(store.getState().steps);
      if (!target) return store.getState().setReadback('Nothing to take back.');
      record({
        ...base(target.zone),
        kind: 'undo',
        undoesStepId: target.id,
        heard: inputMode === 'voice' ? 'undo' : null,
        inputMode,
        label: `took back: ${target.label ?? target.kind}`,
      });
      const text = `Took back: ${target.label ?? target.kind}.`;
      store.getState().setReadback(text);
      say(text);
    },
    [record, say, store],
  );

  const goTo = useCallback((index: number) => store.getState().moveToZone(index), [store]);

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
      const waiting = store.getState().pending;
      if (waiting && result.kind === 'command' && (result.command === 'yes' || result.command === 'no')) {
        if (result.command === 'yes') {
          store.getState().holdForConfirmation(null);
          logFinding({
            ...waiting.top,
            resolution: 'confirmed',
            heard: waiting.heard,
            alternatives: waiting.alternatives,
            inputMode: waiting.inputMode,
          });
        } else {
          store.getState().declinePending();
          say('Pick one, or say it again.');
        }
        return;
      }
      if (waiting) store.getState().holdForConfirmation(null);
      const d = decideFromMatch(result, zone, answers, props.grammar.vocabulary);
      switch (d.do) {
        case 'zone_ok':
          return markZoneGood(inputMode, heard);
        case 'item_ok': {
          const item = zone.items.find((i) => i.id === d.itemId)!;
          record({
            ...base(zone.id),
            item: d.itemId,
            kind: 'ok',
            heard,
            inputMode,
            score: result.score,
            resolution: 'auto',
            label: `${item.label}: OK`,
          });
          return store.getState().setReadback(`${item.label}: OK.`);
        }
        case 'reading':
          return logReading(
            zone.items.find((i) => i.id === d.itemId)!,
            d.value,
            inputMode,
            heard,
          );
        case 'no_reading_here':
          store.getState().setReadback(`No ${d.measure.replace(/_/g, ' ')} to read in this zone.`);
          return say('No reading of that kind here.');
        case 'finding':
          if (d.needsConfirmation) {
            store.getState().holdForConfirmation({
              heard,
              alternatives,
              inputMode,
              top: {
                termKey: d.termKey,
                component: d.component,
                condition: d.condition,
                position: d.position,
                severity: d.severity,
                score: d.score,
                itemId: d.itemId,
              },
              others: d.alternatives,
              declined: false,
            });
            return say(`Did you mean ${d.component}, ${d.condition}? Yes or no.`);
          }
          return logFinding({
            termKey: d.termKey,
            position: d.position,
            score: d.score,
            resolution: 'auto',
            heard,
            alternatives,
            inputMode,
            itemId: d.itemId,
          });
        case 'command':
          switch (d.command) {
            case 'next':
              return goTo(zoneIndex + 1);
            case 'previous':
              return goTo(zoneIndex - 1);
            case 'repeat':
              return say(`${zone.name}. ${zone.items.map((i) => i.label).join(', ')}.`);
            case 'undo':
              return takeBack(inputMode);
            case 'photo':
              return photoInput.current?.click();
            case 'pause':
              listener.current?.stop();
              return store.getState().setReadback('Paused. Tap Listen to go on.');
            case 'finish':
              return store.getState().setPhase('reviewing');
            default:
              return;
          }
        default:
          // Kept for the trainers: what the vocabulary did not catch.
          if (inputMode === 'voice')
            record({
              ...base(zone.id),
              kind: 'note',
              heard,
              alternatives,
              inputMode,
              label: `not understood: ${heard}`,
            });
          store.getState().setReadback(`Not understood: “${heard}”. Say it again or tap.`);
          return say('Not understood.');
      }
    },
    [
      answers,
      goTo,
      inspection.ruleProfile,
      logFinding,
      logReading,
      markZoneGood,
      matcher,
      record,
      say,
      store,
      takeBack,
      zone,
      zoneIndex,
    ],
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
  if (phase !== 'walking') return <ReviewAndSign {...props} store={store} queue={queue} />;

  const itemsLeft = zone.items.filter((i) => !answers.has(i.id)).length;
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
            {interim || lastHeard || 'Say a finding, a reading, or “all good”.'}
          </p>
          {readback && (
            <p className="text-lg" data-testid="readback">
              {readback}
            </p>
          )}
        </section>
      </WalkStatusBar>
      <div className="flex flex-col gap-4 px-3 pt-3">
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
        {pending && (
          <PendingMatchPanel
            pending={pending}
            onYes={() => {
              store.getState().holdForConfirmation(null);
              logFinding({
                ...pending.top,
                resolution: 'confirmed',
                heard: pending.heard,
                alternatives: pending.alternatives,
                inputMode: pending.inputMode,
              });
            }}
            onNo={() => store.getState().declinePending()}
            onPick={(termKey) => {
              store.getState().holdForConfirmation(null);
              const item = zone.items.find((i) => i.component === termKey.split(':')[0]);
              logFinding({
                termKey,
                position: pending.top.position,
                score: pending.others.find((o) => o.termId === termKey)?.score ?? null,
                resolution: 'corrected',
                heard: pending.heard,
                alternatives: pending.alternatives,
                inputMode: pending.inputMode,
                itemId: item?.id ?? null,
              });
            }}
            onNone={() => {
              store.getState().holdForConfirmation(null);
              record({
                ...base(zone.id),
                kind: 'note',
                heard: pending.heard,
                alternatives: pending.alternatives,
                inputMode: pending.inputMode,
                label: `not matched: ${pending.heard}`,
              });
              store.getState().setReadback('Not recorded as a defect. Tap the item and pick the defect instead.');
            }}
          />
        )}
        {pickerFor && (
          <section aria-label={`Defect on ${pickerFor.label}`} className={`space-y-2 ${panelClass({ padding: 'sm' })}`}>
            <p className="text-xl font-bold">What is wrong with the {pickerFor.label}?</p>
            <div className="grid grid-cols-2 gap-2">
              {(componentById.get(pickerFor.component)?.defects ?? []).map((d) => (
                <Button
                  key={d.condition}
                  onClick={() => {
                    setPickerFor(null);
                    logFinding({
                      termKey: `${pickerFor.component}:${d.condition}`,
                      position: null,
                      score: null,
                      resolution: null,
                      heard: null,
                      alternatives: [],
                      inputMode: 'tap',
                      itemId: pickerFor.id,
                    });
                  }}
                >
                  {conditionName.get(d.condition) ?? d.condition}
                </Button>
              ))}
            </div>
            <Button onClick={() => setPickerFor(null)}>Cancel</Button>
          </section>
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
              onOk={() =>
                record({ ...base(zone.id), item: item.id, kind: 'ok', inputMode: 'tap', label: `${item.label}: OK` })
              }
              onDefect={() => setPickerFor(item)}
              onReading={(v, mode) => logReading(item, v, mode, null)}
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
          <Button onClick={() => takeBack('tap')}>Undo</Button>
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
      <div className="fixed inset-x-0 bottom-0 z-10 grid grid-cols-2 gap-2 border-t-slab border-edge bg-ground p-2">
        <Button
          tone={listening ? 'plain' : 'primary'}
          onClick={toggleListen}
          disabled={!listener.current || mic.state === 'denied'}
          aria-pressed={listening}
        >
          {listening ? '■ Stop listening' : '● Listen'}
        </Button>
        {mic.state === 'unavailable' || mic.state === 'denied' ? (
          <Button tone="primary" onClick={() => markZoneGood('tap', null)}>
            All good ▶
          </Button>
        ) : (
          <HoldToTalk
            disabled={!listener.current}
            onDown={() => listener.current?.start()}
            onUp={() => listener.current?.stop()}
          />
        )}
        <div className="col-span-2">
          <Button tone="primary" onClick={() => markZoneGood('tap', null)}>
            All good here ▶ next zone
          </Button>
        </div>
      </div>
    </div>
  );
}

function ChecklistRow({
  item,
  answer,
  reading,
  onOk,
  onDefect,
  onReading,
}: {
  item: ZoneItem;
  answer: ReturnType<typeof mapItemAnswers> extends Map<string, infer A> ? A | undefined : never;
  reading: WalkStep | undefined;
  onOk: () => void;
  onDefect: () => void;
  onReading: (value: number, mode: 'typed') => void;
}) {
  const [value, setValue] = useState('');
  const measure = item.measure;
  return (
    <li className={`space-y-2 ${panelClass({ padding: 'sm' })}`} data-item={item.id}>
      <div className="flex flex-wrap items-center justify-between gap-2">
        <p className="text-xl font-bold">{capitalize(item.label)}</p>
        <AnswerMark answer={answer} />
      </div>
      {measure ? (
        <>
          {measure === 'air_leak' && <AirTimer mode="minute" />}
          {measure === 'air_buildup' && <AirTimer mode="stopwatch" onResult={(s) => onReading(s, 'typed')} />}
          <form
            className="flex gap-2"
            onSubmit={(e) => {
              e.preventDefault();
              const n = Number(value.replace(',', '.'));
              if (value.trim() && Number.isFinite(n)) onReading(n, 'typed');
              setValue('');
            }}
          >
            <input
              className={`${inputClass} min-w-0 flex-1`}
              inputMode="decimal"
              value={value}
              onChange={(e) => setValue(e.target.value)}
              aria-label={`${item.label} in ${measureUnit[measure]}`}
              placeholder={measureUnit[measure] === '32nds' ? 'e.g. 6 (/32 in)' : measureUnit[measure]}
            />
            <Button type="submit" tone="primary" size="touch">
              Record
            </Button>
          </form>
          <ReadingResult step={reading} />
        </>
      ) : (
        <div className="grid grid-cols-2 gap-2">
          <Button onClick={onOk} aria-label={`${item.label}: OK`}>
            ✓ OK
          </Button>
          <Button onClick={onDefect} aria-label={`${item.label}: defect`}>
            ▲ Defect
          </Button>
        </div>
      )}
    </li>
  );
}

function ReviewAndSign(
  props: Props & { store: ReturnType<typeof createWalkStore>; queue: ReturnType<typeof useFlushQueue> },
) {
  const { store, queue, inspection, zones } = props;
  const steps = useStore(store, (s) => s.steps);
  const phase = useStore(store, (s) => s.phase);
  const signedName = useStore(store, (s) => s.signedName);
  const [name, setName] = useState('');
  const [certified, setCertified] = useState(false);
  const [finishedAt] = useState(() => new Date().toISOString());
  const defects = listDefectSteps(steps);
  const answers = mapItemAnswers(zones, steps);
  const visited = listVisitedZones(steps);
  const unchecked = zones.flatMap((z) =>
    z.items.filter((i) => !answers.has(i.id)).map((i) => ({ zone: z.name, label: i.label })),
  );
  const duration = checkInspectionDuration(
    inspection.startedAt,
    phase === 'signed' ? finishedAt : new Date().toISOString(),
    { minimumPretripMinutes: props.minimumMinutes },
  );
  const majors = defects.filter((d) => d.severity !== 'minor');
  const [signedClickAt, setSignedClickAt] = useState<number | null>(null);
  // Locked on the server: known from the page, or the outbox emptied after the signature went in.
  const sent =
    inspection.status === 'submitted' ||
    (phase === 'signed' &&
      signedClickAt !== null &&
      (queue.lastSentAt ?? 0) >= signedClickAt &&
      queue.pending === 0 &&
      queue.failed.length === 0);

  const pad = useRef<HTMLCanvasElement | null>(null);
  const [inked, setInked] = useState(false);
  const finishUrl = `/api/inspections/${inspection.id}/finish`;
  const sign = async () => {
    setSignedClickAt(Date.now());
    const drawn = await new Promise<Blob | null>((resolve) =>
      pad.current ? pad.current.toBlob(resolve, 'image/png') : resolve(null),
    );
    // The drawn signature goes first; the outbox keeps the order, online or not.
    if (drawn)
      await enqueueRequest({
        label: 'drawn signature',
        url: `/api/inspections/${inspection.id}/signature`,
        method: 'PUT',
        blob: drawn,
      });
    // The signature names every step on this phone, so that the server cannot lock a report short of one.
    const stepIds = store.getState().steps.map((s) => s.id);
    await enqueueRequest({
      label: 'signature',
      url: finishUrl,
      method: 'POST',
      json: { signatureName: name, certify: true, finishedAt: new Date().toISOString(), stepIds },
    });
    store.getState().setPhase('signed', name);
  };

  // Signing refused because the server lacks steps: send them again from this phone, then sign again.
  const refusedKeys = queue.failed.map((f) => f.key).join(',');
  const resending = useRef(false);
  // Sent again as often as it helps, and the server still lacks steps: say so, not "sending again".
  const [stillMissing, setStillMissing] = useState(false);
  useEffect(() => {
    if (!refusedKeys || resending.current) return;
    resending.current = true;
    void (async () => {
      try {
        const outbox = await deviceQueue.list();
        const plan = planResend({ outbox, steps: store.getState().steps, finishUrl });
        setStillMissing(
          !plan && outbox.some((r) => r.url === finishUrl && r.state === 'failed' && !!r.errorFields?.stepIds),
        );
        if (!plan) return;
        await dropFailedRequest(plan.dropKey);
        for (const step of plan.steps) await enqueueStep(inspection.id, step);
        await enqueueRequest({
          label: 'signature',
          url: finishUrl,
          method: 'POST',
          json: plan.finishJson,
          resendRound: plan.round,
        });
      } finally {
        resending.current = false;
      }
    })();
  }, [refusedKeys, store, finishUrl, inspection.id]);

  return (
    <div className="flex flex-col gap-4 pb-10">
      <h1 className="text-3xl font-extrabold">{phase === 'signed' ? 'Signed' : 'Review and sign'}</h1>
      <div className="grid grid-cols-3 gap-2 text-center">
        <p className={panelClass({ padding: 'sm' })}>
          <span className="block text-3xl font-extrabold">{majors.length}</span> major
        </p>
        <p className={panelClass({ padding: 'sm' })}>
          <span className="block text-3xl font-extrabold">{defects.length - majors.length}</span> minor
        </p>
        <p className={panelClass({ padding: 'sm' })}>
          <span className="block text-3xl font-extrabold">{unchecked.length}</span> not checked
        </p>
      </div>
      <p className={`text-xl ${duration.short ? 'font-bold text-minor' : 'text-pass'}`}>
        {duration.short ? '△' : '✓'} {Math.round(duration.minutes)} min spent · fleet minimum {duration.minimumMinutes}{' '}
        min{duration.short ? ': shorter than the minimum' : ''}
      </p>
      <p className="text-lg">
        {visited.size} of {zones.length} zones visited.
      </p>
      {majors.length > 0 && (
        <p role="alert" className="rounded-lg bg-major p-3 text-xl font-extrabold text-on-major">
          ■ OUT OF SERVICE: a major defect keeps unit {props.tractorNumber}
          {props.trailerNumber ? ` / ${props.trailerNumber}` : ''} off the road until a mechanic certifies the repair.
        </p>
      )}
      <ul className="space-y-2" aria-label="Defects">
        {defects.map((d) => (
          <li key={d.id} className={`${panelClass({ padding: 'sm' })} text-lg`}>
            <SeverityMark severity={d.severity ?? 'major'} /> {d.label}
            {d.kind === 'measurement' && d.limit
              ? ` (limit ${formatReading(Number(d.limit.split(' ')[0]), d.limit.split(' ').slice(1).join(' '))})`
              : ''}
          </li>
        ))}
      </ul>
      {unchecked.length > 0 && (
        <details className={`${panelClass({ padding: 'sm' })} text-lg`}>
          <summary className="min-h-target cursor-pointer content-center font-bold">
            Items not checked ({unchecked.length})
          </summary>
          <ul className="list-disc pl-6">
            {unchecked.map((u) => (
              <li key={`${u.zone}-${u.label}`}>
                {u.zone}: {u.label}
              </li>
            ))}
          </ul>
        </details>
      )}
      {phase === 'signed' ? (
        <div className="space-y-3">
          <p className="text-xl">Signed by {signedName}.</p>
          <p role="status" data-testid="signed-status" className="text-xl font-bold">
            {sent
              ? '✓ Report locked on RigCall’s server.'
              : stillMissing
                ? '▲ Not locked: RigCall’s server still lacks steps from this phone. Keep this phone and tell the office.'
                : queue.failed.length
                  ? `▲ ${queue.failed[0]!.error}`
                  : `Saved on this phone; sending ${queue.pending}…`}
          </p>
          <Link href="/driver" className={buttonClass('primary')}>
            Done
          </Link>
        </div>
      ) : (
        <>
          <Button onClick={() => store.getState().setPhase('walking')}>◀ Back to the walk</Button>
          <label className="flex min-h-target items-center gap-3 rounded-lg border-slab border-edge bg-panel p-3 text-lg">
            <input
              type="checkbox"
              className="size-8 shrink-0"
              checked={certified}
              onChange={(e) => setCertified(e.target.checked)}
            />
            {certification}
          </label>
          <label className="flex flex-col gap-2 text-lg font-bold">
            Type your full name to sign
            <input
              className={inputClass}
              value={name}
              onChange={(e) => setName(e.target.value)}
              placeholder={props.driverName}
              autoComplete="name"
            />
          </label>
          <p className="text-lg font-bold">Sign with your finger</p>
          <SignaturePad canvasRef={pad} onInk={setInked} />
          <Button tone="primary" disabled={!certified || name.trim().length < 2 || !inked} onClick={() => void sign()}>
            Sign and lock the report
          </Button>
        </>
      )}
    </div>
  );
}
