'use client';

import { createContext } from 'react';

export type BoxSize = { width: number; height: number };

/**
 * The size of the box a drawing fills, measured by WhenVisible when the box came near the screen; undefined where
 * nobody measured it. Its own module, free of recharts, so WhenVisible stays in a page's first load without it.
 */
export const MeasuredBox = createContext<BoxSize | undefined>(undefined);
