'use client';

import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import type { JoinStudyValue, ParticipantSessionValue } from '@/lib/schemas/participant-session';
import type { Contour } from '@/lib/shape/types';
import { ResponseQueue, type QueuedResponse, type ServerCount } from '@/lib/take/response-queue';
import { makeStimulusSource, type SessionEdition } from '@/lib/take/stimulus-contours';
import { ParticipantScreenCheck, type ScreenCheck } from './participant-screen-check';

type Trial = ParticipantSessionValue['trials'][number];
type Phase = 'closed' | 'consent' | 'screen' | 'recheck' | 'instructions' | 'running' | 'break' | 'finishing' | 'done' | 'withdrawn' | 'error';

const RATINGS = [1, 2, 3, 4, 5, 6, 7] as const;
/** How long practice feedback stays up. */
const FEEDBACK_MS = 700;

const nextFrame = () => new Promise<number>((r) => requestAnimationFrame(r));
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
/** A duration as a whole number of frames at the measured rate (at least one). */
const framesFor = (ms: number, hz: number) => Math.max(1, Math.round((ms * hz) / 1000));

function drawOutline(ctx: CanvasRenderingContext2D, c: Contour, cx: number, cy: number, pxPerUnit: number) {
  ctx.beginPath();
  for (let i = 0; i < c.x.length; i++) {
    const x = cx + c.x[i]! * pxPerUnit;
    const y = cy - c.y[i]! * pxPerUnit;
    if (i === 0) ctx.moveTo(x, y);
    else ctx.lineTo(x, y);
  }
  ctx.closePath();
  ctx.fill();
}

