'use client';

// Fetches every set-up's thrust curve and every pair's crossover from the public API while the
// person types (debounced, the stale request aborted). The last good results stay on screen
// while new ones load, so the chart never blanks between keystrokes.

import { useEffect, useMemo, useState } from 'react';
import type { CrossoverData, JetPerformanceData } from '@/lib/core/engine/calculation-api';
import {
  CURVE_SPEEDS_MS,
  findCurveCrossingMs,
  hasSameModel,
  toFieldErrors,
  toModelBody,
  toNozzleDiameterMm,
} from './setup-model';
import type { FieldErrors, ModelBody, SetupDraft } from './setup-model';
import { requestJson } from '@/components/forms/request-json';

const DEBOUNCE_MS = 300;

export type CurveResult =
  { ok: true; data: JetPerformanceData } | { ok: false; fieldErrors: FieldErrors; message: string };

export interface PairCrossover {
  aId: string;
  bId: string;
  speedMs: number | null;
  /** false: read from the sampled curves (0–35 m/s), because the set-ups differ in more than the nozzle. */
  isFromApi: boolean;
}

export interface JetResults {
  curves: Record<string, CurveResult>;
  crossovers: PairCrossover[];
}

interface SetupRequest {
  id: string;
  model: ModelBody;
  nozzleDiameterMm: number | undefined;
}

class ServiceProblem extends Error {}

type ApiAnswer<T> = { ok: true; data: T } | { ok: false; fieldErrors: Record<string, string>; message: string };

/** One POST; a 400 comes back as the API's field errors, anything else unexpected is a ServiceProblem. */
async function postJson<T>(url: string, body: unknown, signal: AbortSignal): Promise<ApiAnswer<T>> {
  const answer = await requestJson<T>(url, {
    body,
    signal,
    fallbackMessage: (status) => (status === 400 ? 'Bad input.' : `The calculation service answered ${status}.`),
  });
  if (answer.ok) return { ok: true, data: answer.data };
  // No answer at all: not a ServiceProblem, so the screen says the connection is gone.
  if (answer.status === 0) throw new Error(answer.message);
  if (answer.status === 400) return { ok: false, fieldErrors: answer.fieldErrors, message: answer.message };
  if (answer.status === 429) {
    throw new ServiceProblem(
      `Too many calculations from this connection; the figures update again in ${answer.headers?.get('Retry-After') ?? 'a few'} s.`,
    );
  }
  throw new ServiceProblem(answer.message);
}

type Post = <T>(url: string, body: unknown, signal: AbortSignal) => Promise<ApiAnswer<T>>;

/**
 * Answers are pure functions of the body, so they are remembered: editing one set-up refetches
 * only its curve and its pairs. That keeps a venue full of phones behind one address well inside
 * the per-client rate limit.
 */
function createCachedPost(cache: Map<string, ApiAnswer<unknown>>): Post {
  return async <T>(url: string, body: unknown, signal: AbortSignal) => {
    const key = `${url} ${JSON.stringify(body)}`;
    const hit = cache.get(key);
    if (hit) return hit as ApiAnswer<T>;
    const answer = await postJson<T>(url, body, signal);
    if (cache.size >= 200) cache.clear();
    cache.set(key, answer);
    return answer;
  };
}

async function fetchResults(requests: SetupRequest[], post: Post, signal: AbortSignal): Promise<JetResults> {
  const answers = await Promise.all(
    requests.map((r) =>
      post<JetPerformanceData>(
        '/api/v1/jet-performance',
        { ...r.model, nozzleDiameterMm: r.nozzleDiameterMm, speedsMs: CURVE_SPEEDS_MS },
        signal,
      ),
    ),
  );
  const curves: Record<string, CurveResult> = {};
  requests.forEach((r, i) => {
    const a = answers[i];
    curves[r.id] = a.ok ? a : { ok: false, fieldErrors: toFieldErrors(a.fieldErrors), message: a.message };
  });

  const pairs: Promise<PairCrossover>[] = [];
  for (let i = 0; i < requests.length; i++) {
    for (let j = i + 1; j < requests.length; j++) {
      const a = requests[i];
      const b = requests[j];
      const curveA = curves[a.id];
      const curveB = curves[b.id];
      if (!curveA.ok || !curveB.ok) continue;
      if (hasSameModel(a.model, b.model)) {
        const body = { ...a.model, nozzleDiametersMm: [a.nozzleDiameterMm, b.nozzleDiameterMm] };
        pairs.push(
          post<CrossoverData>('/api/v1/jet-performance/crossover', body, signal).then((c) => {
            if (!c.ok) throw new ServiceProblem(c.message);
            return { aId: a.id, bId: b.id, speedMs: c.data.crossoverSpeedMs, isFromApi: true };
          }),
        );
      } else {
        const speedMs = findCurveCrossingMs(curveA.data.points, curveB.data.points);
        pairs.push(Promise.resolve({ aId: a.id, bId: b.id, speedMs, isFromApi: false }));
      }
    }
  }
  return { curves, crossovers: await Promise.all(pairs) };
}

export function useJetResults(setups: readonly SetupDraft[]) {
  // Labels are not part of a request: renaming a set-up does not refetch.
  const requestKey = useMemo(
    () =>
      JSON.stringify(
        setups.map((s): SetupRequest => ({ id: s.id, model: toModelBody(s), nozzleDiameterMm: toNozzleDiameterMm(s) })),
      ),
    [setups],
  );
  const [results, setResults] = useState<JetResults>();
  // Updating until the answer for the current request has settled (derived, not set in the effect).
  const [settledKey, setSettledKey] = useState<string>();
  const isUpdating = settledKey !== requestKey;
  const [problem, setProblem] = useState<string>();
  const [post] = useState(() => createCachedPost(new Map()));

  useEffect(() => {
    const controller = new AbortController();
    const timer = setTimeout(() => {
      fetchResults(JSON.parse(requestKey) as SetupRequest[], post, controller.signal)
        .then((r) => {
          // Superseded while it settled: the newer request's answer is the one to show.
          if (controller.signal.aborted) return;
          setResults(r);
          setProblem(undefined);
        })
        .catch((err: unknown) => {
          if (controller.signal.aborted) return;
          setProblem(
            err instanceof ServiceProblem
              ? err.message
              : 'No connection to the calculation service: the figures shown are from the last answer.',
          );
        })
        .finally(() => {
          if (!controller.signal.aborted) setSettledKey(requestKey);
        });
    }, DEBOUNCE_MS);
    return () => {
      clearTimeout(timer);
      controller.abort();
    };
  }, [requestKey, post]);

  return { results, isUpdating, problem };
}
