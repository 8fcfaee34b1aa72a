import { useCallback, useEffect, useState } from 'react';

/** How far below (or above) the screen a placeholder counts as near: a quick scroll's worth. */
const MARGIN_PX = 400;

/**
 * [ref, near]: `near` turns true once the element is on screen or within about a screen's scroll of
 * it, and stays true. For heavy parts below the fold (charts): a phone that never scrolls to them
 * never downloads or draws them, and the form above takes typing first (issue 11). Where the browser
 * cannot tell (no IntersectionObserver), or the element is already in view when placed, it is near at once.
 */
export function useNearView<T extends Element>(): [(el: T | null) => void, boolean] {
  const [el, setEl] = useState<T | null>(null);
  const [near, setNear] = useState(false);
  const ref = useCallback((node: T | null) => setEl(node), []);
  useEffect(() => {
    if (near || !el) return;
    const rect = el.getBoundingClientRect();
    const height = typeof window === 'undefined' ? 0 : window.innerHeight;
    if (typeof IntersectionObserver === 'undefined' || (rect.top < height + MARGIN_PX && rect.bottom > -MARGIN_PX)) {
      setNear(true);
      return;
    }
    const observer = new IntersectionObserver(
      (entries) => {
        if (entries.some((e) => e.isIntersecting)) setNear(true);
      },
      { rootMargin: `${MARGIN_PX}px 0px` },
    );
    observer.observe(el);
    return () => observer.disconnect();
  }, [el, near]);
  return [ref, near];
}
