import { useLayoutEffect, useRef, useState } from 'react';

/** The rendered width of an element, kept current as the window resizes (charts size themselves from it). */
export function useElementWidth<T extends HTMLElement>(fallback = 1000) {
  const ref = useRef<T>(null);
  const [width, setWidth] = useState(fallback);
  useLayoutEffect(() => {
    const el = ref.current;
    if (!el) return;
    setWidth(el.clientWidth || fallback);
    const observer = new ResizeObserver((entries) => {
      const w = entries[0]?.contentRect.width;
      if (w) setWidth(Math.round(w));
    });
    observer.observe(el);
    return () => observer.disconnect();
  }, [fallback]);
  return { ref, width };
}
