import { useEffect, useRef, useState } from 'react';
import SignaturePad from 'signature_pad';

/**
 * A box to sign in with a finger, a stylus or a mouse (signature_pad). Full width, 200 px tall: room for
 * a finger on a 375 px phone. The drawing is kept when the box changes size (a phone turned); "Clear"
 * starts again. `onChange` gets the PNG data URL, or null while the box is empty.
 */
export function SignaturePadField({
  id,
  describedBy,
  onChange,
}: {
  id: string;
  describedBy?: string;
  onChange: (dataUrl: string | null) => void;
}) {
  const canvasRef = useRef<HTMLCanvasElement | null>(null);
  const padRef = useRef<SignaturePad | null>(null);
  const changeRef = useRef(onChange);
  changeRef.current = onChange;
  const [empty, setEmpty] = useState(true);

  useEffect(() => {
    const canvas = canvasRef.current;
    if (!canvas) return;
    const pad = new SignaturePad(canvas, { penColor: '#12343b', minWidth: 1.2, maxWidth: 3.2 });
    padRef.current = pad;
    const fit = () => {
      // At most 2× the CSS size: sharp enough to print, small enough to send (the server takes ≤ 150 kB).
      const ratio = Math.min(Math.max(window.devicePixelRatio || 1, 1), 2);
      const data = pad.toData();
      canvas.width = Math.round(canvas.offsetWidth * ratio);
      canvas.height = Math.round(canvas.offsetHeight * ratio);
      canvas.getContext('2d')?.scale(ratio, ratio);
      pad.clear();
      if (data.length > 0) pad.fromData(data);
    };
    fit();
    const ended = () => {
      const isEmpty = pad.isEmpty();
      setEmpty(isEmpty);
      changeRef.current(isEmpty ? null : pad.toDataURL('image/png'));
    };
    pad.addEventListener('endStroke', ended);
    const observer = new ResizeObserver(() => fit());
    observer.observe(canvas);
    return () => {
      observer.disconnect();
      pad.removeEventListener('endStroke', ended);
      pad.off();
      padRef.current = null;
    };
  }, []);

  const clear = () => {
    padRef.current?.clear();
    setEmpty(true);
    changeRef.current(null);
  };

  return (
    <div className="flex flex-col gap-2">
      <div className="relative rounded-md border-2 border-ink-300 bg-white">
        <canvas
          id={id}
          ref={canvasRef}
          aria-describedby={describedBy}
          aria-label="Signature box: draw your signature here"
          role="img"
          className="block h-[200px] w-full touch-none rounded-md"
        />
        <div
          aria-hidden="true"
          className="pointer-events-none absolute bottom-10 left-4 right-4 border-b border-ink-200"
        />
        {empty ? (
          <p aria-hidden="true" className="pointer-events-none absolute bottom-3 left-4 text-sm text-muted">
            Sign above the line
          </p>
        ) : null}
      </div>
      <div className="flex justify-end">
        <button
          type="button"
          onClick={clear}
          disabled={empty}
          className="min-h-touch rounded-md px-4 text-base font-semibold text-ink-800 underline disabled:text-muted disabled:no-underline"
        >
          Clear and sign again
        </button>
      </div>
    </div>
  );
}
