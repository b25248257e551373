'use client';
import { useEffect, useState, type RefObject } from 'react';

/**
 * The content-box width of an element, in CSS pixels, kept current with a ResizeObserver; null until it has
 * been measured (the first render, and on the server).
 */
export function useElementWidth(ref: RefObject<HTMLElement | null>): number | null {
  const [width, setWidth] = useState<number | null>(null);
  useEffect(() => {
    const element = ref.current;
    if (!element) return;
    setWidth(element.clientWidth);
    const observer = new ResizeObserver(([entry]) => setWidth(entry.contentRect.width));
    observer.observe(element);
    return () => observer.disconnect();
  }, [ref]);
  return width;
}