/** The participant session: consent → screen check → instructions → trials (practice, blocks, breaks) → debrief. */
export function ParticipantSession({ token, study }: { token: string; study: JoinStudyValue }) {
  const storageKey = `epicycle:session:${token}`;
  const [phase, setPhase] = useState<Phase>(study.isAccepting ? 'consent' : 'closed');
  const [session, setSession] = useState<ParticipantSessionValue | null>(null);
  const [screen, setScreen] = useState<ScreenCheck | null>(null);
  const [position, setPosition] = useState(0);
  const [count, setCount] = useState<ServerCount | null>(null);
  const [pending, setPending] = useState(0);
  const [netError, setNetError] = useState<string | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const [finishCode, setFinishCode] = useState<string | null>(null);
  const [prompt, setPrompt] = useState<'none' | 'categorise' | 'rate' | 'feedback-ok' | 'feedback-no'>('none');
  const canvasRef = useRef<HTMLCanvasElement>(null);
  const queueRef = useRef<ResponseQueue | null>(null);
  const answerRef = useRef<((key: string | number) => void) | null>(null);
  const flagsRef = useRef({ hidden: false, leftFull: false });
  const source = useMemo(() => makeStimulusSource(study.edition as unknown as SessionEdition), [study.edition]);
  const base = `/api/v1/join/${token}/sessions`;

  const openQueue = useCallback(
    (code: string) => {
      queueRef.current?.dispose();
      const q = new ResponseQueue(`${base}/${code}/responses`, `epicycle:queue:${code}`, (s) => {
        setPending(s.pending);
        if (s.count) setCount(s.count);
        setNetError(s.error);
      });
      queueRef.current = q;
      setPending(q.pending);
      void q.flush();
      return q;
    },
    [base],
  );

  // A reload: the stored session code resumes where the server (and the local outbox) left off.
  useEffect(() => {
    const code = localStorage.getItem(storageKey);
    if (!code) return;
    void (async () => {
      const res = await fetch(`${base}/${code}`);
      if (!res.ok) {
        localStorage.removeItem(storageKey);
        return;
      }
      const s = (await res.json()) as ParticipantSessionValue;
      const q = openQueue(code);
      const saved = localStorage.getItem(`${storageKey}:screen`);
      if (saved) setScreen(JSON.parse(saved) as ScreenCheck);
      setSession(s);
      setCount({ stored: s.stored, planned: s.planned });
      const done = new Set([...s.answered, ...q.pendingIndices()]);
      const next = s.trials.findIndex((t) => !done.has(t.index));
      setPosition(next === -1 ? s.trials.length : next);
      setFinishCode(s.finishCode);
      setPhase(s.finishCode ? 'done' : next === -1 ? 'finishing' : saved ? 'instructions' : 'recheck');
    })();
  }, [base, openQueue, storageKey]);

  useEffect(() => {
    const onOnline = () => void queueRef.current?.flush();
    const onVisibility = () => {
      if (document.hidden) flagsRef.current.hidden = true;
    };
    const onFull = () => {
      if (!document.fullscreenElement) flagsRef.current.leftFull = true;
    };
    window.addEventListener('online', onOnline);
    document.addEventListener('visibilitychange', onVisibility);
    document.addEventListener('fullscreenchange', onFull);
    return () => {
      window.removeEventListener('online', onOnline);
      document.removeEventListener('visibilitychange', onVisibility);
      document.removeEventListener('fullscreenchange', onFull);
    };
  }, []);

  const start = async (check: ScreenCheck) => {
    setScreen(check);
    const res = await fetch(base, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ screen: check }) });
    const body = (await res.json()) as ParticipantSessionValue & { detail?: string };
    if (!res.ok) {
      setMessage(body.detail ?? 'The session could not start.');
      setPhase('error');
      return;
    }
    localStorage.setItem(storageKey, body.sessionCode);
    localStorage.setItem(`${storageKey}:screen`, JSON.stringify(check));
    openQueue(body.sessionCode);
    setSession(body);
    setCount({ stored: 0, planned: body.planned });
    setPosition(0);
    setPhase('instructions');
  };

  // Pixels per degree of visual angle: the on-screen length of 1° at the viewing distance (mm) times px/mm.
  const pxPerDeg = screen ? 2 * screen.viewingDistanceCm * 10 * Math.tan(Math.PI / 360) * screen.pxPerMm : null;
  const refreshHz = screen?.refreshHz ?? 60;

  /** Runs one trial on the canvas and returns its answer; durations are whole frames. */
  const runTrial = useCallback(
    async (trial: Trial): Promise<QueuedResponse> => {
      const canvas = canvasRef.current!;
      const ctx = canvas.getContext('2d')!;
      const dpr = window.devicePixelRatio || 1;
      const w = canvas.clientWidth;
      const h = canvas.clientHeight;
      canvas.width = Math.round(w * dpr);
      canvas.height = Math.round(h * dpr);
      ctx.setTransform(dpr, 0, 0, dpr, 0, 0);
      if (pxPerDeg === null) throw new Error('the screen check comes first');
      const unit = (study.stimulusSizeDeg * pxPerDeg) / 2 / source.reach();
      const clear = () => {
        ctx.fillStyle = '#808080';
        ctx.fillRect(0, 0, w, h);
        ctx.fillStyle = '#111111';
      };
      const fixation = () => {
        clear();
        ctx.fillRect(w / 2 - 8, h / 2 - 1, 16, 2);
        ctx.fillRect(w / 2 - 1, h / 2 - 8, 2, 16);
      };
      const show = async (draw: () => void, ms: number) => {
        const frames = framesFor(ms, refreshHz);
        await nextFrame();
        draw();
        const onset = await nextFrame();
        for (let i = 1; i < frames; i++) await nextFrame();
        clear();
        const offset = await nextFrame();
        return { onset, offset };
      };
      const wait = async (ms: number) => {
        for (let i = 0; i < framesFor(ms, refreshHz); i++) await nextFrame();
      };
      const waitAnswer = (ms: number) =>
        new Promise<{ value: string | number | null; at: number }>((resolve) => {
          const timer = setTimeout(() => {
            answerRef.current = null;
            resolve({ value: null, at: performance.now() });
          }, ms);
          answerRef.current = (value) => {
            clearTimeout(timer);
            answerRef.current = null;
            resolve({ value, at: performance.now() });
          };
        });
      flagsRef.current = { hidden: document.hidden, leftFull: false };
      const offset = Math.min(w / 4, 6 * pxPerDeg);

      if (trial.task === 'categorisation') {
        const t = study.categorisation!.timing as { fixationMs: number; probeMs: number; blankMs: number; responseMs: number; itiMs: number };
        fixation();
        await wait(t.fixationMs);
        const probe = source.polar(trial.probe.rho, trial.probe.angleDeg);
        const times = await show(() => {
          clear();
          drawOutline(ctx, probe, w / 2, h / 2, unit);
        }, t.probeMs);
        await wait(t.blankMs);
        const extent = study.categorisation!.extent;
        const a = source.polar(extent, trial.directionDeg);
        const b = source.polar(extent, trial.directionDeg + 180);
        const [left, right] = trial.leftAnchor === 'A' ? [a, b] : [b, a];
        clear();
        drawOutline(ctx, left, w / 2 - offset, h / 2, unit);
        drawOutline(ctx, right, w / 2 + offset, h / 2, unit);
        const shownAt = await nextFrame();
        setPrompt('categorise');
        const answer = await waitAnswer(t.responseMs);
        setPrompt('none');
        clear();
        const key = answer.value === null ? null : String(answer.value);
        if (trial.isPractice && trial.correctKey) {
          setPrompt(key === trial.correctKey ? 'feedback-ok' : 'feedback-no');
          await sleep(FEEDBACK_MS);
          setPrompt('none');
        }
        await wait(t.itiMs);
        return { clientTrialId: crypto.randomUUID(), trialIndex: trial.index, responseKey: key, rating: null, rtMs: key === null ? null : answer.at - shownAt, achievedMs: times.offset - times.onset, onsetMs: times.onset, offsetMs: times.offset, wasTabHidden: flagsRef.current.hidden, leftFullScreen: flagsRef.current.leftFull };
      }
      const t = study.similarity!.timing as { fixationMs: number; stimulusMs: number; gapMs: number; responseMs: number; itiMs: number };
      fixation();
      await wait(t.fixationMs);
      const first = source.stored(trial.first);
      const second = source.stored(trial.second);
      let times: { onset: number; offset: number };
      if (study.similarity!.presentation === 'simultaneous') {
        times = await show(() => {
          clear();
          drawOutline(ctx, first, w / 2 - offset, h / 2, unit);
          drawOutline(ctx, second, w / 2 + offset, h / 2, unit);
        }, t.stimulusMs);
      } else {
        const one = await show(() => {
          clear();
          drawOutline(ctx, first, w / 2, h / 2, unit);
        }, t.stimulusMs);
        await wait(t.gapMs);
        const two = await show(() => {
          clear();
          drawOutline(ctx, second, w / 2, h / 2, unit);
        }, t.stimulusMs);
        times = { onset: one.onset, offset: two.offset };
      }
      const shownAt = performance.now();
      setPrompt('rate');
      const answer = await waitAnswer(t.responseMs);
      setPrompt('none');
      await wait(t.itiMs);
      const rating = answer.value === null ? null : Number(answer.value);
      return { clientTrialId: crypto.randomUUID(), trialIndex: trial.index, responseKey: null, rating, rtMs: rating === null ? null : answer.at - shownAt, achievedMs: times.offset - times.onset, onsetMs: times.onset, offsetMs: times.offset, wasTabHidden: flagsRef.current.hidden, leftFullScreen: flagsRef.current.leftFull };
    },
    [pxPerDeg, refreshHz, source, study],
  );

  // The trial loop: one trial per position; a new block (after the first) stops at a break screen.
  useEffect(() => {
    if (phase !== 'running' || !session) return;
    let isCancelled = false;
    void (async () => {
      const trial = session.trials[position];
      if (!trial) {
        setPhase('finishing');
        return;
      }
      const result = await runTrial(trial);
      if (isCancelled) return;
      queueRef.current!.add(result);
      const next = session.trials[position + 1];
      setPosition(position + 1);
      if (next && next.block !== trial.block) setPhase('break');
    })();
    return () => {
      isCancelled = true;
    };
  }, [phase, position, session, runTrial]);

  // Finishing: wait until the outbox is empty and the server holds every trial, then ask for the finish code.
  useEffect(() => {
    if (phase !== 'finishing' || !session) return;
    if (pending > 0) return;
    let isCancelled = false;
    void (async () => {
      const res = await fetch(`${base}/${session.sessionCode}/finish`, { method: 'POST' });
      const body = (await res.json()) as { finishCode?: string; stored?: number; planned?: number; detail?: string };
      if (isCancelled) return;
      if (res.ok && body.finishCode) {
        setFinishCode(body.finishCode);
        setPhase('done');
        return;
      }
      // Some answers are missing on the server: take those trials again.
      const again = await fetch(`${base}/${session.sessionCode}`);
      if (again.ok) {
        const s = (await again.json()) as ParticipantSessionValue;
        setCount({ stored: s.stored, planned: s.planned });
        const missing = s.trials.findIndex((t) => !s.answered.includes(t.index));
        if (missing >= 0) {
          setPosition(missing);
          setPhase('running');
          return;
        }
      }
      setMessage(body.detail ?? 'The session could not be completed.');
      await sleep(3000);
      if (!isCancelled) setPhase('finishing');
    })();
    return () => {
      isCancelled = true;
    };
  }, [phase, pending, session, base]);

  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      const answer = answerRef.current;
      if (answer && session?.keys && (e.key.toLowerCase() === session.keys.left.toLowerCase() || e.key.toLowerCase() === session.keys.right.toLowerCase())) {
        e.preventDefault();
        answer(e.key.toLowerCase() === session.keys.left.toLowerCase() ? session.keys.left : session.keys.right);
      } else if (answer && prompt === 'rate' && /^[1-7]$/.test(e.key)) {
        answer(Number(e.key));
      } else if (phase === 'break' && e.key === ' ') {
        e.preventDefault();
        setPhase('running');
      }
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [session, prompt, phase]);

  const withdraw = async () => {
    const code = session?.sessionCode ?? localStorage.getItem(storageKey);
    if (!window.confirm('Withdraw from this study? Everything you answered will be deleted.')) return;
    if (code) {
      const res = await fetch('/api/v1/withdrawals', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ sessionCode: code }) });
      if (!res.ok && res.status !== 404) {
        setMessage('The withdrawal did not reach the server. Please try again, or send your session code to the lab.');
        return;
      }
      localStorage.removeItem(`epicycle:queue:${code}`);
    }
    queueRef.current?.dispose();
    localStorage.removeItem(storageKey);
    localStorage.removeItem(`${storageKey}:screen`);
    setPhase('withdrawn');
  };

  const keys = session?.keys;
  const blocks = session ? new Set(session.trials.filter((t) => !(t.task === 'categorisation' && t.isPractice)).map((t) => t.block)).size : 0;
  const currentBlock = session?.trials[position]?.block ?? 0;

  return (
    <main className="mx-auto max-w-3xl px-6 py-10">
      {phase !== 'withdrawn' && phase !== 'done' && phase !== 'closed' && (
        <div className="mb-6 flex items-center justify-between gap-4 text-sm">
          <p className="font-medium">{study.name}</p>
          <button type="button" onClick={() => void withdraw()} className="text-danger underline" data-testid="withdraw">
            Withdraw from the study
          </button>
        </div>
      )}

      {phase === 'closed' && (
        <section className="space-y-3">
          <h1 className="text-2xl font-semibold" data-testid="join-notice">This study is closed</h1>
          <p>It no longer takes new participants. Thank you for your interest.</p>
        </section>
      )}

      {phase === 'consent' && (
        <section className="space-y-5" aria-labelledby="consent-title">
          <h1 id="consent-title" className="text-2xl font-semibold">Consent</h1>
          <div className="whitespace-pre-line">{study.consentText}</div>
          <div className="border-l-4 border-caution bg-caution-soft p-4" role="note" data-testid="photosensitivity">
            <h2 className="font-semibold">Photosensitivity</h2>
            <p>This task shows shapes that appear and disappear quickly. If you have epilepsy or have ever had a seizure or other reaction to flashing or flickering images, do not take part. Stop at once if you feel unwell.</p>
          </div>
          <p className="text-sm text-graphite-soft">No name or e-mail is asked for. You can withdraw at any time, during the session or afterwards with your session code, and your answers are deleted.</p>
          <button type="button" onClick={() => setPhase('screen')} className="rounded bg-accent px-4 py-2 text-white" data-testid="consent-agree">
            I agree and want to take part
          </button>
        </section>
      )}

      {phase === 'screen' && <ParticipantScreenCheck onDone={(c) => void start(c)} />}
      {phase === 'recheck' && (
        <ParticipantScreenCheck
          onDone={(c) => {
            setScreen(c);
            localStorage.setItem(`${storageKey}:screen`, JSON.stringify(c));
            setPhase('instructions');
          }}
        />
      )}

      {phase === 'instructions' && session && (
        <section className="space-y-5" aria-labelledby="instructions-title">
          <h1 id="instructions-title" className="text-2xl font-semibold">Instructions</h1>
          <div className="whitespace-pre-line">{study.instructionsText}</div>
          {keys && (
            <p>
              After each shape, two shapes appear. Press <kbd className="font-mono">{keys.left.toUpperCase()}</kbd> if it looked more like the left one, <kbd className="font-mono">{keys.right.toUpperCase()}</kbd> if it looked more like the right one. On a touch screen, tap the side.
            </p>
          )}
          {study.similarity && <p>For each pair, rate how similar the two shapes are, from 1 ({study.similarity.scaleLow}) to 7 ({study.similarity.scaleHigh}), with the number keys or the buttons.</p>}
          {position > 0 && <p data-testid="resumed">Welcome back: you continue at trial {position + 1} of {session.trials.length}.</p>}
          <button type="button" onClick={() => setPhase('running')} className="rounded bg-accent px-4 py-2 text-white" data-testid="begin">
            {position > 0 ? 'Continue' : 'Begin'}
          </button>
        </section>
      )}

      {phase === 'break' && (
        <section className="space-y-4" aria-labelledby="break-title">
          <h1 id="break-title" className="text-2xl font-semibold">A short break</h1>
          <p>Block {Math.max(1, currentBlock)} of {blocks} is next. Rest your eyes, then press the space bar or the button to go on.</p>
          <button type="button" onClick={() => setPhase('running')} className="rounded bg-accent px-4 py-2 text-white" data-testid="continue">Continue</button>
        </section>
      )}

      <div className={phase === 'running' ? 'fixed inset-0 z-10 bg-[#808080]' : 'hidden'} data-testid="stage" data-position={position}>
        <canvas ref={canvasRef} className="h-full w-full" aria-label="Task display" />
        {prompt === 'categorise' && keys && (
          <div className="absolute inset-x-0 bottom-8 flex justify-between px-8">
            <button type="button" className="rounded bg-paper px-6 py-4" onClick={() => answerRef.current?.(keys.left)} data-testid="answer-left">Left ({keys.left.toUpperCase()})</button>
            <button type="button" className="rounded bg-paper px-6 py-4" onClick={() => answerRef.current?.(keys.right)} data-testid="answer-right">Right ({keys.right.toUpperCase()})</button>
          </div>
        )}
        {prompt === 'rate' && (
          <div className="absolute inset-x-0 bottom-8 flex justify-center gap-2" role="group" aria-label="Similarity rating">
            {RATINGS.map((r) => (
              <button key={r} type="button" className="h-12 w-12 rounded bg-paper font-mono" onClick={() => answerRef.current?.(r)} data-testid={`rate-${r}`}>{r}</button>
            ))}
          </div>
        )}
        {(prompt === 'feedback-ok' || prompt === 'feedback-no') && (
          <p className="absolute inset-x-0 top-1/3 text-center text-xl text-paper" role="status">{prompt === 'feedback-ok' ? 'Correct' : 'Not this time'}</p>
        )}
        {netError && <p className="absolute left-4 top-4 rounded bg-paper px-3 py-1 text-sm" role="status">{netError}</p>}
      </div>

      {phase === 'finishing' && (
        <section className="space-y-3" aria-live="polite">
          <h1 className="text-2xl font-semibold">Saving your answers</h1>
          <p data-testid="saving">The server holds {count?.stored ?? 0} of {count?.planned ?? session?.planned ?? 0} answers{pending > 0 ? `; ${pending} still to send` : ''}. Please keep this page open.</p>
          {netError && <p role="status">{netError}</p>}
          {message && <p role="status">{message}</p>}
        </section>
      )}

      {phase === 'done' && (
        <section className="space-y-5" aria-labelledby="done-title">
          <h1 id="done-title" className="text-2xl font-semibold">Thank you</h1>
          <div className="whitespace-pre-line">{study.debriefText}</div>
          <p>Your finish code: <strong className="font-mono text-xl" data-testid="finish-code">{finishCode}</strong></p>
          {session && (
            <p className="text-sm">
              Your session code: <span className="font-mono" data-testid="session-code">{session.sessionCode}</span>. Keep it if you may want to withdraw later, at{' '}
              <a href="/withdraw" className="text-accent underline">the withdrawal page</a>.
            </p>
          )}
          <button type="button" onClick={() => void withdraw()} className="text-danger underline" data-testid="withdraw">Withdraw my answers</button>
        </section>
      )}

      {phase === 'withdrawn' && (
        <section className="space-y-3" role="status">
          <h1 className="text-2xl font-semibold">You have withdrawn</h1>
          <p>Your answers have been deleted. Thank you for your time.</p>
        </section>
      )}

      {phase === 'error' && (
        <section className="space-y-3" role="alert">
          <h1 className="text-2xl font-semibold">The session could not start</h1>
          <p>{message}</p>
        </section>
      )}
    </main>
  );
}
