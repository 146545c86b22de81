'use client';

// A recharts ResponsiveContainer that starts at the size of the box it fills, when that size is known.
// ResponsiveContainer measures its box in an effect after its first render and only then draws the chart: that
// measurement is an ordinary React update, rendered in one piece, so a chart drawn as a page loads was one long
// task however it had been started (WhenVisible starts the drawing as a transition, in slices). WhenVisible
// measures its box when it comes near the screen (the IntersectionObserver entry's own rectangle, no extra layout)
// and passes it down here: the chart is drawn in the transition's first render, and the container's own
// measurement then finds the size it already has and changes nothing (recharts keeps its state when the rounded
// size is the same). Outside a WhenVisible, or when the box has changed size meanwhile, it measures as before.
// The box's border box is taken as the chart's size: a WhenVisible that holds a chart carries no padding or border.
import { useContext } from 'react';
import { ResponsiveContainer } from 'recharts';
import { MeasuredBox } from './measured-box';

export function FittedChart({ children }: { children: React.ComponentProps<typeof ResponsiveContainer>['children'] }) {
  const box = useContext(MeasuredBox);
  return (
    <ResponsiveContainer width="100%" height="100%" initialDimension={box}>
      {children}
    </ResponsiveContainer>
  );
}
