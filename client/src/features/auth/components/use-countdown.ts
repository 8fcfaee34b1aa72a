import { useEffect, useState } from 'react';

/** Seconds left until `until` (epoch ms), ticking once a second; 0 when passed or unset. */
export function useCountdown(until: number | null): number {
  const left = () => (until === null ? 0 : Math.max(0, Math.ceil((until - Date.now()) / 1000)));
  const [seconds, setSeconds] = useState(left);
  useEffect(() => {
    setSeconds(left());
    if (until === null) return;
    const timer = setInterval(() => {
      const s = left();
      setSeconds(s);
      if (s === 0) clearInterval(timer);
    }, 1000);
    return () => clearInterval(timer);
    // eslint-disable-next-line react-hooks/exhaustive-deps -- left() only reads `until`
  }, [until]);
  return seconds;
}
