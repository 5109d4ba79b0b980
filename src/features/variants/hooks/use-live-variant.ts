import { useEffect, useRef, useState } from 'react';
import type { VariantComputeInput } from '../../../../shared/compute/variant';
import type { BenchmarkAnswer, LiveAnswer, LiveRequest } from '../workers/live-protocol';

/** Quiet time after the last change before a computation starts (a drag sends many changes). */
const SETTLE_MS = 24;

export interface LiveState {
  answer: Extract<LiveAnswer, { ok: true }> | null;
  error: Extract<LiveAnswer, { ok: false }>['error'] | null;
  /** A computation is under way or waiting for the one under way to finish. */
  busy: boolean;
}

/**
 * Runs the variant's computation in a Web Worker as its inputs change. Changes are coalesced: while the worker is
 * busy only the newest inputs wait, and each answer that is no longer the newest is dropped, so dragging a slider
 * never queues stale work and the page keeps responding.
 */
export function useLiveVariant(input: VariantComputeInput | null, loadCaseIndex: number): LiveState {
  const workerRef = useRef<Worker | null>(null);
  const state = useRef({ nextId: 1, latestId: 0, inFlight: false, pending: null as LiveRequest | null, input: null as VariantComputeInput | null, loadCaseIndex: 0 });
  const [live, setLive] = useState<LiveState>({ answer: null, error: null, busy: false });

  useEffect(() => {
    const worker = new Worker(new URL('../workers/variant-live.worker.ts', import.meta.url), { type: 'module' });
    workerRef.current = worker;
    const s = state.current;
    // The reference workload (a 400-point curve and a 51 × 51 map) on the current inputs, for the benchmark figure:
    // `await window.stillspanBenchmark()` in the browser's console, or from the end-to-end suite.
    const benchmarks = new Map<number, (answer: BenchmarkAnswer) => void>();
    (globalThis as { stillspanBenchmark?: () => Promise<BenchmarkAnswer> }).stillspanBenchmark = () =>
      new Promise((resolve) => {
        if (!s.input) return resolve({ id: 0, benchmark: true, error: 'no inputs yet' });
        const id = s.nextId++;
        benchmarks.set(id, resolve);
        worker.postMessage({ id, input: s.input, loadCaseIndex: s.loadCaseIndex, benchmark: true } satisfies LiveRequest);
      });
    worker.onmessage = (event: MessageEvent<LiveAnswer | BenchmarkAnswer>) => {
      if ('benchmark' in event.data) {
        benchmarks.get(event.data.id)?.(event.data);
        benchmarks.delete(event.data.id);
        return;
      }
      s.inFlight = false;
      const answer = event.data;
      if (s.pending) {
        const next = s.pending;
        s.pending = null;
        s.inFlight = true;
        worker.postMessage(next);
      }
      if (answer.id !== s.latestId) return;
      if (answer.ok) {
        (globalThis as { __stillspanLastLiveMs?: number }).__stillspanLastLiveMs = answer.timing.totalMs;
        setLive({ answer, error: null, busy: false });
      } else {
        setLive((previous) => ({ answer: previous.answer, error: answer.error, busy: false }));
      }
    };
    return () => {
      worker.terminate();
      workerRef.current = null;
      delete (globalThis as { stillspanBenchmark?: unknown }).stillspanBenchmark;
      s.inFlight = false;
      s.pending = null;
    };
  }, []);

  const key = input ? JSON.stringify([input, loadCaseIndex]) : null;
  useEffect(() => {
    if (!key || !input) return;
    const s = state.current;
    const timer = setTimeout(() => {
      const worker = workerRef.current;
      if (!worker) return;
      const request: LiveRequest = { id: s.nextId++, input, loadCaseIndex };
      s.input = input;
      s.loadCaseIndex = loadCaseIndex;
      s.latestId = request.id;
      setLive((previous) => (previous.busy ? previous : { ...previous, busy: true }));
      if (s.inFlight) {
        s.pending = request;
      } else {
        s.inFlight = true;
        worker.postMessage(request);
      }
    }, SETTLE_MS);
    return () => clearTimeout(timer);
    // The key stands for the inputs' content: a new object with the same content starts no computation.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [key]);

  return live;
}
