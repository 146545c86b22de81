'use client';

import { startTransition, useEffect, useRef, useState } from 'react';

/**
 * Renders its children once its box comes near the screen (IntersectionObserver, 300 px ahead), so a
 * chart below the fold costs a phone nothing (no charting library fetched, no drawing) until the
 * reader scrolls towards it. The box (its attributes passed on) keeps its size meanwhile: nothing moves.
 * The drawing is rendered as a transition: React then renders it in slices of a few milliseconds, so a chart
 * that comes into view as the page loads does not hold the phone's main thread for the whole drawing (an
 * ordinary update is rendered in one piece; a chart's was the longest task of the parity report).
 */
export function WhenVisible({ children, ...box }: React.ComponentProps<'div'>) {
  const ref = useRef<HTMLDivElement>(null);
  const [isNear, setNear] = useState(false);
  useEffect(() => {
    const el = ref.current;
    if (!el || isNear) return;
    const seen = new IntersectionObserver(
      (entries) => {
        if (entries.some((e) => e.isIntersecting)) startTransition(() => setNear(true));
      },
      { rootMargin: '300px 0px' },
    );
    seen.observe(el);
    return () => seen.disconnect();
  }, [isNear]);
  return (
    <div {...box} ref={ref}>
      {isNear ? children : null}
    </div>
  );
}
