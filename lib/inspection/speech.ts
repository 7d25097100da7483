'use client';
// Speech in and out, as a progressive enhancement: where the browser has no recognition, or the
// driver refuses the microphone, the walk works by tapping and typing.

export type MicState = 'unavailable' | 'off' | 'starting' | 'listening' | 'denied' | 'offline' | 'error';

type RecognitionResultList = ArrayLike<ArrayLike<{ transcript: string; confidence: number }> & { isFinal: boolean }>;
type RecognitionEvent = { resultIndex: number; results: RecognitionResultList };
type Recognition = {
  lang: string;
  continuous: boolean;
  interimResults: boolean;
  maxAlternatives: number;
  processLocally?: boolean;
  phrases?: unknown[];
  onresult: ((e: RecognitionEvent) => void) | null;
  onerror: ((e: { error: string }) => void) | null;
  onend: (() => void) | null;
  onstart: (() => void) | null;
  start: () => void;
  stop: () => void;
  abort: () => void;
};
type RecognitionCtor = new () => Recognition;

function recognitionCtor(): RecognitionCtor | null {
  if (typeof window === 'undefined') return null;
  const w = window as unknown as { SpeechRecognition?: RecognitionCtor; webkitSpeechRecognition?: RecognitionCtor };
  return w.SpeechRecognition ?? w.webkitSpeechRecognition ?? null;
}

export const hasSpeechRecognition = () => recognitionCtor() !== null;

export type Listener = {
  /** Start listening and keep listening (restarts after silence) until stop(). */
  start: () => void;
  stop: () => void;
  /** The zone's words, to bias recognition where the browser supports it. */
  setPhrases: (phrases: string[]) => void;
  readonly wantsToListen: boolean;
};

/**
 * Continuous listening that survives the browser's habit of ending after a few seconds of
 * silence: a "wants to listen" flag, a restart on every end, re-checked after any delay.
 */
export function createListener(opts: {
  lang?: string;
  onInterim: (text: string) => void;
  onFinal: (alternatives: string[]) => void;
  onState: (state: MicState, detail?: string) => void;
}): Listener {
  const Ctor = recognitionCtor();
  let wants = false;
  let rec: Recognition | null = null;
  let phrases: string[] = [];
  let failures = 0;
  let restartTimer: number | undefined;

  const build = (): Recognition | null => {
    if (!Ctor) return null;
    const r = new Ctor();
    r.lang = opts.lang ?? 'en-US';
    r.continuous = true;
    r.interimResults = true;
    r.maxAlternatives = 5;
    try {
      const PhraseCtor = (window as unknown as { SpeechRecognitionPhrase?: new (p: string, boost: number) => unknown })
        .SpeechRecognitionPhrase;
      if (PhraseCtor && 'phrases' in r) r.phrases = phrases.slice(0, 200).map((p) => new PhraseCtor(p, 3));
    } catch {
      /* phrase biasing is optional */
    }
    r.onstart = () => {
      failures = 0;
      opts.onState('listening');
    };
    r.onresult = (e) => {
      for (let i = e.resultIndex; i < e.results.length; i++) {
        const res = e.results[i]!;
        const alts: string[] = [];
        for (let j = 0; j < res.length; j++) alts.push(res[j]!.transcript);
        if (res.isFinal) {
          opts.onInterim('');
          opts.onFinal(alts.filter((a) => a.trim()));
        } else opts.onInterim(alts[0] ?? '');
      }
    };
    r.onerror = (e) => {
      if (e.error === 'not-allowed' || e.error === 'service-not-allowed') {
        wants = false;
        opts.onState('denied', 'The microphone is blocked. Tap and type instead, or allow it in the browser settings.');
      } else if (e.error === 'network') {
        opts.onState('offline', 'Voice needs a connection on this phone. Tap and type until it is back.');
      } else if (e.error !== 'no-speech' && e.error !== 'aborted') {
        failures++;
        opts.onState('error', `Voice stopped (${e.error}). Trying again…`);
      }
    };
    r.onend = () => {
      rec = null;
      if (!wants) {
        opts.onState('off');
        return;
      }
      const delay = Math.min(5000, 250 * 2 ** failures);
      window.clearTimeout(restartTimer);
      restartTimer = window.setTimeout(() => {
        if (wants) begin();
      }, delay);
    };
    return r;
  };

  const begin = () => {
    if (rec) return;
    rec = build();
    if (!rec) {
      opts.onState('unavailable', 'This browser has no speech recognition. Tap and type; everything works the same.');
      wants = false;
      return;
    }
    opts.onState('starting');
    try {
      rec.start();
    } catch {
      rec = null;
      failures++;
    }
  };

  return {
    start: () => {
      wants = true;
      begin();
    },
    stop: () => {
      wants = false;
      window.clearTimeout(restartTimer);
      try {
        rec?.stop();
      } catch {
        /* already stopped */
      }
    },
    setPhrases: (p) => {
      phrases = p;
    },
    get wantsToListen() {
      return wants;
    },
  };
}

/** Say a short prompt. Returns at once; a muted or voiceless browser simply says nothing. */
export function speak(text: string, opts: { muted: boolean }): void {
  if (opts.muted || typeof window === 'undefined' || !('speechSynthesis' in window)) return;
  try {
    window.speechSynthesis.cancel();
    const u = new SpeechSynthesisUtterance(text.slice(0, 200));
    u.rate = 1.05;
    window.speechSynthesis.speak(u);
  } catch {
    /* no voices */
  }
}
