'use client';

import { startTransition, useEffect, useRef, useState } from 'react';
import { MeasuredBox, type BoxSize } from './measured-box';

/**
 * Renders its children once its box comes near the screen (IntersectionObserver, 300 px ahead), so a
 * chart below the fold costs a phone nothing (no charting library fetched, no drawing) until the
 * reader scrolls towards it. The box (its attributes passed on) keeps its size meanwhile: nothing moves.
 * The drawing is rendered as a transition: React then renders it in slices of a few milliseconds, so a chart
 * that comes into view as the page loads does not hold the phone's main thread for the whole drawing (an
 * ordinary update is rendered in one piece; a chart's was the longest task of the parity report). The box's size,
 * read from the observer's entry, goes to the drawing (MeasuredBox, FittedChart), so a chart is drawn in that
 * transition rather than after measuring itself in an ordinary update.
 */
export function WhenVisible({ children, ...box }: React.ComponentProps<'div'>) {
  const ref = useRef<HTMLDivElement>(null);
  const [near, setNear] = useState<{ size: BoxSize } | null>(null);
  const isNear = near !== null;
  useEffect(() => {
    const el = ref.current;
    if (!el || isNear) return;
    const seen = new IntersectionObserver(
      (entries) => {
        const entry = entries.find((e) => e.isIntersecting);
        if (!entry) return;
        const { width, height } = entry.boundingClientRect;
        startTransition(() => setNear({ size: { width: Math.round(width), height: Math.round(height) } }));
      },
      { rootMargin: '300px 0px' },
    );
    seen.observe(el);
    return () => seen.disconnect();
  }, [isNear]);
  return (
    <div {...box} ref={ref}>
      {near ? <MeasuredBox value={near.size}>{children}</MeasuredBox> : null}
    </div>
  );
}
