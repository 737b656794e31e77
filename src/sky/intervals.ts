// Sets of time intervals [startMs, endMs], sorted and disjoint (common practice).
export type Span = [number, number];

/** The intersection of two sorted disjoint interval lists. */
export function intersectSpans(a: Span[], b: Span[]): Span[] {
  const out: Span[] = [];
  let i = 0;
  let j = 0;
  while (i < a.length && j < b.length) {
    const start = Math.max(a[i]![0], b[j]![0]);
    const end = Math.min(a[i]![1], b[j]![1]);
    if (end > start) out.push([start, end]);
    if (a[i]![1] < b[j]![1]) i++;
    else j++;
  }
  return out;
}

/** `a` minus `b`, both sorted and disjoint. */
export function subtractSpans(a: Span[], b: Span[]): Span[] {
  const out: Span[] = [];
  for (const [start, end] of a) {
    let cursor = start;
    for (const [bs, be] of b) {
      if (be <= cursor || bs >= end) continue;
      if (bs > cursor) out.push([cursor, bs]);
      cursor = Math.max(cursor, be);
    }
    if (cursor < end) out.push([cursor, end]);
  }
  return out;
}

/**
 * Where f(t) >= 0 inside `span`: f sampled every `stepMs`, each sign change refined by bisection
 * to `toleranceMs`. A dip shorter than the step between two samples of the same sign is missed:
 * callers choose the step from how fast f can change.
 */
export function spansWhereNonNegative(f: (tMs: number) => number, span: Span, stepMs: number, toleranceMs: number): Span[] {
  const [start, end] = span;
  const n = Math.max(1, Math.ceil((end - start) / stepMs));
  const out: Span[] = [];
  let prevT = start;
  let prevOk = f(start) >= 0;
  let openAt: number | null = prevOk ? start : null;
  for (let k = 1; k <= n; k++) {
    const t = k === n ? end : start + ((end - start) * k) / n;
    const ok = f(t) >= 0;
    if (ok !== prevOk) {
      let lo = prevT;
      let hi = t;
      while (hi - lo > toleranceMs) {
        const mid = (lo + hi) / 2;
        if (f(mid) >= 0 === prevOk) lo = mid;
        else hi = mid;
      }
      const edge = (lo + hi) / 2;
      if (ok) openAt = edge;
      else {
        out.push([openAt!, edge]);
        openAt = null;
      }
    }
    prevT = t;
    prevOk = ok;
  }
  if (openAt !== null) out.push([openAt, end]);
  return out;
}
